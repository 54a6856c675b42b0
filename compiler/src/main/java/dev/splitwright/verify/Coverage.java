package dev.splitwright.verify;

import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Node;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;

/**
 * Counts the splits whose both sides some input took, walking the model as the code would; in an
 * ensemble the splits of all trees, each tree walked for every input.
 */
final class Coverage {
  private final List<DecisionTree> trees;
  /** Per tree, the number of each split among the splits of all trees. */
  private final List<Map<Split, Integer>> index = new ArrayList<>();
  private final boolean[] left;
  private final boolean[] right;

  Coverage(Classifier model) {
    this.trees = Trees.of(model);
    int next = 0;
    for (DecisionTree tree : trees) {
      Map<Split, Integer> numbers = new IdentityHashMap<>();
      for (Split split : tree.splitsPreOrder()) {
        numbers.put(split, next++);
      }
      index.add(numbers);
    }
    left = new boolean[next];
    right = new boolean[next];
  }

  void record(float[] x) {
    for (int t = 0; t < trees.size(); t++) {
      record(trees.get(t), index.get(t), x);
    }
  }

  private void record(DecisionTree tree, Map<Split, Integer> numbers, float[] x) {
    Node node = tree.root();
    while (node instanceof Split split) {
      boolean goesLeft = tree.goesLeft(split, x[split.feature()]);
      int i = numbers.get(split);
      if (goesLeft) {
        left[i] = true;
      } else {
        right[i] = true;
      }
      node = goesLeft ? split.left() : split.right();
    }
  }

  int splits() {
    return left.length;
  }

  int covered() {
    int n = 0;
    for (int i = 0; i < left.length; i++) {
      if (left[i] && right[i]) {
        n++;
      }
    }
    return n;
  }

  /** Covered splits over all splits; 1.0 for a tree with no split. */
  double ratio() {
    return left.length == 0 ? 1.0 : (double) covered() / left.length;
  }
}
