package dev.splitwright.emit;

import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.model.TreeEnsemble;
import java.util.HashSet;
import java.util.Set;

/**
 * An upper bound of the constant pool entries javac will write for the {@code branches} layout.
 * The class file stores {@code constant_pool_count} in a u2, so at most 65,534 usable entries
 * (JVM Specification §4.1), Long and Double taking two each (§4.4.5); past that javac stops with
 * "too many constants". Counting first lets the emitter say so plainly and point to the
 * {@code table} layout, whose pool does not grow with the tree.
 */
final class ConstantCount {
  /** The largest {@code constant_pool_count} a class file can state (JVMS §4.1). */
  static final int LIMIT = 65535;
  /**
   * Entries every class has whatever the tree: this and super class, constructor, descriptors,
   * attribute names, the length-check message (generous; about 40 measured for a one-leaf tree).
   */
  private static final int FIXED = 120;

  private final Set<Integer> floats = new HashSet<>();
  private final Set<Long> doubles = new HashSet<>();
  private final Set<Integer> ints = new HashSet<>();
  private final Set<Long> longs = new HashSet<>();
  private long other = FIXED;

  /**
   * The bound for the {@code branches} layout of {@code tree}, worked out before any code is
   * written: per split its threshold or code-set constants, per helper method its name and
   * reference, per class its constant, and per label and feature a string.
   */
  static long forBranches(DecisionTree tree, InputKind input, int helperMethods,
      boolean probabilities) {
    ConstantCount count = new ConstantCount();
    count.addSplits(tree, input);
    int classes = tree.schema().classCount();
    // Leaves return a class, or with probabilities a leaf number below the leaf count.
    count.addOther(Math.max(0, (probabilities ? tree.leafCount() : classes) - Short.MAX_VALUE));
    count.addOther(3L * helperMethods);
    count.addScaffold(tree.schema());
    return count.bound();
  }

  /**
   * The bound for the {@code branches} layout of an ensemble: the splits of every tree, each
   * tree's weight, and per helper method (a tree's method, an outlined subtree, a vote chunk) its
   * name and reference.
   */
  static long forEnsemble(TreeEnsemble ensemble, InputKind input, int helperMethods) {
    ConstantCount count = new ConstantCount();
    for (int t = 0; t < ensemble.treeCount(); t++) {
      count.addSplits(ensemble.trees().get(t), input);
      count.addFloat(ensemble.weight(t));
    }
    count.addFloat(ensemble.totalWeight());
    count.addOther(3L * helperMethods);
    count.addScaffold(ensemble.schema());
    return count.bound();
  }

  private void addSplits(DecisionTree tree, InputKind input) {
    ConstantCount count = this;
    for (Split split : tree.splitsPreOrder()) {
      if (split instanceof NumericSplit numeric) {
        float t = numeric.threshold();
        switch (input) {
          case FLOAT -> count.addFloat(t);
          case DOUBLE -> count.addDouble(Thresholds.forDouble(t));
          case INT -> count.addInt(Math.max(Integer.MIN_VALUE, Thresholds.forInt(t)));
        }
        continue;
      }
      CategoricalSplit categorical = (CategoricalSplit) split;
      int k = tree.schema().feature(split.feature()).categories().size();
      count.addInt(k);
      if (k <= Long.SIZE) {
        long mask = 0;
        for (int code : categorical.leftCodes().toArray()) {
          mask |= 1L << code;
        }
        count.addLong(mask);
      } else {
        // The set's offset in SETS, if past sipush.
        count.addOther(1);
      }
    }
  }

  private void addScaffold(Schema schema) {
    ConstantCount count = this;
    int classes = schema.classCount();
    // Per class a constant's name and value; per label and feature at most a string and its text.
    count.addOther(2L * classes + 2L * (classes + schema.featureCount()));
    // Per FEATURE_ index constant, like a class constant: its name and its value.
    count.addOther(2L * schema.featureCount());
    // Per named category code constant, like a class constant: its name and its value.
    count.addOther(2L * ClassScaffold.namedCategoryCount(schema));
  }

  /** A float operand; fconst_0, fconst_1 and fconst_2 need no entry (JVMS §6.5 fconst). */
  void addFloat(float value) {
    int bits = Float.floatToRawIntBits(value);
    if (bits != 0 && value != 1f && value != 2f) {
      floats.add(bits);
    }
  }

  /** A double operand; dconst_0 and dconst_1 need no entry. */
  void addDouble(double value) {
    long bits = Double.doubleToRawLongBits(value);
    if (bits != 0 && value != 1d) {
      doubles.add(bits);
    }
  }

  /** An int operand; bipush and sipush cover -32768 to 32767 without an entry. */
  void addInt(long value) {
    if (value < Short.MIN_VALUE || value > Short.MAX_VALUE) {
      ints.add((int) value);
    }
  }

  /** A long operand; lconst_0 and lconst_1 need no entry. */
  void addLong(long value) {
    if (value != 0 && value != 1) {
      longs.add(value);
    }
  }

  /** Entries that are not deduplicated, such as a method's name and reference. */
  void addOther(long entries) {
    other += entries;
  }

  /** The bound of {@code constant_pool_count}: one more than the entries (JVMS §4.1). */
  long bound() {
    return 1 + other + floats.size() + ints.size() + 2L * (doubles.size() + longs.size());
  }

  boolean fits() {
    return bound() <= LIMIT;
  }
}
