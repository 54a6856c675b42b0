package dev.splitwright.emit;

import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.ToIntFunction;

/**
 * One tree padded to the complete binary tree of its depth D, for the {@code flat} layout: a walk
 * of exactly D steps where step {@code i = 2 * i + 1 + right} takes the comparison's outcome as a
 * number, so the walk never branches on it. Slot {@code i} (0 to 2^D - 2) is a split, leaf slot
 * {@code j} (0 to 2^D - 1) is complete-tree slot {@code 2^D - 1 + j}. A real leaf above depth D
 * fills every leaf slot beneath it; the padding splits below it may send either way.
 *
 * <p>The thresholds are stored as order keys, so one signed integer comparison decides: for float
 * input the IEEE 754 bits with the magnitude bits of negative values flipped ({@link #floatKey}),
 * for double input the same on 64 bits, for int input the largest int at or below the threshold
 * ({@link Thresholds#forInt}). The Java and C writers both read this one form; an ensemble is a
 * list of them.
 */
public final class FlatTree {
  /** The deepest tree the layout takes: 2^16 leaf slots already weigh 256 KiB as ints. */
  public static final int MAX_DEPTH = 16;

  /** Per split slot: the node word has the feature above these two flag bits. */
  public static final int FEATURE_SHIFT = 2;
  /** In the node word: the split is categorical. */
  public static final int CATEGORICAL = 2;
  /** In the node word of a numeric split: NaN goes right. */
  public static final int NAN_RIGHT = 1;

  private final int depth;
  private final int[] node;
  private final long[] key;
  private final List<int[]> sets;
  private final int[] setOf;
  private final int[] leaf;
  private final List<Slot> preOrder;

  /**
   * A real node and its slot, listed in pre-order: a packed form can leave the slots out, since a
   * split's left child is the next entry and the node after a leaf is the right child of the latest
   * split whose right child is still open.
   */
  public record Slot(int index, Node node) {
    public Slot {
      Objects.requireNonNull(node, "node");
    }
  }

  private FlatTree(int depth) {
    this.depth = depth;
    int splits = (1 << depth) - 1;
    this.node = new int[splits];
    this.key = new long[splits];
    this.setOf = new int[splits];
    this.sets = new ArrayList<>();
    this.leaf = new int[1 << depth];
    this.preOrder = new ArrayList<>();
  }

  /**
   * Lays {@code tree} out for {@code kind} input; {@code payload} gives what a leaf returns.
   *
   * @throws EmitLimitException if the tree is deeper than {@link #MAX_DEPTH} for this input
   */
  public static FlatTree of(DecisionTree tree, InputKind kind, ToIntFunction<Leaf> payload) {
    return of(tree, kind, payload, 0);
  }

  /**
   * Lays {@code tree} out as {@link #of(DecisionTree, InputKind, ToIntFunction)} does, padded to
   * at least {@code depth}: the trees of an ensemble then share one walk of a fixed length.
   *
   * @throws EmitLimitException if the tree is deeper than {@link #MAX_DEPTH} for this input
   */
  public static FlatTree of(DecisionTree tree, InputKind kind, ToIntFunction<Leaf> payload,
      int depth) {
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(payload, "payload");
    if (depth < 0 || depth > MAX_DEPTH) {
      throw new IllegalArgumentException("depth must be between 0 and " + MAX_DEPTH + ", but it is "
          + depth);
    }
    Node root = kind == InputKind.INT ? withoutEmptyLeftSides(tree.root()) : tree.root();
    int padded = Math.max(depth, depthOf(root));
    if (padded > MAX_DEPTH) {
      throw new EmitLimitException("layout", "the flat layout pads the tree to a complete tree of "
          + "its depth, at most " + MAX_DEPTH + ", but the tree has depth " + padded,
          "use --layout table");
    }
    FlatTree flat = new FlatTree(padded);
    flat.place(root, 0, 0, kind, tree, payload);
    return flat;
  }

  /**
   * Drops the left side of each split that no int reaches ({@link Thresholds#forInt} has no int at
   * or below the threshold), as the table layout does; the slot keys then all fit an int.
   */
  private static Node withoutEmptyLeftSides(Node node) {
    if (node instanceof NumericSplit numeric
        && Thresholds.forInt(numeric.threshold()) == Long.MIN_VALUE) {
      return withoutEmptyLeftSides(numeric.right());
    }
    if (node instanceof Split split) {
      return split.withChildren(withoutEmptyLeftSides(split.left()),
          withoutEmptyLeftSides(split.right()));
    }
    return node;
  }

  private static int depthOf(Node node) {
    return node instanceof Split split
        ? 1 + Math.max(depthOf(split.left()), depthOf(split.right())) : 0;
  }

  private void place(Node n, int slot, int level, InputKind kind, DecisionTree tree,
      ToIntFunction<Leaf> payload) {
    preOrder.add(new Slot(slot, n));
    if (n instanceof Leaf l) {
      int span = depth - level;
      int first = ((slot + 1) << span) - (1 << depth);
      int result = payload.applyAsInt(l);
      for (int j = first; j < first + (1 << span); j++) {
        leaf[j] = result;
      }
      return;
    }
    Split split = (Split) n;
    if (split instanceof NumericSplit numeric) {
      node[slot] = split.feature() << FEATURE_SHIFT | (split.missingLeft() ? 0 : NAN_RIGHT);
      key[slot] = switch (kind) {
        case FLOAT -> floatKey(numeric.threshold());
        case DOUBLE -> doubleKey(Thresholds.forDouble(numeric.threshold()));
        case INT -> Thresholds.forInt(numeric.threshold());
      };
    } else {
      CategoricalSplit categorical = (CategoricalSplit) split;
      node[slot] = split.feature() << FEATURE_SHIFT | CATEGORICAL;
      int k = tree.schema().feature(split.feature()).categories().size();
      int[] right = new int[k / 32 + 1];
      for (int code = 0; code < k; code++) {
        if (!categorical.leftCodes().contains(code)) {
          right[code >>> 5] |= 1 << (code & 31);
        }
      }
      if (!split.missingLeft()) {
        right[k >>> 5] |= 1 << (k & 31);
      }
      setOf[slot] = sets.size();
      sets.add(right);
      key[slot] = k;
    }
    place(split.left(), 2 * slot + 1, level + 1, kind, tree, payload);
    place(split.right(), 2 * slot + 2, level + 1, kind, tree, payload);
  }

  /**
   * The signed order key of a float: its bits, with the magnitude bits of a negative value
   * flipped, so that for non-NaN floats {@code a < b} exactly when {@code key(a) < key(b)} (IEEE
   * 754-2019 §5.11 orders them; the bit patterns of positive floats rise with the value, §3.4).
   * Only -0.0 and +0.0 differ, -1 and 0: a threshold of -0.0 takes +0.0's key so that both zeros
   * go left of either (they compare equal, §5.11).
   */
  public static int floatKey(float t) {
    int bits = Float.floatToRawIntBits(t == 0f ? 0f : t);
    return bits ^ ((bits >> 31) & 0x7fffffff);
  }

  /** The 64-bit form of {@link #floatKey} for a double threshold. */
  public static long doubleKey(double t) {
    long bits = Double.doubleToRawLongBits(t == 0.0 ? 0.0 : t);
    return bits ^ ((bits >> 63) & Long.MAX_VALUE);
  }

  /** The depth D: the walk takes exactly D steps. */
  public int depth() {
    return depth;
  }

  /** Split slots: {@code 2^D - 1}. */
  public int splitSlots() {
    return node.length;
  }

  /**
   * The node word of split slot {@code i}: the feature shifted by {@link #FEATURE_SHIFT}, {@link
   * #CATEGORICAL}, {@link #NAN_RIGHT}; 0 for padding.
   */
  public int node(int i) {
    return node[i];
  }

  /**
   * Slot {@code i}'s key: a numeric split goes right when the input's key is above it; for a
   * categorical split the number of categories k.
   */
  public long key(int i) {
    return key[i];
  }

  /**
   * The right-going bits of a categorical slot: bit c of word {@code c >>> 5} is set when code c
   * goes right; bit k stands for every missing or unknown code.
   */
  public int[] rightCodes(int i) {
    return sets.get(setOf[i]).clone();
  }

  /** The leaf slots' results, {@code 2^D} of them. */
  public int leaf(int j) {
    return leaf[j];
  }

  /** The real nodes with their slots in pre-order. */
  public List<Slot> preOrder() {
    return List.copyOf(preOrder);
  }

  /** Tells whether any slot is a categorical split. */
  public boolean hasCategorical() {
    return !sets.isEmpty();
  }

  /**
   * Walks the layout as the emitted code does, on float32 input: a reference for tests and the
   * definition the writers follow.
   */
  public int walk(float[] x) {
    int i = 0;
    for (int level = 0; level < depth; level++) {
      int word = node[i];
      float v = x[word >>> FEATURE_SHIFT];
      int bits = Float.floatToRawIntBits(v);
      int nan = (0x7f800000 - (bits & 0x7fffffff)) >> 31;
      int right = (int) ((key[i] - (bits ^ ((bits >> 31) & 0x7fffffff))) >>> 63);
      right = (right & ~nan) | (word & nan & NAN_RIGHT);
      if ((word & CATEGORICAL) != 0) {
        right = categoryRight(rightCodes(i), (int) key[i], v);
      }
      i = 2 * i + 1 + right;
    }
    return leaf[i - ((1 << depth) - 1)];
  }

  private static int categoryRight(int[] set, int k, float v) {
    int c = (int) v;
    int d = Float.floatToRawIntBits(c) ^ Float.floatToRawIntBits(v + 0f);
    int bad = (d | -d | c | (k - 1 - c)) >> 31;
    int code = (c & ~bad) | (k & bad);
    return (set[code >>> 5] >>> code) & 1;
  }
}
