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
