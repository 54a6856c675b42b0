package dev.splitwright.check;

import java.io.Serializable;
import java.util.Objects;
import javax.tools.Diagnostic;

/**
 * One message javac reported.
 *
 * @param kind error, warning or note
 * @param className binary name of the source the message is about, or {@code ""} when it concerns
 *     the whole compilation (e.g. "warnings found and -Werror specified")
 * @param line 1-based line, or 0 when javac gave no position
 * @param column 1-based column as javac counts it (tabs expanded to 8), or 0 when javac gave no
 *     position
 * @param message javac's text in the root locale
 */
public record CompileDiagnostic(
    Diagnostic.Kind kind, String className, long line, long column, String message)
    implements Serializable {

  private static final long serialVersionUID = 1L;

  public CompileDiagnostic {
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(className, "className");
    Objects.requireNonNull(message, "message");
    if (line < 0 || column < 0) {
      throw new IllegalArgumentException(
          "line and column must be >= 0, but they are " + line + " and " + column);
    }
  }

  /** Whether the message points at a place in a source. */
  public boolean hasPosition() {
    return !className.isEmpty() && line > 0;
  }

  /** Renders {@code demo/Pump.java:3:12: error: message} in javac's own layout. */
  public String headline() {
    String label = switch (kind) {
      case ERROR -> "error";
      case WARNING, MANDATORY_WARNING -> "warning";
      case NOTE -> "note";
      case OTHER -> "message";
    };
    if (className.isEmpty()) {
      return label + ": " + message;
    }
    String file = className.replace('.', '/') + ".java";
    String where = hasPosition() ? file + ":" + line + ":" + column : file;
    return where + ": " + label + ": " + message;
  }
}
