package dev.splitwright.text;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.concurrent.atomic.AtomicReferenceArray;

/**
 * Prints floats and doubles with our own exact arithmetic, so the text is the same on every JDK.
 * {@link Float#toString} and {@link Double#toString} are not: from JDK 19 they print the shortest
 * decimal that rounds back, while JDK 17 sometimes prints one digit more (e.g. {@code
 * 1.18846831E13} for the float {@code 1.1884683E13}). {@link #shortest} follows the JDK 19+ rule
 * and layout, so on those JDKs its text equals theirs, and on JDK 17 it differs only where JDK 17
 * was not shortest. Fixed-point and significant-digit forms round that shortest decimal half up, as
 * {@link java.util.Formatter} does with the digits it gets from the JDK.
 */
public final class DecimalText {
  private static final BigDecimal HALF = new BigDecimal("0.5");
  private static final BigDecimal FLOAT_OVERFLOW = new BigDecimal(BigInteger.ONE.shiftLeft(128));
  private static final BigDecimal DOUBLE_OVERFLOW = new BigDecimal(BigInteger.ONE.shiftLeft(1024));

  /** Slots of the float cache: a search prints the same thresholds in many candidates. */
  private static final int CACHED_FLOATS = 4096;
  private static final AtomicReferenceArray<Printed> FLOATS =
      new AtomicReferenceArray<>(CACHED_FLOATS);

  /** A float's bits and its text, immutable so that a slot is read whole from any thread. */
  private record Printed(int bits, String text) {}

  private DecimalText() {}

  /**
   * The shortest decimal that reads back as exactly {@code value} (IEEE 754 binary32 round to
   * nearest, ties to even), in the layout of {@link Float#toString}: plain from 10^-3 up to below
   * 10^7 ({@code 0.001}, {@code 1234567.0}), else {@code d.dddE±n} ({@code 1.0E-5}); {@code 0.0},
   * {@code -0.0}, {@code NaN}, {@code Infinity} and {@code -Infinity} as there. A finite result is
   * a valid Java float literal once {@code f} is appended, and a valid JSON number.
   */
  public static String shortest(float value) {
    int bits = Float.floatToRawIntBits(value);
    // Direct-mapped: a slot keeps the float printed last; the text is the same either way.
    int slot = (bits ^ (bits >>> 12) ^ (bits >>> 24)) & (CACHED_FLOATS - 1);
    Printed cached = FLOATS.get(slot);
    if (cached != null && cached.bits() == bits) {
      return cached.text();
    }
    String text = computeShortest(value);
    FLOATS.set(slot, new Printed(bits, text));
    return text;
  }

  private static String computeShortest(float value) {
    if (Float.isNaN(value) || Float.isInfinite(value) || value == 0) {
      return Float.toString(value); // fixed texts, the same on every JDK
    }
    float magnitude = Math.abs(value);
    BigDecimal exact = new BigDecimal(magnitude);
    BigDecimal below = new BigDecimal(Math.nextDown(magnitude));
    BigDecimal above = magnitude == Float.MAX_VALUE
        ? FLOAT_OVERFLOW : new BigDecimal(Math.nextUp(magnitude));
    boolean even = (Float.floatToRawIntBits(magnitude) & 1) == 0;
    return layout(value < 0, choose(exact, below, above, even, 9));
  }

  /** As {@link #shortest(float)} for IEEE 754 binary64, in {@link Double#toString}'s layout. */
  public static String shortest(double value) {
    if (Double.isNaN(value) || Double.isInfinite(value) || value == 0) {
      return Double.toString(value);
    }
    double magnitude = Math.abs(value);
    BigDecimal exact = new BigDecimal(magnitude);
    BigDecimal below = new BigDecimal(Math.nextDown(magnitude));
    BigDecimal above = magnitude == Double.MAX_VALUE
        ? DOUBLE_OVERFLOW : new BigDecimal(Math.nextUp(magnitude));
    boolean even = (Double.doubleToRawLongBits(magnitude) & 1) == 0;
    return layout(value < 0, choose(exact, below, above, even, 17));
  }

  /**
   * {@code value} with exactly {@code decimals} digits after the point, like {@code
   * String.format(Locale.ROOT, "%.<decimals>f", value)}: the shortest decimal rounded half up, a
   * minus sign kept when a negative value rounds to zero.
   */
  public static String fixed(double value, int decimals) {
    if (decimals < 0) {
      throw new IllegalArgumentException("decimals must be non-negative: " + decimals);
    }
    if (Double.isNaN(value) || Double.isInfinite(value)) {
      return Double.toString(value);
    }
    String text = shortestDecimal(Math.abs(value)).setScale(decimals, RoundingMode.HALF_UP)
        .toPlainString();
    return Math.copySign(1.0, value) < 0 ? "-" + text : text;
  }

  /**
   * {@code value} to {@code digits} significant digits, like {@code String.format(Locale.ROOT,
   * "%.<digits>g", value)}: plain when the rounded magnitude is from 10^-4 up to below
   * 10^digits, else {@code d.ddde±nn}.
   */
  public static String significant(double value, int digits) {
    if (digits < 1) {
      throw new IllegalArgumentException("digits must be at least 1: " + digits);
    }
    if (Double.isNaN(value) || Double.isInfinite(value)) {
      return Double.toString(value);
    }
    String sign = Math.copySign(1.0, value) < 0 ? "-" : "";
    if (value == 0) {
      return sign + BigDecimal.ZERO.setScale(digits - 1).toPlainString();
    }
    BigDecimal rounded = shortestDecimal(Math.abs(value))
        .round(new MathContext(digits, RoundingMode.HALF_UP));
    int exponent = rounded.precision() - rounded.scale() - 1;
    if (exponent >= -4 && exponent < digits) {
      return sign + rounded.setScale(digits - 1 - exponent, RoundingMode.UNNECESSARY)
          .toPlainString();
    }
    String mantissa = rounded.movePointLeft(exponent).setScale(digits - 1, RoundingMode.UNNECESSARY)
        .toPlainString();
    int e = Math.abs(exponent);
    return sign + mantissa + "e" + (exponent < 0 ? "-" : "+") + (e < 10 ? "0" : "") + e;
  }

  /** The shortest decimal of a positive finite double, as a number. */
  private static BigDecimal shortestDecimal(double magnitude) {
    if (magnitude == 0) {
      return BigDecimal.ZERO;
    }
    BigDecimal exact = new BigDecimal(magnitude);
    BigDecimal below = new BigDecimal(Math.nextDown(magnitude));
    BigDecimal above = magnitude == Double.MAX_VALUE
        ? DOUBLE_OVERFLOW : new BigDecimal(Math.nextUp(magnitude));
    boolean even = (Double.doubleToRawLongBits(magnitude) & 1) == 0;
    return choose(exact, below, above, even, 17);
  }

  /**
   * Picks, among decimals that round to {@code exact}, one of the fewest significant digits, the
   * closest to {@code exact}, on a tie the one with an even last digit. A decimal rounds to it when
   * it lies strictly between the midpoints to its neighbours, or on a midpoint when its significand
   * is even (ties to even). As in JDK 19+, a one-digit result is compared with the two-digit ones,
   * since the layout shows two digits anyway ({@code 4.9E-324}, not {@code 5.0E-324}).
   */
  private static BigDecimal choose(BigDecimal exact, BigDecimal below, BigDecimal above,
      boolean even, int maxDigits) {
    BigDecimal low = exact.add(below).multiply(HALF);
    BigDecimal high = exact.add(above).multiply(HALF);
    // Whether some n-digit decimal rounds to the value grows with n (an n-digit decimal is also an
    // (n+1)-digit one), so the fewest digits are found by bisection; maxDigits always suffice.
    int fewest = 1;
    int enough = maxDigits;
    while (fewest < enough) {
      int n = (fewest + enough) >>> 1;
      if (nearest(exact, low, high, even, n) != null) {
        enough = n;
      } else {
        fewest = n + 1;
      }
    }
    BigDecimal pick = nearest(exact, low, high, even, Math.max(2, fewest));
    if (pick == null) {
      throw new AssertionError("no decimal of " + maxDigits + " digits rounds to " + exact);
    }
    return pick.stripTrailingZeros();
  }

  /**
   * The n-digit decimal closest to {@code exact} that rounds to it (on a tie the one with an even
   * last digit), or null if none does. Only the nearest below and above can: any other n-digit
   * decimal is farther away on the same side.
   */
  private static BigDecimal nearest(BigDecimal exact, BigDecimal low, BigDecimal high,
      boolean even, int n) {
    BigDecimal down = exact.round(new MathContext(n, RoundingMode.FLOOR));
    BigDecimal up = exact.round(new MathContext(n, RoundingMode.CEILING));
    boolean downIn = inside(down, low, high, even);
    boolean upIn = inside(up, low, high, even);
    if (downIn && upIn) {
      int closer = exact.subtract(down).compareTo(up.subtract(exact));
      if (closer != 0) {
        return closer < 0 ? down : up;
      }
      return down.unscaledValue().testBit(0) ? up : down;
    }
    return downIn ? down : upIn ? up : null;
  }

  private static boolean inside(BigDecimal d, BigDecimal low, BigDecimal high, boolean even) {
    int lo = d.compareTo(low);
    int hi = d.compareTo(high);
    return (lo > 0 || (even && lo == 0)) && (hi < 0 || (even && hi == 0));
  }

  /** Lays out a positive decimal like {@link Double#toString} (JDK 19+ javadoc, by the decimal). */
  private static String layout(boolean negative, BigDecimal decimal) {
    String digits = decimal.unscaledValue().toString();
    int exponent = digits.length() - 1 - decimal.scale(); // decimal = d.ddd * 10^exponent
    StringBuilder out = new StringBuilder(negative ? "-" : "");
    if (exponent >= -3 && exponent < 7) {
      if (exponent < 0) {
        out.append("0.").append("0".repeat(-exponent - 1)).append(digits);
      } else if (digits.length() > exponent + 1) {
        out.append(digits, 0, exponent + 1).append('.').append(digits, exponent + 1,
            digits.length());
      } else {
        out.append(digits).append("0".repeat(exponent + 1 - digits.length())).append(".0");
      }
    } else {
      out.append(digits.charAt(0)).append('.')
          .append(digits.length() > 1 ? digits.substring(1) : "0")
          .append('E').append(exponent);
    }
    return out.toString();
  }
}
