package dev.splitwright.select;

import dev.splitwright.text.DecimalText;
import java.util.Objects;

/**
 * How to reproduce one candidate (as opposed to {@link SearchSettings}, which say what the whole
 * search sweeps). A single tree: grow with {@code maxDepth} and {@code minLeaf}, then prune by
 * cost complexity; the candidate is the pruning-path subtree for every alpha in {@code [alpha,
 * nextAlpha)}, {@code nextAlpha} infinite for the single leaf that ends the path. An ensemble:
 * train {@code trees} trees of that kind with those limits and the search's seed, unpruned (both
 * alphas 0).
 */
public record CandidateRecipe(ModelKind kind, int trees, int maxDepth, int minLeaf, double alpha,
    double nextAlpha) {

  public CandidateRecipe {
    Objects.requireNonNull(kind, "kind");
    if ((kind == ModelKind.TREE) != (trees == 1) || trees < 1) {
      throw new IllegalArgumentException("a tree is one tree, an ensemble two or more: " + kind
          + ", " + trees);
    }
    if (maxDepth < 1 || minLeaf < 1) {
      throw new IllegalArgumentException(
          "maxDepth and minLeaf must be positive: " + maxDepth + ", " + minLeaf);
    }
    if (!(alpha >= 0) || Double.isInfinite(alpha) || !(nextAlpha >= alpha)) {
      throw new IllegalArgumentException(
          "need 0 <= alpha <= nextAlpha: " + alpha + ", " + nextAlpha);
    }
  }

  /** A single tree's recipe. */
  public CandidateRecipe(int maxDepth, int minLeaf, double alpha, double nextAlpha) {
    this(ModelKind.TREE, 1, maxDepth, minLeaf, alpha, nextAlpha);
  }

  /** An ensemble's recipe: {@code trees} trees of {@code kind}, unpruned. */
  public static CandidateRecipe ensemble(ModelKind kind, int trees, int maxDepth, int minLeaf) {
    if (kind == ModelKind.TREE) {
      throw new IllegalArgumentException("not an ensemble kind: " + kind);
    }
    return new CandidateRecipe(kind, trees, maxDepth, minLeaf, 0, 0);
  }

  /** One phrase for messages, e.g. {@code forest of 8 trees, max-depth 3, min-leaf 1}. */
  public String describe() {
    String limits = "max-depth " + maxDepth + ", min-leaf " + minLeaf;
    return kind == ModelKind.TREE ? limits + ", alpha " + formatAlpha(alpha)
        : kind.optionName() + " of " + trees + " trees, " + limits;
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
