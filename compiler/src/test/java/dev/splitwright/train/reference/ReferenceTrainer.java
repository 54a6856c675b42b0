package dev.splitwright.train.reference;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.TrainingOptions;
import java.util.Objects;

/**
 * Test oracle: a frozen copy of the CART trainer as it was at commit f72b88f (before the speed work
 * of issue 17), kept so that tests can check the optimised trainer grows the very same trees, node
 * for node. Do not optimise or otherwise change this package; it is only a reference.
 */
public final class ReferenceTrainer {
  private ReferenceTrainer() {}

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
    return new TreeGrower(train, options).grow();
  }
}
