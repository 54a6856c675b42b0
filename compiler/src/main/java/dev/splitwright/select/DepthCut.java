package dev.splitwright.select;

import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
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
      return new Leaf(weightedMajority(node.counts().toArray(), w), node.counts());
    }
    Node left = cut(split.left(), levelsLeft - 1, w);
    Node right = cut(split.right(), levelsLeft - 1, w);
    if (split instanceof NumericSplit s) {
      return new NumericSplit(s.feature(), s.threshold(), s.missingLeft(), left, right,
          s.counts());
    }
    CategoricalSplit s = (CategoricalSplit) split;
    return new CategoricalSplit(s.feature(), s.leftCodes(), s.missingLeft(), left, right,
        s.counts());
  }

  /** The class with the largest weighted count, the lowest index on ties, as the trainer picks. */
  static int weightedMajority(int[] counts, double[] w) {
    int best = 0;
    for (int c = 1; c < counts.length; c++) {
      if (w[c] * counts[c] > w[best] * counts[best]) {
        best = c;
      }
    }
    return best;
  }
}
