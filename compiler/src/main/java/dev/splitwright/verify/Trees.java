package dev.splitwright.verify;

import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;

/** The trees of a model as the checks walk them: one tree, or an ensemble's trees in order. */
final class Trees {
  private Trees() {}

  static List<DecisionTree> of(Classifier model) {
    return model instanceof TreeEnsemble ensemble ? ensemble.trees()
        : List.of((DecisionTree) model);
  }

  /** The probes {@code perTree} makes for each tree, tree after tree. */
  static <P> List<P> probes(Classifier model, Function<DecisionTree, List<P>> perTree) {
    List<P> out = new ArrayList<>();
    for (DecisionTree tree : of(model)) {
      out.addAll(perTree.apply(tree));
    }
    return out;
  }
}
