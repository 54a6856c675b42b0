package dev.splitwright.select;

import dev.splitwright.model.DecisionTree;
import java.util.Objects;

/** A distinct tree of the search before it is scored and measured. */
record Generated(int index, Setting setting, DecisionTree tree) {

  Generated {
    Objects.requireNonNull(setting, "setting");
    Objects.requireNonNull(tree, "tree");
  }
}
