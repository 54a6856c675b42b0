package dev.splitwright.emit;

import dev.splitwright.text.DecimalText;
import java.util.Locale;

/** Turns user-supplied text and numbers into safe Java source text. */
final class JavaText {
  private JavaText() {}

  /**
   * Makes text safe inside a Java comment: backslashes are doubled so that no {@code \}{@code u}
   * escape survives (javac decodes unicode escapes before it sees comments, JLS §3.3),
   * {@code *}{@code /} cannot close the comment, control characters cannot end a line comment, and
   * lone surrogates are spelled out.
   */
  static String comment(String text) {
    StringBuilder out = new StringBuilder(text.length() + 8);
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if (c == '\\') {
        out.append("\\\\");
      } else if (c == '/' && i > 0 && text.charAt(i - 1) == '*') {
        out.append("\\/");
      } else if (c < 0x20 || c == 0x7f || c == '\u0085' || c == '\u2028' || c == '\u2029') {
        out.append(String.format(Locale.ROOT, "[U+%04X]", (int) c));
      } else if (Character.isHighSurrogate(c) && i + 1 < text.length()
          && Character.isLowSurrogate(text.charAt(i + 1))) {
        out.append(c).append(text.charAt(++i));
      } else if (Character.isSurrogate(c)) {
        // A lone surrogate: see asciiOnly for why it must not be written as an escape here.
        out.append(String.format(Locale.ROOT, "[U+%04X]", (int) c));
      } else {
        out.append(c);
      }
    }
    return out.toString();
  }

  /**
   * Makes text safe inside a javadoc comment: {@link #comment} plus HTML escapes, so names with
   * {@code <}, {@code &} or {@code @} render as written.
   */
  static String javadoc(String text) {
    return comment(text).replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;")
        .replace("@", "&#64;");
  }

  /**
   * Replaces every non-ASCII character with a unicode escape, so the file compiles the same under
   * any source encoding a user's build may set. Safe because {@link #stringLiteral} and {@link
   * #comment} double backslashes, so a backslash before a non-ASCII character never pairs up with
   * its escape.
   *
   * <p>One javac quirk needs care (measured on JDK 17): after the escape of a high surrogate that
   * no low surrogate escape follows, javac miscounts the backslashes right after it, so in {@code
   * \}{@code ud83d\\}{@code u000a} it decodes the {@code \}{@code u000a} although its backslash is
   * escaped: in a line comment that ends the line. So no lone high surrogate may stand before a
   * backslash; the writers avoid it and this method refuses it.
   */
  static String asciiOnly(String source) {
    StringBuilder out = null;
    for (int i = 0; i < source.length(); i++) {
      char c = source.charAt(i);
      if (c > 0x7e) {
        if (out == null) {
          out = new StringBuilder(source.length() + 64).append(source, 0, i);
        }
        boolean loneHigh = Character.isHighSurrogate(c)
            && (i + 1 == source.length() || !Character.isLowSurrogate(source.charAt(i + 1)));
        if (loneHigh && i + 1 < source.length() && source.charAt(i + 1) == '\\') {
          throw new IllegalStateException("a lone high surrogate before a backslash at " + i);
        }
        out.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
      } else if (out != null) {
        out.append(c);
      }
    }
    return out == null ? source : out.toString();
  }

  /**
   * Returns a string literal of {@code text} in printable ASCII. Everything else becomes an escape:
   * JavaPoet's {@code $S} would pass U+2028 and U+2029 through, and its writer then breaks the line
   * there (it splits on every Unicode line break), cutting the literal in two. Quote and backslash
   * get their own escapes, never unicode ones: javac decodes {@code \}{@code u0022} before it
   * reads the literal (JLS §3.3), and {@code \}{@code u000a} would end the line (JLS §3.4).
   */
  static String stringLiteral(String text) {
    StringBuilder out = new StringBuilder(text.length() + 2).append('"');
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      switch (c) {
        case '"' -> out.append("\\\"");
        // After a lone high surrogate the octal escape, see asciiOnly.
        case '\\' -> out.append(i > 0 && Character.isHighSurrogate(text.charAt(i - 1))
            ? "\\134" : "\\\\");
        case '\n' -> out.append("\\n");
        case '\r' -> out.append("\\r");
        case '\t' -> out.append("\\t");
        default -> {
          if (c >= 0x20 && c < 0x7f) {
            out.append(c);
          } else {
            out.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
          }
        }
      }
    }
    return out.append('"').toString();
  }

  /** Returns a float literal that reads back as exactly {@code value} (IEEE 754 binary32). */
  static String floatLiteral(float value) {
    if (Float.isNaN(value)) {
      throw new IllegalArgumentException("NaN has no comparison literal");
    }
    if (value == Float.POSITIVE_INFINITY) {
      return "Float.POSITIVE_INFINITY";
    }
    if (value == Float.NEGATIVE_INFINITY) {
      return "Float.NEGATIVE_INFINITY";
    }
    // The shortest decimal that reads back as the float, the same text on every JDK.
    return DecimalText.shortest(value) + "f";
  }

  /** Returns a double literal that reads back as exactly {@code value} (IEEE 754 binary64). */
  static String doubleLiteral(double value) {
    if (Double.isNaN(value)) {
      throw new IllegalArgumentException("NaN has no comparison literal");
    }
    if (value == Double.POSITIVE_INFINITY) {
      return "Double.POSITIVE_INFINITY";
    }
    if (value == Double.NEGATIVE_INFINITY) {
      return "Double.NEGATIVE_INFINITY";
    }
    return DecimalText.shortest(value);
  }
}
