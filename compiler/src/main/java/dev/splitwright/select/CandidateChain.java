package dev.splitwright.select;

import java.util.Optional;

/**
 * Candidates each nested in the next: a tree's pruning path from its smallest subtree up, or an
 * ensemble's prefixes by tree count. A nested candidate's compiled code is part of the larger
 * one's, so the compiled size does not shrink along a chain: once a member is over the budget so
 * is every later one, and the search need not build or measure them ({@link ChainMeasurer}).
 */
interface CandidateChain {
  /** The kind of every member. */
  ModelKind kind();

  /** How many members the chain has, as far as is known before building them. */
  int length();

  /** Builds members up to position {@code upTo} at once, where that is cheaper than one by one. */
  void prepare(int upTo);

  /** Member {@code i}, built if need be; empty past the chain's real end. */
  Optional<DistinctTree> member(int i);

  /** Member {@code i}'s node count, or an estimate while it is not built; NaN if unknown. */
  double nodes(int i);
}
