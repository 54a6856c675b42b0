package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;

class ImpurityTest {

  @Test
  void giniOfSixToTwoIsThreeEighths() {
    // Worked by hand: 1 - (0.75^2 + 0.25^2) = 1 - 0.625 = 0.375.
    assertThat(Impurity.GINI.of(6, 2)).isCloseTo(0.375, within(1e-15));
  }

  @Test
  void entropyOfSixToTwoIsAboutPointEightOneOneBits() {
    // Worked by hand: -(0.75 log2 0.75 + 0.25 log2 0.25) = 0.75 * 0.415037 + 0.25 * 2 = 0.811278.
    assertThat(Impurity.ENTROPY.of(6, 2)).isCloseTo(0.811278, within(1e-6));
  }

  @Test
  void uniformOverFourClassesHasGiniThreeQuartersAndTwoBits() {
    // Worked by hand: Gini 1 - 4 * (1/4)^2 = 0.75; entropy log2 4 = 2.
    assertThat(Impurity.GINI.of(5, 5, 5, 5)).isCloseTo(0.75, within(1e-15));
    assertThat(Impurity.ENTROPY.of(5, 5, 5, 5)).isCloseTo(2.0, within(1e-15));
  }

  @Test
  void pureAndEmptyNodesHaveZeroImpurity() {
    for (Impurity impurity : Impurity.values()) {
      assertThat(impurity.of(0, 7, 0)).isZero();
      assertThat(impurity.of(0, 0)).isZero();
    }
  }

  @Test
  void dependsOnlyOnProportions() {
    for (Impurity impurity : Impurity.values()) {
      assertThat(impurity.of(12, 4)).isCloseTo(impurity.of(6, 2), within(1e-15));
    }
  }

  @Test
  void rejectsNegativeCounts() {
    assertThatThrownBy(() -> Impurity.GINI.of(1, -1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("weighted counts must be finite and non-negative: -1.0");
  }

  @Test
  void trainerCriterionEqualsWeightTimesImpurity() {
    // The trainer's fast path must agree with the definition above, weighted or not.
    Random random = new Random(7);
    for (Impurity impurity : Impurity.values()) {
      for (boolean weighted : new boolean[] {false, true}) {
        double[] w = {1, 1, 1};
        if (weighted) {
          w = new double[] {0.5, 2.25, 3};
        }
        Criterion criterion = new Criterion(impurity, w, 150);
        for (int trial = 0; trial < 200; trial++) {
          int[] a = {random.nextInt(50), random.nextInt(50), random.nextInt(50)};
          int[] b = {random.nextInt(a[0] + 1), random.nextInt(a[1] + 1), random.nextInt(a[2] + 1)};
          assertThat(criterion.cost(a))
              .isCloseTo(weightTimesImpurity(impurity, w, a), within(1e-9));
          int[] diff = {a[0] - b[0], a[1] - b[1], a[2] - b[2]};
          assertThat(criterion.costOfDifference(a, b))
              .isCloseTo(weightTimesImpurity(impurity, w, diff), within(1e-9));
          int[] sum = {diff[0] + b[0], diff[1] + b[1], diff[2] + b[2]};
          assertThat(criterion.costOfSum(diff, b))
              .isCloseTo(weightTimesImpurity(impurity, w, sum), within(1e-9));
        }
      }
    }
  }

  private static double weightTimesImpurity(Impurity impurity, double[] w, int[] counts) {
    double[] x = new double[counts.length];
    double total = 0;
    for (int c = 0; c < counts.length; c++) {
      x[c] = w[c] * counts[c];
      total += x[c];
    }
    return total * impurity.of(x);
  }
}
