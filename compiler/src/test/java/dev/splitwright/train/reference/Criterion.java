package dev.splitwright.train.reference;

import dev.splitwright.train.Impurity;

/**
 * Weighted impurity mass {@code W * i(t)} of raw class counts, where W is the class-weighted row
 * total. A split's cost is the sum over its children; lower is better, and the node's own mass
 * minus that sum is the impurity decrease scaled by the node's weight.
 */
final class Criterion {
  private static final double LN2 = Math.log(2);

  private final boolean gini;
  private final double[] weights;
  private final boolean unweighted;
  /** For entropy: {@code n ln n} for every possible row count n, and {@code w_c ln w_c}. */
  private final double[] nLnN;
  private final double[] wLnW;

  Criterion(Impurity impurity, double[] classWeights, int rows) {
    this.gini = impurity == Impurity.GINI;
    this.weights = classWeights.clone();
    boolean allOne = true;
    for (double w : classWeights) {
      allOne &= w == 1.0;
    }
    this.unweighted = allOne;
    this.wLnW = new double[classWeights.length];
    for (int c = 0; c < classWeights.length; c++) {
      wLnW[c] = classWeights[c] * Math.log(classWeights[c]);
    }
    this.nLnN = gini ? new double[0] : new double[rows + 1];
    for (int n = 1; n < nLnN.length; n++) {
      nLnN[n] = n * Math.log(n);
    }
  }

  double weight(int[] counts) {
    double total = 0;
    for (int c = 0; c < counts.length; c++) {
      total += weights[c] * counts[c];
    }
    return total;
  }

  /**
   * The size of the terms that costs of {@code counts} and of their parts sum: W (the weighted row
   * total) for Gini, W log2 W and the like for entropy. Each operation rounds by at most half an
   * ulp of it, so mathematically equal costs differ by a small multiple of its ulp.
   */
  double roundingScale(int[] counts) {
    double total = weight(counts);
    if (gini || total <= 0) {
      return total;
    }
    int rows = 0;
    double classTerms = 0;
    for (int c = 0; c < counts.length; c++) {
      rows += counts[c];
      classTerms += counts[c] * Math.abs(wLnW[c]);
    }
    double logs = Math.max(Math.log(rows), Math.abs(Math.log(total)));
    return total + (total * logs + classTerms) / LN2;
  }

  double weight(int classIndex, int count) {
    return weights[classIndex] * count;
  }

  /** Impurity mass of {@code counts}. */
  double cost(int[] counts) {
    return cost(counts, counts, 0);
  }

  /** Impurity mass of {@code total - part}. */
  double costOfDifference(int[] total, int[] part) {
    return cost(total, part, -1);
  }

  /** Impurity mass of {@code a + b}. */
  double costOfSum(int[] a, int[] b) {
    return cost(a, b, 1);
  }

  private double cost(int[] a, int[] b, int sign) {
    int k = a.length;
    if (gini) {
      double total = 0;
      double squares = 0;
      for (int c = 0; c < k; c++) {
        double x = weights[c] * (a[c] + sign * b[c]);
        total += x;
        squares += x * x;
      }
      return total > 0 ? total - squares / total : 0;
    }
    if (unweighted) {
      int total = 0;
      double sum = 0;
      for (int c = 0; c < k; c++) {
        int n = a[c] + sign * b[c];
        total += n;
        sum += nLnN[n];
      }
      return (nLnN[total] - sum) / LN2;
    }
    double total = 0;
    double sum = 0;
    for (int c = 0; c < k; c++) {
      int n = a[c] + sign * b[c];
      double x = weights[c] * n;
      total += x;
      sum += weights[c] * nLnN[n] + n * wLnW[c];
    }
    return total > 0 ? (total * Math.log(total) - sum) / LN2 : 0;
  }
}
