package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import java.util.Objects;

/**
 * Trains a CART classification tree (Breiman, Friedman, Olshen and Stone, 1984).
 *
 * <p>Numeric features are split at {@code x <= t}, trying a threshold between every pair of
 * neighbouring distinct values; categorical features are split by a set of codes going left (the
 * optimal set for two classes, a per-class ordering heuristic for more; codes absent from a node go
 * right). Rows with a missing value are never dropped: each split learns which side they take.
 * Growth is best-first under the limits of {@link TrainingOptions}; the same data and options
 * always give an equal tree.
 */
public final class CartTrainer {
  private CartTrainer() {}

  /**
   * Trains a tree on every row of {@code train}.
   *
   * @throws IllegalArgumentException if {@code train} has no rows, or the class weights name a
   *     label the schema lacks
   */
  public static DecisionTree train(Dataset train, TrainingOptions options) {
    Objects.requireNonNull(train, "train");
    Objects.requireNonNull(options, "options");
    if (train.rows() == 0) {
      throw new IllegalArgumentException("cannot train on a data set with no rows");
    }
    JitPrimer.primeFor(train, options);
    return new TreeGrower(train, options).grow();
  }
}
