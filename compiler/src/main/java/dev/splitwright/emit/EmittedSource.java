package dev.splitwright.emit;

import java.nio.charset.StandardCharsets;
import java.util.Objects;

/** One emitted Java file: its class's binary name, the layout used and the source text. */
public record EmittedSource(String qualifiedName, Layout layout, String source) {

  public EmittedSource {
    Objects.requireNonNull(qualifiedName, "qualifiedName");
    Objects.requireNonNull(layout, "layout");
    Objects.requireNonNull(source, "source");
  }

  /** Size of the file as written: UTF-8 bytes (the text is ASCII, so one byte a character). */
  public int sourceBytes() {
    return source.getBytes(StandardCharsets.UTF_8).length;
  }

  /** The simple class name. */
  public String simpleName() {
    int dot = qualifiedName.lastIndexOf('.');
    return dot < 0 ? qualifiedName : qualifiedName.substring(dot + 1);
  }

  /** The path of the file below a source root, e.g. {@code com/acme/Pump.java}. */
  public String relativePath() {
    return qualifiedName.replace('.', '/') + ".java";
  }
}
