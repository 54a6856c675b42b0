package dev.splitwright.model;

import dev.splitwright.data.Schema;

/**
 * A trained model that maps an input to a class: one {@link DecisionTree} or a {@link
 * TreeEnsemble}. Code that only predicts (scoring, verification) can take either.
 */
public sealed interface Classifier permits DecisionTree, TreeEnsemble {

  /** The features the input gives, in order, and the classes predicted. */
  Schema schema();

  /** Returns the class index for input {@code x}, given in feature order. */
  int predict(float[] x);

  /**
   * The class probabilities for {@code x} as float32, which is what emitted code returns and is
   * compared with bit for bit: a tree's leaf frequencies narrowed from double, an ensemble's
   * shares as it computes them.
   */
  float[] floatProbabilities(float[] x);
}
