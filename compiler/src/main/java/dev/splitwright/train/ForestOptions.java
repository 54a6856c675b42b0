package dev.splitwright.train;

import dev.splitwright.model.TreeEnsemble;
import java.util.Objects;

/**
 * Settings for {@link ForestTrainer}.
 *
 * @param trees how many trees to grow, 1 to {@link TreeEnsemble#MAX_TREES}
 * @param featuresPerSplit how many features each node draws at random to split on, or {@link
 *     #AUTOMATIC} for Breiman's {@code floor(log2 F) + 1} of {@code F} features; a number above
 *     the data's feature count means all of them
 * @param seed the seed of every random draw (bootstrap samples and features)
 * @param tree the limits and impurity of each tree: depth, leaf size, leaves, class weights
 */
public record ForestOptions(int trees, int featuresPerSplit, long seed, TrainingOptions tree) {
  /** The value of {@link #featuresPerSplit} that picks {@code floor(log2 F) + 1}. */
  public static final int AUTOMATIC = 0;

  public ForestOptions {
    if (trees < 1 || trees > TreeEnsemble.MAX_TREES) {
      throw new IllegalArgumentException(
          "trees must be from 1 to " + TreeEnsemble.MAX_TREES + ", but it is " + trees);
    }
    if (featuresPerSplit < 0) {
      throw new IllegalArgumentException(
          "featuresPerSplit must be at least 0 (automatic), but it is " + featuresPerSplit);
    }
    Objects.requireNonNull(tree, "tree");
  }

  /** A forest of {@code trees} trees with the automatic feature count. */
  public static ForestOptions of(int trees, long seed, TrainingOptions tree) {
    return new ForestOptions(trees, AUTOMATIC, seed, tree);
  }

  /**
   * Returns how many features a node draws among {@code featureCount}: the automatic count is
   * {@code floor(log2 F) + 1}, the larger of the two group sizes Breiman (2001, "Random Forests")
   * tried with random input selection.
   */
  public int featuresFor(int featureCount) {
    if (featureCount < 1) {
      throw new IllegalArgumentException("a forest needs at least one feature");
    }
    int m = featuresPerSplit == AUTOMATIC
        ? 31 - Integer.numberOfLeadingZeros(featureCount) + 1
        : featuresPerSplit;
    return Math.min(m, featureCount);
  }
}
