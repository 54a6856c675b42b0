package dev.splitwright.train;

import dev.splitwright.model.DecisionTree;
import java.util.Objects;

/**
 * One subtree of a cost-complexity pruning sequence: {@code tree} is optimal for every complexity
 * parameter from {@code alpha} up to the next entry's alpha.
 */
public record PrunedTree(double alpha, DecisionTree tree) {

  public PrunedTree {
    if (!(alpha >= 0) || Double.isInfinite(alpha)) {
      throw new IllegalArgumentException(
          "alpha must be finite and non-negative, but it is " + alpha);
    }
    Objects.requireNonNull(tree, "tree");
  }
}
