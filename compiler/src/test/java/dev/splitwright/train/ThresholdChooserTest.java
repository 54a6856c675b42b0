package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Edge cases from IEEE 754 binary32: signed zeros compare equal, subnormals, neighbouring floats
 * ({@code Math.nextUp}), infinities. For every case a <= t < b must hold, and {@code x <= t} must
 * send every value up to a left and every value from b on right.
 */
class ThresholdChooserTest {

  static Stream<Arguments> pairs() {
    float sub = Float.MIN_VALUE; // smallest subnormal, 2^-149
    return Stream.of(
        // Worked by hand: plain midpoint.
        Arguments.of(1f, 2f, 1.5f),
        Arguments.of(-3f, -1f, -2f),
        // Worked by hand: the midpoint of -1 and 1 is 0, returned as +0.0.
        Arguments.of(-1f, 1f, 0f),
        // Neighbouring floats: the midpoint rounds to one end; never b, so t = a.
        Arguments.of(1f, Math.nextUp(1f), 1f),
        Arguments.of(0.1f, Math.nextUp(0.1f), 0.1f),
        Arguments.of(-1f, Math.nextUp(-1f), -1f),
        Arguments.of(Float.MAX_VALUE / 2, Math.nextUp(Float.MAX_VALUE / 2), Float.MAX_VALUE / 2),
        // Subnormals: (0 + 2^-149) / 2 rounds to even (0), which is below b.
        Arguments.of(0f, sub, 0f),
        Arguments.of(-0f, sub, 0f),
        // -2^-149 / 2 rounds to -0.0, which equals b = 0.0, so t = a.
        Arguments.of(-sub, 0f, -sub),
        Arguments.of(-sub, -0f, -sub),
        Arguments.of(sub, 3 * sub, 2 * sub),
        Arguments.of(
            Math.nextDown(Float.MIN_NORMAL), Float.MIN_NORMAL, Math.nextDown(Float.MIN_NORMAL)),
        // Extremes: the midpoint of -MAX and MAX is exactly 0.
        Arguments.of(-Float.MAX_VALUE, Float.MAX_VALUE, 0f),
        // Infinite ends: the midpoint is not finite, so t = nextDown(b).
        Arguments.of(Float.MAX_VALUE, Float.POSITIVE_INFINITY, Float.MAX_VALUE),
        Arguments.of(1f, Float.POSITIVE_INFINITY, Float.MAX_VALUE),
        Arguments.of(Float.NEGATIVE_INFINITY, 0f, -sub),
        Arguments.of(Float.NEGATIVE_INFINITY, 5f, Math.nextDown(5f)),
        Arguments.of(Float.NEGATIVE_INFINITY, -Float.MAX_VALUE, Float.NEGATIVE_INFINITY),
        Arguments.of(Float.NEGATIVE_INFINITY, Float.POSITIVE_INFINITY, Float.MAX_VALUE));
  }

  @ParameterizedTest(name = "between({0}, {1}) = {2}")
  @MethodSource("pairs")
  void choosesThresholdThatReproducesTheTrainingPartition(float a, float b, float expected) {
    float t = ThresholdChooser.between(a, b);
    assertThat(Float.floatToIntBits(t)).as("t = %s", t).isEqualTo(Float.floatToIntBits(expected));
    assertPartitions(a, b, t);
  }

  @Test
  void randomBitPatternsAlwaysPartition() {
    Random random = new Random(754);
    int checked = 0;
    while (checked < 200_000) {
      float x = Float.intBitsToFloat(random.nextInt());
      float y = random.nextBoolean() ? Math.nextUp(x) : Float.intBitsToFloat(random.nextInt());
      if (Float.isNaN(x) || Float.isNaN(y) || x == y) {
        continue;
      }
      float a = Math.min(x, y);
      float b = Math.max(x, y);
      assertPartitions(a, b, ThresholdChooser.between(a, b));
      checked++;
    }
  }

  @Test
  void rejectsEqualNaNOrReversedEnds() {
    assertThatThrownBy(() -> ThresholdChooser.between(-0f, 0f))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("need a < b, but a = -0.0 and b = 0.0");
    assertThatThrownBy(() -> ThresholdChooser.between(Float.NaN, 1f))
        .isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> ThresholdChooser.between(2f, 1f))
        .isInstanceOf(IllegalArgumentException.class);
  }

  private static void assertPartitions(float a, float b, float t) {
    assertThat(a <= t && t < b).as("%s <= %s < %s", a, t, b).isTrue();
    // Every value up to a (here a and its lower neighbour) goes left; b and above go right.
    for (float x : new float[] {a, Math.nextDown(a)}) {
      assertThat(x <= t).as("%s <= %s", x, t).isTrue();
    }
    for (float x : new float[] {b, Math.nextUp(b)}) {
      assertThat(x <= t).as("%s <= %s", x, t).isFalse();
    }
  }
}
