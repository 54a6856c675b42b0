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
}
