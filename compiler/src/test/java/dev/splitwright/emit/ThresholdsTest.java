package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class ThresholdsTest {

  static List<Float> thresholds() {
    List<Float> values = new ArrayList<>(List.of(0.0f, -0.0f, 1.0f, -1.0f, 2.5f, 0.1f, -0.1f,
        Float.MIN_VALUE, -Float.MIN_VALUE, Float.MIN_NORMAL, Math.nextDown(Float.MIN_NORMAL),
        Float.MAX_VALUE, -Float.MAX_VALUE, 16777216f, 16777218f, -16777217f, 3.4e30f,
        Float.POSITIVE_INFINITY, Float.NEGATIVE_INFINITY, 0x1p31f, -0x1p31f, 2147483520f));
    SplittableRandom random = new SplittableRandom(5);
    for (int i = 0; i < 300; i++) {
      values.add(Float.intBitsToFloat(random.nextInt()));
    }
    values.removeIf(v -> v.isNaN());
    return values;
  }

  /**
   * The double threshold must separate exactly the doubles that round (JLS §5.1.3, IEEE 754
   * round-to-nearest-even) to a float at or below t from those that round above it.
   */
  @ParameterizedTest
  @MethodSource("thresholds")
  void doubleThresholdIsTheLastDoubleRoundingToAtMostT(float t) {
    double d = Thresholds.forDouble(t);
    assertThat((float) d <= t).as("(float) %s <= %s", d, t).isTrue();
    if (d != Double.POSITIVE_INFINITY) {
      double next = Math.nextUp(d);
      assertThat((float) next <= t).as("(float) %s <= %s", next, t).isFalse();
    }
  }

  /**
   * The same property over the whole float range: every 4,099th bit pattern (about a million,
   * all exponents and both signs) and every float within 2,048 ulps of zero, 1, the normal limit,
   * 2^24 and the largest finite value. With it, {@code x <= d} in double equals {@code (float) x
   * <= t} for every double x, because rounding to float is monotonic (IEEE 754 §4.3): x <= d
   * gives {@code (float) x <= (float) d <= t}, and x > d gives x >= nextUp(d), so {@code (float) x
   * >= (float) nextUp(d) > t}.
   */
  @Test
  void doubleThresholdHoldsAcrossTheWholeFloatRange() {
    List<Integer> bits = new ArrayList<>();
    for (long b = 0; b <= 0xffffffffL; b += 4099) {
      bits.add((int) b);
    }
    for (float center : new float[] {0f, 1f, Float.MIN_NORMAL, 0x1p24f, Float.MAX_VALUE}) {
      int c = Float.floatToRawIntBits(center);
      for (int d = -2048; d <= 2048; d++) {
        bits.add(c + d);
        bits.add((c + d) | 0x80000000);
      }
    }
    int checked = 0;
    for (int b : bits) {
      float t = Float.intBitsToFloat(b);
      if (Float.isNaN(t)) {
        continue;
      }
      double d = Thresholds.forDouble(t);
      if (!((float) d <= t) || (d != Double.POSITIVE_INFINITY && (float) Math.nextUp(d) <= t)) {
        throw new AssertionError("forDouble(" + t + ") = " + d);
      }
      checked++;
    }
    assertThat(checked).isGreaterThan(1_000_000);
  }

  @ParameterizedTest
  @MethodSource("thresholds")
  void intThresholdIsTheLastIntConvertingToAtMostT(float t) {
    long n = Thresholds.forInt(t);
    if (n == Long.MIN_VALUE) {
      assertThat((float) Integer.MIN_VALUE > t).isTrue();
      return;
    }
    assertThat((float) (int) n <= t).isTrue();
    if (n < Integer.MAX_VALUE) {
      assertThat((float) (int) (n + 1) <= t).as("(float) %s <= %s", n + 1, t).isFalse();
    }
  }

  @Test
  void intThresholdAboveTwoToThe24IncludesIntsThatRoundDown() {
    // 16777217 is not a float: it rounds to 16777216 (ties to even), so it compares <= 16777216f.
    assertThat(Thresholds.forInt(16777216f)).isEqualTo(16777217L);
  }
}
