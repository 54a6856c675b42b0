package dev.splitwright.cgen;

import dev.splitwright.emit.InputKind;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * The tree as a {@code static const} array of unsigned words in pre-order, walked by a loop. The
 * encoding, in one place:
 *
 * <ul>
 *   <li>A leaf is one word, {@code payload * 2 + 1}.
 *   <li>A split is three words: {@code feature * 16 + op * 4 + missingLeft * 2}, the operand and
 *       the index of the right child; the left child follows at index + 3. {@code op} is 0 for
 *       {@code v <= t}, 1 for {@code v < t}, 2 for "any number" (see {@link CComparison}) and 3
 *       for a categorical split; the operand indexes the thresholds array, or for op 3 is the
 *       set's offset in the sets array ({@link CSets}).
 * </ul>
 *
 * Every child comes after its parent, so the index grows on each step and the walk ends within
 * the array. Words take the smallest unsigned type that holds them all.
 */
final class CTable {
  static final int LEAF = 1;
  static final int MISSING_LEFT = 2;
  static final int OP_SHIFT = 2;
  static final int FEATURE_SHIFT = 4;
  static final int CATEGORICAL = 3;

  private final DecisionTree tree;
  private final InputKind kind;
  private final CSets sets;
  private final CLeaves leaves;
  private final List<Long> words = new ArrayList<>();
  private final Map<Long, Integer> thresholdIndex = new LinkedHashMap<>();
  private final List<String> thresholds = new ArrayList<>();
  private final Set<CComparison.Op> ops = EnumSet.noneOf(CComparison.Op.class);
  private final Optional<CFloatKeys> keys;

  private CTable(DecisionTree tree, InputKind kind, CSets sets, CLeaves leaves,
      Optional<CFloatKeys> keys) {
    this.tree = tree;
    this.kind = kind;
    this.sets = sets;
    this.leaves = leaves;
    this.keys = keys;
  }

  /**
   * All trees of an ensemble packed into one table: the words of tree 0, then tree 1, ..., with
   * shared thresholds, and one walk function with {@code walkSignature}, whose second parameter
   * {@code uint32_t i} is the index a tree starts at. Returns the code and, through {@code roots},
   * each tree's start index.
   */
  static String packed(List<DecisionTree> trees, InputKind kind, CSets sets, CLeaves leaves,
      Optional<CFloatKeys> keys, String prefix, String walkSignature, List<Long> roots) {
    CTable table = new CTable(trees.get(0), kind, sets, leaves, keys);
    for (DecisionTree tree : trees) {
      roots.add((long) table.words.size());
      table.encode(tree.root());
    }
    return table.write(prefix, walkSignature, null);
  }

  /** The tables and a function with {@code signature} that returns the leaf payload of x. */
  static String function(DecisionTree tree, InputKind kind, CSets sets, CLeaves leaves,
      String prefix, String signature) {
    return function(tree, kind, sets, leaves, Optional.empty(), prefix, signature);
  }

  /**
   * As {@link #function(DecisionTree, InputKind, CSets, CLeaves, String, String)}; with {@code
   * keys}, every float split is op 0 on a threshold key ({@link CFloatKeys}).
   */
  static String function(DecisionTree tree, InputKind kind, CSets sets, CLeaves leaves,
      Optional<CFloatKeys> keys, String prefix, String signature) {
    CTable table = new CTable(tree, kind, sets, leaves, keys);
    table.encode(tree.root());
    return table.write(prefix, signature, "0");
  }

  // Recursion in Java only; the tree depth is bounded far below the JVM stack.
  private void encode(Node node) {
    if (node instanceof Leaf leaf) {
      words.add((long) leaves.payload(leaf) * 2 + LEAF);
      return;
    }
    Split split = (Split) node;
    int at = words.size();
    long op;
    long operand;
    if (split instanceof NumericSplit numeric && keys.isPresent()) {
      keys.get().use();
      ops.add(CComparison.Op.AT_MOST);
      op = CComparison.Op.AT_MOST.ordinal();
      long key = CFloatKeys.key(numeric.threshold());
      operand = thresholdIndex.computeIfAbsent(key, k -> {
        thresholds.add(CFloatKeys.constant(numeric.threshold()));
        return thresholds.size() - 1;
      });
    } else if (split instanceof NumericSplit numeric) {
      CComparison comparison = CComparison.of(numeric, kind);
      ops.add(comparison.op());
      op = comparison.op().ordinal();
      operand = threshold(comparison);
    } else {
      int k = tree.schema().feature(split.feature()).categories().size();
      op = CATEGORICAL;
      operand = sets.offset(k, ((CategoricalSplit) split).leftCodes().toArray());
    }
    words.add(((long) split.feature() << FEATURE_SHIFT) + (op << OP_SHIFT)
        + (split.missingLeft() ? MISSING_LEFT : 0));
    words.add(operand);
    words.add(0L);
    encode(split.left());
    words.set(at + 2, (long) words.size());
    encode(split.right());
  }

  private int threshold(CComparison comparison) {
    long key = kind == InputKind.INT ? comparison.intOperand()
        : Float.floatToRawIntBits(comparison.floatOperand());
    return thresholdIndex.computeIfAbsent(key, k -> {
      thresholds.add(comparison.operand(kind));
      return thresholds.size() - 1;
    });
  }

  /**
   * The arrays and the walk; {@code start} is the first index, or null when the function takes it
   * as its parameter {@code i} (a packed ensemble).
   */
  private String write(String prefix, String signature, String start) {
    StringBuilder out = new StringBuilder();
    String treeName = prefix + "_tree";
    String thresholdName = prefix + "_thresholds";
    out.append("/*\n * The tree in pre-order. A leaf is one word, payload * 2 + 1. A split is\n"
        + " * three words: feature * 16 + op * 4 + missing_left * 2, the operand and the\n"
        + " * index of the right child; the left child follows it. op 0: x <= t, 1: x < t,\n"
        + " * 2: any number (t = +Infinity), 3: category in the set at operand; t is\n"
        + " * thresholds[operand]. A child always comes after its parent.\n */\n");
    CArrays.writeUnsigned(out, treeName, words);
    if (!thresholds.isEmpty()) {
      CArrays.write(out, keys.isPresent() ? "uint32_t" : kind == InputKind.INT ? "int32_t"
          : "float", thresholdName, thresholds, kind == InputKind.INT ? 8 : 3);
    }
    out.append(signature).append("\n{\n");
    boolean splits = words.stream().anyMatch(w -> (w & LEAF) == 0);
    if (!splits) {
      out.append("    (void)x;\n    return (int)(").append(treeName).append("[")
          .append(start == null ? "i" : start).append("] >> 1);\n}\n\n");
      return out.toString();
    }
    String element = kind == InputKind.INT ? "int32_t" : "float";
    if (start != null) {
      out.append("    uint32_t i = ").append(start).append(";\n");
    }
    out.append("    for (;;) {\n")
        .append("        const uint32_t w = ").append(treeName).append("[i];\n")
        .append("        uint32_t operand;\n")
        .append("        int left;\n")
        .append("        ").append(element).append(" v;\n")
        .append("        if (w & 1u) {\n            return (int)(w >> 1);\n        }\n")
        .append("        operand = ").append(treeName).append("[i + 1u];\n")
        .append("        v = x[w >> 4];\n")
        .append("        switch ((w >> 2) & 3u) {\n");
    for (CComparison.Op op : ops) {
      String t = thresholdName + "[operand]";
      out.append("        case ").append(op.ordinal()).append("u:\n");
      if (keys.isPresent()) {
        out.append("            left = ").append(keys.get().function()).append("(v, ").append(t)
            .append(", (int)((w >> 1) & 1u));\n");
      } else if (kind == InputKind.INT) {
        out.append("            left = v ").append(op == CComparison.Op.BELOW ? "<" : "<=")
            .append(' ').append(t).append(";\n");
      } else {
        // NaN fails every ordered comparison (IEEE 754-2008 5.11): the negated form sends it left.
        String missing = switch (op) {
          case AT_MOST -> "!(v > " + t + ")";
          case BELOW -> "!(v >= " + t + ")";
          case ANY_NUMBER -> "1";
        };
        String present = switch (op) {
          case AT_MOST -> "v <= " + t;
          case BELOW -> "v < " + t;
          case ANY_NUMBER -> "v <= " + t + " || v > " + t;
        };
        out.append("            left = (w & 2u) ? ").append(missing).append(" : (")
            .append(present).append(");\n");
      }
      out.append("            break;\n");
    }
    if (!sets.isEmpty()) {
      out.append("        case 3u:\n            left = ").append(sets.function())
          .append("(v, operand, (int)((w >> 1) & 1u));\n            break;\n");
    }
    out.append("        default:\n            left = 0;\n            break;\n        }\n")
        .append("        i = left ? i + 3u : ").append(treeName).append("[i + 2u];\n")
        .append("    }\n}\n\n");
    return out.toString();
  }
}
