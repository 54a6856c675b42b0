package dev.splitwright.select;

import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.Objects;

/**
 * What a candidate looks like, for ranking ties and reports.
 *
 * @param trees 1 for a single tree
 * @param depth the deepest tree's depth
 * @param leaves the leaves of all trees together
 */
public record Shape(ModelKind kind, int trees, int depth, int leaves) {

  public Shape {
    Objects.requireNonNull(kind, "kind");
  }

  /** The shape of {@code model}. */
  public static Shape of(Classifier model) {
    if (model instanceof DecisionTree tree) {
      return new Shape(ModelKind.TREE, 1, tree.depth(), tree.leafCount());
    }
    TreeEnsemble e = (TreeEnsemble) model;
    int depth = 0;
    int leaves = 0;
    for (DecisionTree tree : e.trees()) {
      depth = Math.max(depth, tree.depth());
      leaves += tree.leafCount();
    }
    ModelKind kind = e.kind() == TreeEnsemble.Kind.FOREST ? ModelKind.FOREST : ModelKind.BOOSTED;
    return new Shape(kind, e.treeCount(), depth, leaves);
  }
}
