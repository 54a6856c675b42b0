package dev.splitwright.select;

import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.Split;

/**
 * Cuts a tree at a depth: every node at that depth becomes a leaf predicting its weighted majority
 * class. Without a leaf limit the trainer splits every splittable node whatever the order (see
 * {@code TreeGrower}), so cutting the tree grown to depth D at depth d gives exactly the tree grown
 * to depth d; the search grows one tree per leaf size instead of one per depth and leaf size.
 */
final class DepthCut {
  private DepthCut() {}

  /** The tree cut at {@code depth}, with leaf classes chosen under {@code classWeights}. */
  static DecisionTree cut(DecisionTree tree, int depth, double[] classWeights) {
    if (tree.depth() <= depth) {
      return tree;
    }
    return new DecisionTree(tree.schema(), cut(tree.root(), depth, classWeights));
  }

  private static Node cut(Node node, int levelsLeft, double[] w) {
    if (!(node instanceof Split split)) {
      return node;
    }
    if (levelsLeft == 0) {
      return Leaf.collapse(node, w);
    }
    return split.withChildren(cut(split.left(), levelsLeft - 1, w),
        cut(split.right(), levelsLeft - 1, w));
  }
}
