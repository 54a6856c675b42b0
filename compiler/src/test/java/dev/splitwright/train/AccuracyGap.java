package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Locale;

/**
 * Compares test accuracies of ours and another learner over several splits, honestly about what
 * a test set of 80 to 200 rows can show: the binomial standard error of an accuracy p on n rows,
 * sqrt(p(1 - p) / n) (common practice), is about 3.5 points at p = 0.75 and n = 150. The mean
 * difference (ours minus theirs) over the splits must be no worse than 1.96 of those standard
 * errors (a 95% normal interval, common practice): a clearly worse trainer fails, a difference of
 * a point or two, which these data cannot resolve, does not.
 */
public final class AccuracyGap {
  private static final double Z_95 = 1.96;

  private AccuracyGap() {}

  /**
   * Prints the mean and spread of {@code ours[i] - theirs[i]} and checks the mean against the
   * margin for {@code testRows} rows.
   */
  public static void check(String name, double[] ours, double[] theirs, int testRows) {
    double[] diff = new double[ours.length];
    for (int i = 0; i < diff.length; i++) {
      diff[i] = ours[i] - theirs[i];
    }
    double mean = mean(diff);
    double p = mean(theirs);
    double margin = Z_95 * Math.sqrt(p * (1 - p) / testRows);
    System.out.printf(Locale.ROOT,
        "  minus %-7s mean %+.4f, sd %.4f over %d splits; margin %.4f (1.96 binomial SE, n=%d)%n",
        name, mean, standardDeviation(diff, mean), diff.length, margin, testRows);
    assertThat(mean).as("mean accuracy difference to %s", name).isGreaterThanOrEqualTo(-margin);
  }

  static double mean(double[] values) {
    double sum = 0;
    for (double v : values) {
      sum += v;
    }
    return sum / values.length;
  }

  /** The sample standard deviation (n - 1 in the denominator). */
  static double standardDeviation(double[] values, double mean) {
    double squares = 0;
    for (double v : values) {
      squares += (v - mean) * (v - mean);
    }
    return Math.sqrt(squares / (values.length - 1));
  }
}
