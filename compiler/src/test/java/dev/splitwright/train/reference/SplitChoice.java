package dev.splitwright.train.reference;

/** The best split found for one node: a numeric threshold or a left code set, and its cost. */
final class SplitChoice {
  final int feature;
  /** Numeric splits only. */
  final float threshold;
  /** Categorical splits only: sorted left codes; {@code null} for a numeric split. */
  final int[] leftCodes;
  final boolean missingLeft;
  /** Children's total impurity mass, missing rows included. */
  final double cost;
  /** Set when the node is queued: its share of the root's impurity decrease. */
  double gain;

  SplitChoice(int feature, float threshold, int[] leftCodes, boolean missingLeft, double cost) {
    this.feature = feature;
    this.threshold = threshold;
    this.leftCodes = leftCodes;
    this.missingLeft = missingLeft;
    this.cost = cost;
  }

  boolean categorical() {
    return leftCodes != null;
  }
}
