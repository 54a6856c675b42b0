package dev.splitwright.cli;

/** Upper bounds on options, beyond which the pipeline would fail rather than merely be slow. */
final class Limits {
  /**
   * Deepest tree {@code --max-depth} allows. Trees, the emitter and javac's parser all recurse once
   * per level; a degenerate data set grew a depth-1200 chain that overflowed javac's stack
   * (measured in this project), while a decision tree deeper than 100 is of no use on a device.
   */
  static final int MAX_DEPTH = 100;

  private Limits() {}
}
