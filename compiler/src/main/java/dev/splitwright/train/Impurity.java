package dev.splitwright.train;

import java.util.Objects;

/** How the impurity of a node's (class-weighted) class distribution is measured. */
public enum Impurity {
  /** Gini impurity {@code 1 - sum p_c^2}. */
  GINI,
  /** Shannon entropy {@code -sum p_c log2 p_c}, in bits. */
  ENTROPY;

  private static final double LN2 = Math.log(2);

  /**
   * Computes the impurity of a distribution given as non-negative (weighted) class totals; an
   * empty distribution has impurity 0.
   */
  public double of(double... weightedCounts) {
    Objects.requireNonNull(weightedCounts, "weightedCounts");
    double total = 0;
    for (double x : weightedCounts) {
      if (!(x >= 0) || Double.isInfinite(x)) {
        throw new IllegalArgumentException("weighted counts must be finite and non-negative: " + x);
      }
      total += x;
    }
    if (total == 0) {
      return 0;
    }
    double sum = 0;
    for (double x : weightedCounts) {
      double p = x / total;
      sum += this == GINI ? p * p : (p > 0 ? -p * Math.log(p) / LN2 : 0);
    }
    return this == GINI ? 1 - sum : sum;
  }
}
