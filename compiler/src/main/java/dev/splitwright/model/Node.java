package dev.splitwright.model;

/** A node of a decision tree: a {@link Leaf} or a {@link Split}. */
public sealed interface Node permits Leaf, Split {

  /** Training rows of each class that reached this node. */
  ClassCounts counts();
}
