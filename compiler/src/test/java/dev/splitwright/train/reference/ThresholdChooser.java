package dev.splitwright.train.reference;

/**
 * Picks the float32 threshold between two neighbouring distinct training values so that {@code x
 * <= t}, evaluated in float32 as emitted code does, separates them exactly as training did.
 */
final class ThresholdChooser {
  private ThresholdChooser() {}

  /**
   * Returns t with {@code a <= t < b}: the midpoint of a and b rounded to float, or {@code a} when
   * rounding lands on b (as for neighbouring floats). A midpoint that is not finite (an infinite
   * end) is replaced by {@code Math.nextDown(b)}, the largest float below b, so the threshold stays
   * finite wherever possible. Zero is returned as {@code +0.0f}.
   *
   * @throws IllegalArgumentException unless {@code a < b} (so neither is NaN, and {@code -0.0f,
   *     0.0f} are not distinct)
   */
  static float between(float a, float b) {
    if (!(a < b)) {
      throw new IllegalArgumentException("need a < b, but a = " + a + " and b = " + b);
    }
    // No overflow in double; rounding is monotone, so mid >= a, and mid >= b is caught below.
    double mid = (double) a + ((double) b - (double) a) / 2;
    float t;
    if (Double.isNaN(mid) || Double.isInfinite(mid)) {
      t = Math.nextDown(b);
    } else {
      t = (float) mid;
      if (t >= b) {
        t = a;
      }
    }
    // -0.0f and 0.0f compare equal, so this keeps the partition and gives one canonical literal.
    return t == 0f ? 0f : t;
  }
}
