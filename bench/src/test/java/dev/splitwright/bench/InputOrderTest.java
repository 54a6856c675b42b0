package dev.splitwright.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;

class InputOrderTest {
  private static final int COUNT = 4_096;

  /** Readings 0..n-1 whose two features are {@code i} and {@code 2i}, label {@code i % 3}. */
  private static LabelledRows readings(int n) {
    float[][] rows = new float[n][];
    int[] labels = new int[n];
    for (int i = 0; i < n; i++) {
      rows[i] = new float[] {i, 2 * i};
      labels[i] = i % 3;
    }
    return new LabelledRows(rows, labels);
  }

  @Test
  void shuffledUsesEveryReadingOnceWithItsLabel() {
    LabelledRows shuffled = InputOrder.SHUFFLED.arrange(readings(COUNT), COUNT, 9);
    Set<Float> firsts = new HashSet<>();
    for (int i = 0; i < COUNT; i++) {
      float[] x = shuffled.rows()[i];
      firsts.add(x[0]);
      assertThat(x[1]).isEqualTo(2 * x[0]);
      assertThat(shuffled.labels()[i]).isEqualTo((int) x[0] % 3);
    }
    assertThat(firsts).hasSize(COUNT);
  }

  @Test
  void shuffledIsNotTheLoggedOrder() {
    LabelledRows shuffled = InputOrder.SHUFFLED.arrange(readings(COUNT), COUNT, 9);
    int inPlace = 0;
    for (int i = 0; i < COUNT; i++) {
      inPlace += shuffled.rows()[i][0] == i ? 1 : 0;
    }
    // A random permutation leaves about one element in place (expected value 1, from memory).
    assertThat(inPlace).isLessThan(10);
  }

  @Test
  void timeOrderedMovesBySmallStepsBetweenReadings() {
    LabelledRows swept = InputOrder.TIME_ORDERED.arrange(readings(COUNT), COUNT, 9);
    float step = 1f / InputOrder.STEPS_PER_READING;
    Set<Float> distinct = new HashSet<>();
    for (int i = 0; i < COUNT; i++) {
      float[] x = swept.rows()[i];
      // Reading k is (k, 2k): the sweep from reading k to k + 1 passes (k + w, 2k + 2w).
      assertThat(x[0]).isEqualTo(i * step);
      assertThat(x[1]).isEqualTo(2 * x[0]);
      distinct.add(x[0]);
    }
    assertThat(distinct).hasSize(COUNT);
  }

  @Test
  void timeOrderedKeepsAMissingValueMissingForTheWholeSweep() {
    LabelledRows readings = readings(3);
    readings.rows()[1][1] = Float.NaN;
    LabelledRows swept = InputOrder.TIME_ORDERED.arrange(readings, 2 * InputOrder.STEPS_PER_READING,
        1);
    for (float[] x : swept.rows()) {
      assertThat(x[1]).isNaN();
      assertThat(x[0]).isNotNaN();
    }
  }

  @Test
  void refusesToShuffleFewerReadingsThanRows() {
    assertThatThrownBy(() -> InputOrder.SHUFFLED.arrange(readings(10), 11, 1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("need 11 readings to shuffle, but there are 10");
  }

  @Test
  void rejectsAnUnknownOrderListingTheKnownOnes() {
    assertThatThrownBy(() -> InputOrder.ofParam("sorted"))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("unknown order 'sorted'; use one of [shuffled, timeOrdered]");
  }
}
