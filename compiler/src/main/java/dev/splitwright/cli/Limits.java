package dev.splitwright.cli;

import dev.splitwright.model.DecisionTree;

/** Upper bounds on options, beyond which the pipeline would fail rather than merely be slow. */
final class Limits {
  /**
   * Deepest tree {@code --max-depth} allows. Trees, the emitter and javac's parser all recurse once
   * per level; a degenerate data set grew a depth-1200 chain that overflowed javac's stack
   * (measured in this project), while a decision tree deeper than 100 is of no use on a device.
   * Model files read with {@code --model} are held to the same cap.
   */
  static final int MAX_DEPTH = DecisionTree.MAX_DEPTH;

  private Limits() {}
}
