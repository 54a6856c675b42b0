package dev.splitwright.data;

import java.util.Objects;
import java.util.Optional;

/**
 * Bad user input: a malformed or inconsistent file, or a bad option value. The one checked error
 * type for input problems. Its message is one line, {@code file:line:column: <what is wrong>
 * (column 'header'); <what to do>} for a file, or {@code option --name: <what is wrong>; <what to
 * do>} for an option, so the command line can print it as is, without a stack trace.
 */
public final class InputException extends Exception {
  private static final long serialVersionUID = 1L;

  /** Non-null exactly when the problem is in a file. */
  private final SourcePosition position;

  /** Non-null exactly when the problem is an option value. */
  private final String option;

  private final String problem;
  private final String remedy;

  /**
   * Creates an error in a file.
   *
   * @param position where the problem is
   * @param problem what is wrong, e.g. {@code 'abc' is not a number}
   * @param remedy what the user should do, e.g. {@code fix the cell}
   */
  public InputException(SourcePosition position, String problem, String remedy) {
    this(position, null, problem, remedy, null);
  }

  /** Creates an error in a file that an underlying exception revealed. */
  public InputException(SourcePosition position, String problem, String remedy, Throwable cause) {
    this(position, null, problem, remedy, Objects.requireNonNull(cause, "cause"));
  }

  /**
   * Creates an error in an option value.
   *
   * @param option the option's name without leading dashes, e.g. {@code target}
   * @param problem what is wrong
   * @param remedy what the user should do
   */
  public InputException(String option, String problem, String remedy) {
    this(null, Objects.requireNonNull(option, "option"), problem, remedy, null);
  }

  private InputException(
      SourcePosition position, String option, String problem, String remedy, Throwable cause) {
    super(render(position, option, problem, remedy), cause);
    if ((position == null) == (option == null)) {
      throw new IllegalArgumentException("exactly one of position and option must be given");
    }
    this.position = position;
    this.option = option;
    this.problem = problem;
    this.remedy = remedy;
  }

  private static String render(
      SourcePosition position, String option, String problem, String remedy) {
    requireText(problem, "problem");
    requireText(remedy, "remedy");
    StringBuilder out = new StringBuilder();
    if (position != null) {
      out.append(position.render()).append(": ").append(problem);
      position.optionalHeader().ifPresent(h -> out.append(" (column '").append(h).append("')"));
    } else if (option != null) {
      if (option.isBlank() || option.startsWith("-")) {
        throw new IllegalArgumentException("option name must be bare, e.g. 'target': " + option);
      }
      out.append("option --").append(option).append(": ").append(problem);
    }
    return oneLine(out.append("; ").append(remedy).toString());
  }

  private static void requireText(String text, String name) {
    Objects.requireNonNull(text, name);
    if (text.isBlank()) {
      throw new IllegalArgumentException(name + " must not be blank");
    }
  }

  /** Keeps the message on one line even if a quoted cell or header spans lines. */
  private static String oneLine(String text) {
    StringBuilder out = new StringBuilder(text.length());
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      switch (c) {
        case '\n' -> out.append("\\n");
        case '\r' -> out.append("\\r");
        case '\t' -> out.append("\\t");
        default -> out.append(Character.isISOControl(c) ? '?' : c);
      }
    }
    return out.toString();
  }

  /**
   * Quotes a user-supplied value for a message: {@code 'value'}, control characters escaped, at
   * most 40 characters of it shown.
   */
  public static String quote(String value) {
    String shown = value.length() > 40 ? value.substring(0, 37) + "..." : value;
    return "'" + oneLine(shown) + "'";
  }

  /** The place in a file, if this is an error in a file. */
  public Optional<SourcePosition> position() {
    return Optional.ofNullable(position);
  }

  /** The option's bare name, if this is an error in an option value. */
  public Optional<String> option() {
    return Optional.ofNullable(option);
  }

  /** What is wrong, without position or remedy. */
  public String problem() {
    return problem;
  }

  /** What the user should do about it. */
  public String remedy() {
    return remedy;
  }
}
