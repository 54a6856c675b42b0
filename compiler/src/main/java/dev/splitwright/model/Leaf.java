package dev.splitwright.model;

import java.util.Objects;

/**
 * A terminal node. {@code prediction} is stored, not derived from {@code counts}, because class
 * weights may make a minority class the weighted majority.
 */
public record Leaf(int prediction, ClassCounts counts) implements Node {

  /** The leaf a node becomes when its subtree is cut off: its weighted majority class. */
  public static Leaf collapse(Node node, double[] classWeights) {
    ClassCounts counts = Objects.requireNonNull(node, "node").counts();
    return new Leaf(counts.weightedMajority(classWeights), counts);
  }

  public Leaf {
    Objects.requireNonNull(counts, "counts");
    if (prediction < 0 || prediction >= counts.classCount()) {
      throw new IllegalArgumentException(
          "prediction " + prediction + " is not a class index below " + counts.classCount());
    }
  }
}
