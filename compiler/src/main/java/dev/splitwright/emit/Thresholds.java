package dev.splitwright.emit;

/**
 * Moves a float32 threshold to the other input types so that the comparison gives the class the
 * float model gives on the input converted to float (JLS §5.1.3: round to nearest, ties to even).
 */
public final class Thresholds {
  private Thresholds() {}

  /**
   * Returns the largest double {@code d} such that {@code (float) d <= t}; so {@code x <= d} in
   * double holds exactly when {@code (float) x <= t}.
   */
  static double forDouble(float t) {
    if (t == Float.POSITIVE_INFINITY) {
      return Double.POSITIVE_INFINITY;
    }
    double low = t == Float.NEGATIVE_INFINITY ? -(double) Float.MAX_VALUE : t;
    double up = t == Float.MAX_VALUE ? Math.scalb(1.0, 128) : Math.nextUp(t);
    if (t == Float.NEGATIVE_INFINITY) {
      up = low;
      low = -Math.scalb(1.0, 128);
    }
    // Halfway between two adjacent floats is exact in double (24-bit vs 53-bit significands).
    double half = low + (up - low) / 2;
    boolean tieGoesToT = t == Float.NEGATIVE_INFINITY || (Float.floatToRawIntBits(t) & 1) == 0;
    return tieGoesToT ? half : Math.nextDown(half);
  }

  /**
   * Returns the largest int {@code n} with {@code (float) n <= t}, or {@code Long.MIN_VALUE} when
   * no int qualifies. A long because the answer may be below {@link Integer#MIN_VALUE}.
   */
  public static long forInt(float t) {
    if (t >= 0x1p31f) {
      return Integer.MAX_VALUE;
    }
    if ((float) Integer.MIN_VALUE > t) {
      return Long.MIN_VALUE;
    }
    long n = (long) Math.floor(t);
    // Above 2^24 an int converts to float with rounding, so a few ints past floor(t) may still
    // convert to t or below.
    while (n < Integer.MAX_VALUE && (float) (n + 1) <= t) {
      n++;
    }
    while ((float) n > t) {
      n--;
    }
    return n;
  }
}
