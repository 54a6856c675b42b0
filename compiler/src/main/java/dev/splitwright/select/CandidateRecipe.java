package dev.splitwright.select;

import dev.splitwright.text.DecimalText;

/**
 * How to reproduce one candidate (as opposed to {@link SearchSettings}, which say what the whole
 * search sweeps): grow with {@code maxDepth} and {@code minLeaf}, then prune by cost complexity.
 * The candidate is the pruning-path subtree for every alpha in {@code [alpha, nextAlpha)}; {@code
 * nextAlpha} is infinite for the single leaf that ends the path.
 */
public record CandidateRecipe(int maxDepth, int minLeaf, double alpha, double nextAlpha) {

  public CandidateRecipe {
    if (maxDepth < 1 || minLeaf < 1) {
      throw new IllegalArgumentException(
          "maxDepth and minLeaf must be positive: " + maxDepth + ", " + minLeaf);
    }
    if (!(alpha >= 0) || Double.isInfinite(alpha) || !(nextAlpha >= alpha)) {
      throw new IllegalArgumentException(
          "need 0 <= alpha <= nextAlpha: " + alpha + ", " + nextAlpha);
    }
  }

  /** Formats an alpha for messages: {@code 0}, or four significant digits. */
  public static String formatAlpha(double alpha) {
    return alpha == 0 ? "0" : DecimalText.significant(alpha, 4);
  }

  /**
   * The alpha used when these settings are refitted on other rows: the geometric mean of the
   * interval's ends, as Breiman, Friedman, Olshen and Stone (1984, §3.4.2) do for
   * cross-validation, so the refitted tree is pruned to the middle of the interval rather than its
   * edge. 0 stays 0; the last interval maps to infinity, the single leaf.
   */
  public double representativeAlpha() {
    // sqrt(0 * infinity) would be NaN for a path that is a single leaf from the start.
    return Double.isInfinite(nextAlpha) ? nextAlpha : Math.sqrt(alpha * nextAlpha);
  }
}
