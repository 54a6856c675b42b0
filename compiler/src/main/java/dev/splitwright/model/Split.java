package dev.splitwright.model;

/**
 * An internal node that sends an input left or right on one feature. A missing value (see {@link
 * dev.splitwright.data.Feature#isMissing}) goes left exactly when {@link #missingLeft()} is true.
 */
public sealed interface Split extends Node permits NumericSplit, CategoricalSplit {

  int feature();

  boolean missingLeft();

  Node left();

  Node right();

  /** Tells whether a value that is not missing goes left. */
  boolean goesLeftPresent(float value);

  /**
   * This split with other children (same feature, rule, missing side and counts); {@code this}
   * itself when both children are the very same objects. Pruning and depth cuts rebuild trees with
   * it.
   */
  default Split withChildren(Node left, Node right) {
    if (left == left() && right == right()) {
      return this;
    }
    if (this instanceof NumericSplit s) {
      return new NumericSplit(s.feature(), s.threshold(), s.missingLeft(), left, right, s.counts());
    }
    CategoricalSplit s = (CategoricalSplit) this;
    return new CategoricalSplit(s.feature(), s.leftCodes(), s.missingLeft(), left, right,
        s.counts());
  }
}
