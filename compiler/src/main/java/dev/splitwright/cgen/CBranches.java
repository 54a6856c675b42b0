package dev.splitwright.cgen;

import dev.splitwright.emit.InputKind;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.Optional;

/** The tree as nested {@code if} comparisons in one function. */
final class CBranches {
  private final DecisionTree tree;
  private final InputKind kind;
  private final CSets sets;
  private final CLeaves leaves;
  private final Optional<CFloatKeys> keys;
  private boolean readsInput;

  private CBranches(DecisionTree tree, InputKind kind, CSets sets, CLeaves leaves,
      Optional<CFloatKeys> keys) {
    this.tree = tree;
    this.kind = kind;
    this.sets = sets;
    this.leaves = leaves;
    this.keys = keys;
  }

  /** A function with {@code signature} that returns the leaf payload of {@code x}. */
  static String function(DecisionTree tree, InputKind kind, CSets sets, CLeaves leaves,
      String signature) {
    return function(tree, kind, sets, leaves, Optional.empty(), signature);
  }

  /**
   * As {@link #function(DecisionTree, InputKind, CSets, CLeaves, String)}; with {@code keys},
   * float splits compare bit patterns ({@link CFloatKeys}).
   */
  static String function(DecisionTree tree, InputKind kind, CSets sets, CLeaves leaves,
      Optional<CFloatKeys> keys, String signature) {
    CBranches writer = new CBranches(tree, kind, sets, leaves, keys);
    StringBuilder body = new StringBuilder();
    writer.node(tree.root(), body, 1);
    StringBuilder out = new StringBuilder(signature).append("\n{\n");
    if (!writer.readsInput) {
      out.append("    (void)x;\n");
    }
    return out.append(body).append("}\n\n").toString();
  }

  // Recursion here is in Java; a tree's depth is bounded far below the JVM stack.
  private void node(Node node, StringBuilder out, int level) {
    String indent = "    ".repeat(level);
    if (node instanceof Leaf leaf) {
      out.append(indent).append("return ").append(leaves.payload(leaf)).append(";\n");
      return;
    }
    Split split = (Split) node;
    out.append(indent).append("if (").append(condition(split)).append(") {\n");
    node(split.left(), out, level + 1);
    out.append(indent).append("} else {\n");
    node(split.right(), out, level + 1);
    out.append(indent).append("}\n");
  }

  private String condition(Split split) {
    String value = "x[" + split.feature() + "]";
    if (split instanceof NumericSplit numeric && keys.isPresent()) {
      readsInput = true;
      return keys.get().call(value, numeric.threshold(), split.missingLeft());
    }
    if (split instanceof NumericSplit numeric) {
      String condition = CComparison.of(numeric, kind).condition(value, split.missingLeft(), kind);
      readsInput |= condition.contains(value);
      return condition;
    }
    readsInput = true;
    CategoricalSplit categorical = (CategoricalSplit) split;
    int k = tree.schema().feature(split.feature()).categories().size();
    int at = sets.offset(k, categorical.leftCodes().toArray());
    return sets.function() + "(" + value + ", " + at + "u, " + (split.missingLeft() ? 1 : 0)
        + ")";
  }
}
