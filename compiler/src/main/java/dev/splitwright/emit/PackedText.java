package dev.splitwright.emit;

/**
 * Numbers written as printable ASCII for a {@code String} constant that the emitted class decodes
 * once at initialisation. The 90 digit symbols are {@code '#'} to {@code '}'} without the
 * backslash, so no symbol needs an escape in source and each costs one byte in the class file
 * (modified UTF-8, JVM Specification §4.4.7, encodes {@code \u0001}-{@code \u007f} in one byte).
 * Subclasses choose how a 32-bit number becomes digits.
 */
abstract sealed class PackedText permits PackedInts, PackedWords {
  /** How many digit symbols there are. */
  static final int SYMBOLS = 90;
  static final int FIRST_SYMBOL = '#';
  /** The digit the backslash would stand for; symbols from here on are shifted up by one. */
  static final int BACKSLASH_DIGIT = '\\' - FIRST_SYMBOL;

  private final StringBuilder text = new StringBuilder();
  private int count;

  /** Appends the digits of {@code value} read as an unsigned 32-bit number. */
  abstract void appendDigits(StringBuilder out, long unsigned);

  /** Appends {@code value} read as an unsigned 32-bit number (so any bit pattern fits). */
  final PackedText add(int value) {
    appendDigits(text, Integer.toUnsignedLong(value));
    count++;
    return this;
  }

  /** Appends the bits of a float: the decoder gives them back to {@code Float.intBitsToFloat}. */
  final PackedText addFloat(float value) {
    return add(Float.floatToRawIntBits(value));
  }

  /** Appends the bits of a double as two numbers, high word first. */
  final PackedText addDouble(double value) {
    long bits = Double.doubleToRawLongBits(value);
    return add((int) (bits >>> 32)).add((int) bits);
  }

  /** How many numbers were added: the decoder's {@code count} argument. */
  final int count() {
    return count;
  }

  final String text() {
    return text.toString();
  }

  static char symbol(int digit) {
    if (digit < 0 || digit >= SYMBOLS) {
      throw new IllegalArgumentException("digit out of range: " + digit);
    }
    return (char) (FIRST_SYMBOL + digit + (digit >= BACKSLASH_DIGIT ? 1 : 0));
  }
}
