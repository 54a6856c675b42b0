package dev.splitwright.train;

import java.util.SplittableRandom;

/**
 * The random subset of features a forest's tree may split on at each node (Breiman 2001, "Random
 * Forests": a fresh random selection at every node). Features are drawn one at a time
 * without replacement, by the steps of a Fisher-Yates shuffle (Durstenfeld 1964), so a node that
 * finds no admissible split among its first draws can keep drawing.
 */
final class FeatureSampler {
  private final int[] order;
  private final int perNode;
  private final SplittableRandom random;

  /**
   * Draws from {@code features} features with {@code random}; each node tries at least {@code
   * perNode} of them.
   */
  FeatureSampler(int features, int perNode, SplittableRandom random) {
    if (perNode < 1 || perNode > features) {
      throw new IllegalArgumentException(
          "features per split must be from 1 to " + features + ", not " + perNode);
    }
    this.order = new int[features];
    for (int f = 0; f < features; f++) {
      order[f] = f;
    }
    this.perNode = perNode;
    this.random = random;
  }

  int perNode() {
    return perNode;
  }

  int features() {
    return order.length;
  }

  /**
   * Returns the {@code i}-th feature of the current node's random order; a node calls it with
   * {@code i = 0, 1, 2, ...}. The order is a permutation whatever the previous node drew, so no
   * reset is needed between nodes.
   */
  int draw(int i) {
    int j = i + random.nextInt(order.length - i);
    int f = order[j];
    order[j] = order[i];
    order[i] = f;
    return f;
  }
}
