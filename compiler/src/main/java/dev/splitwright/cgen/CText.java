package dev.splitwright.cgen;

import java.nio.charset.StandardCharsets;
import java.util.Locale;

/** Turns numbers and user text into C99 source text that means exactly what it says. */
final class CText {
  private CText() {}

  /**
   * A hexadecimal floating constant of type float denoting exactly {@code value}. A decimal
   * constant may be rounded to either neighbour of the nearest float (C99 6.4.4.2p3); a
   * hexadecimal one is correctly rounded when FLT_RADIX is a power of 2, and a representable value
   * is its own correct rounding. Subnormals are written normalized ({@code 0x1p-149f}).
   */
  static String hexFloat(float value) {
    if (!Float.isFinite(value)) {
      throw new IllegalArgumentException("no C99 constant without <math.h> for " + value);
    }
    int bits = Float.floatToRawIntBits(value);
    String sign = bits < 0 ? "-" : "";
    int biased = (bits >>> 23) & 0xff;
    int fraction = bits & 0x7fffff;
    if (biased == 0 && fraction == 0) {
      return sign + "0x0p+0f";
    }
    int exponent;
    if (biased == 0) {
      int lead = 31 - Integer.numberOfLeadingZeros(fraction);
      exponent = lead - 149;
      fraction = (fraction << (23 - lead)) & 0x7fffff;
    } else {
      exponent = biased - 127;
    }
    // 23 fraction bits fill six hex digits once shifted left by one.
    String digits = String.format(Locale.ROOT, "%06x", fraction << 1).replaceFirst("0+$", "");
    return sign + "0x1" + (digits.isEmpty() ? "" : "." + digits) + "p"
        + (exponent >= 0 ? "+" : "") + exponent + "f";
  }

  /**
   * The decimal text of {@code value} for a comment beside its exact constant. The digits are
   * those the Java emitter writes for its literals ({@code Float.toString}, shortest round trip);
   * the comment is for people, the hexadecimal constant is what the compiler reads.
   */
  static String decimal(float value) {
    if (value == Float.POSITIVE_INFINITY) {
      return "+Infinity";
    }
    return Float.toString(value);
  }

  /** An int32 constant; INT32_MIN is written as an expression because 2147483648 is no int. */
  static String int32(long value) {
    if (value < Integer.MIN_VALUE || value > Integer.MAX_VALUE) {
      throw new IllegalArgumentException("not an int32: " + value);
    }
    return value == Integer.MIN_VALUE ? "(-2147483647 - 1)" : Long.toString(value);
  }

  /**
   * A C string literal of the UTF-8 bytes of {@code text}: printable ASCII as itself, {@code \\},
   * {@code \"}, {@code \?} for every question mark (trigraphs such as {@code ??/} are replaced in
   * translation phase 1 under {@code -std=c99}, C99 5.2.1.1) and a three-digit octal escape for
   * every other byte, so no following digit can extend it (C99 6.4.4.4).
   */
  static String stringLiteral(String text) {
    byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
    StringBuilder out = new StringBuilder(bytes.length + 2).append('"');
    for (byte b : bytes) {
      int c = b & 0xff;
      if (c == '\\' || c == '"' || c == '?') {
        out.append('\\').append((char) c);
      } else if (c >= 0x20 && c < 0x7f) {
        out.append((char) c);
      } else {
        out.append('\\').append((char) ('0' + (c >> 6))).append((char) ('0' + ((c >> 3) & 7)))
            .append((char) ('0' + (c & 7)));
      }
    }
    return out.append('"').toString();
  }

  /**
   * Makes text safe inside a block comment: no {@code *}{@code /} can close it and no {@code
   * /}{@code *} can open a nested one (gcc's -Wcomment), line breaks and everything outside
   * printable ASCII are spelled {@code [U+XXXX]} (so no line ends inside user text), and a
   * question mark after a question mark becomes {@code \?}, so no trigraph forms.
   */
  static String comment(String text) {
    StringBuilder out = new StringBuilder(text.length() + 8);
    int last = -1;
    for (int i = 0; i < text.length(); ) {
      int cp = text.codePointAt(i);
      i += Character.charCount(cp);
      if (cp == '/' && last == '*' || cp == '*' && last == '/' || cp == '?' && last == '?') {
        out.append('\\').appendCodePoint(cp);
      } else if (cp >= 0x20 && cp < 0x7f) {
        out.appendCodePoint(cp);
      } else {
        out.append(String.format(Locale.ROOT, "[U+%04X]", cp));
        cp = ']';
      }
      last = cp;
    }
    return out.toString();
  }

  /**
   * Tells whether the UTF-8 of {@code text} is longer than the 4095 characters a string literal
   * may have in every C99 compiler (5.2.4.1); gcc's -Wpedantic warns past it.
   */
  static boolean isLongString(String text) {
    return text.getBytes(StandardCharsets.UTF_8).length > 4095;
  }

  /**
   * The UTF-8 bytes of {@code text} and a terminating zero as octal character constants, twelve
   * a line, for a {@code char} array. A byte above 127 as {@code '\ooo'} gives that byte in a
   * char, signed or not.
   */
  static String charInitializer(String text) {
    byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
    StringBuilder out = new StringBuilder(bytes.length * 8);
    for (int i = 0; i <= bytes.length; i++) {
      int c = i < bytes.length ? bytes[i] & 0xff : 0;
      out.append(i % 12 == 0 ? "    " : " ").append("'\\")
          .append((char) ('0' + (c >> 6))).append((char) ('0' + ((c >> 3) & 7)))
          .append((char) ('0' + (c & 7))).append('\'').append(i < bytes.length ? "," : "");
      if (i % 12 == 11 || i == bytes.length) {
        out.append('\n');
      }
    }
    return out.toString();
  }
}
