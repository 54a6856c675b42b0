package dev.splitwright.verify;

import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Node;
import dev.splitwright.model.Split;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;

/** Counts the splits whose both sides some input took, walking the model as the code would. */
final class Coverage {
  private final DecisionTree tree;
  private final Map<Split, Integer> index = new IdentityHashMap<>();
  private final boolean[] left;
  private final boolean[] right;

  Coverage(DecisionTree tree) {
    this.tree = tree;
    List<Split> splits = tree.splitsPreOrder();
    for (int i = 0; i < splits.size(); i++) {
      index.put(splits.get(i), i);
    }
    left = new boolean[splits.size()];
    right = new boolean[splits.size()];
  }

  void record(float[] x) {
    Node node = tree.root();
    while (node instanceof Split split) {
      boolean goesLeft = tree.goesLeft(split, x[split.feature()]);
      int i = index.get(split);
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
