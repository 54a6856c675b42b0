package dev.splitwright.data;

/**
 * Classifies one trimmed CSV cell as a number or not, and says what is wrong with a cell that a
 * numeric column cannot take.
 *
 * <p>A number is a plain decimal, {@code [+-]? (digits [. digits?] | . digits) ([eE] [+-]?
 * digits)?} with ASCII digits. {@link Double#parseDouble} accepts more (hexadecimal floats, {@code
 * d}/{@code f} suffixes, {@code NaN}, {@code Infinity}); in a CSV export those are mistakes, not
 * numbers, so they are told apart here rather than accepted or taken for category names.
 */
final class CellText {

  /** What a non-missing cell looks like. */
  enum Kind {
    /** A plain decimal whose float32 value is finite. */
    NUMBER,
    /** A plain decimal too large for float32. */
    OVERFLOW,
    /** {@code NaN}, {@code Infinity} or {@code inf} in any case, with or without a sign. */
    NOT_FINITE,
    /** Java-only number syntax: a hexadecimal float or a {@code d}/{@code f} suffix. */
    NOT_PLAIN,
    /** Anything else: a category name, or a typo in a numeric column. */
    TEXT
  }

  private CellText() {}

  static Kind classify(String trimmed) {
    if (isPlainDecimal(trimmed, trimmed.length())) {
      return Float.isInfinite(Float.parseFloat(trimmed)) ? Kind.OVERFLOW : Kind.NUMBER;
    }
    if (isNotFinite(trimmed)) {
      return Kind.NOT_FINITE;
    }
    if (isJavaOnlyNumber(trimmed)) {
      return Kind.NOT_PLAIN;
    }
    return Kind.TEXT;
  }

  /**
   * Parses a cell that {@link #classify} called a {@link Kind#NUMBER}. {@link Float#parseFloat}
   * rounds the decimal once, to the nearest float32; parsing to double first and then casting
   * rounds twice and can land one ulp off (IEEE 754 round-to-nearest).
   */
  static float parse(String trimmed) {
    return Float.parseFloat(trimmed);
  }

  static boolean isPlainDecimal(String s, int end) {
    int i = 0;
    if (i < end && (s.charAt(i) == '+' || s.charAt(i) == '-')) {
      i++;
    }
    int digits = 0;
    while (i < end && isAsciiDigit(s.charAt(i))) {
      i++;
      digits++;
    }
    if (i < end && s.charAt(i) == '.') {
      i++;
      while (i < end && isAsciiDigit(s.charAt(i))) {
        i++;
        digits++;
      }
    }
    if (digits == 0) {
      return false;
    }
    if (i < end && (s.charAt(i) == 'e' || s.charAt(i) == 'E')) {
      i++;
      if (i < end && (s.charAt(i) == '+' || s.charAt(i) == '-')) {
        i++;
      }
      int exponentDigits = 0;
      while (i < end && isAsciiDigit(s.charAt(i))) {
        i++;
        exponentDigits++;
      }
      if (exponentDigits == 0) {
        return false;
      }
    }
    return i == end;
  }

  private static boolean isAsciiDigit(char c) {
    return c >= '0' && c <= '9';
  }

  private static boolean isNotFinite(String s) {
    String unsigned = s.startsWith("+") || s.startsWith("-") ? s.substring(1) : s;
    return unsigned.equalsIgnoreCase("nan")
        || unsigned.equalsIgnoreCase("inf")
        || unsigned.equalsIgnoreCase("infinity");
  }

  private static boolean isJavaOnlyNumber(String s) {
    int n = s.length();
    if (n >= 2 && "dDfF".indexOf(s.charAt(n - 1)) >= 0 && isPlainDecimal(s, n - 1)) {
      return true;
    }
    String unsigned = s.startsWith("+") || s.startsWith("-") ? s.substring(1) : s;
    if (unsigned.startsWith("0x") || unsigned.startsWith("0X")) {
      try {
        Double.parseDouble(s);
        return true;
      } catch (NumberFormatException notHex) {
        return false;
      }
    }
    return false;
  }

  /**
   * Describes why a numeric column cannot take a cell of {@code kind} (anything but {@link
   * Kind#NUMBER}).
   *
   * @param forced whether the column was declared numeric, which changes the advice for text
   */
  static InputException numericCellError(
      Kind kind, SourcePosition where, String trimmed, boolean forced) {
    String shown = InputException.quote(trimmed);
    return switch (kind) {
      case OVERFLOW ->
          new InputException(
              where,
              shown + " is too large for a 32-bit float (largest " + Float.MAX_VALUE + ")",
              "rescale the column or fix the cell; values are not clamped");
      case NOT_FINITE ->
          new InputException(
              where,
              shown + " is not a reading but a logging fault marker",
              "export missing readings as empty cells, or declare "
                  + shown
                  + " a missing-value token (--"
                  + LoadOptions.OPTION_MISSING
                  + ")");
      case NOT_PLAIN ->
          new InputException(
              where,
              shown + " is not a plain decimal number",
              "write numbers as plain decimals such as 12.5 or -3.1e-4");
      case TEXT ->
          new InputException(
              where,
              shown + " is not a number",
              forced
                  ? "fix the cell, leave it empty for a missing value, or do not declare the column"
                        + " numeric"
                  : "fix the cell, or leave it empty for a missing value");
      case NUMBER -> throw new IllegalArgumentException("a number is not an error");
    };
  }
}
