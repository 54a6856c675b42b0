package dev.splitwright.model;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * An immutable trained classification tree over a {@link Schema}. {@link #predict} is the oracle
 * that emitted code is verified against.
 */
public final class DecisionTree implements Classifier {
  /**
   * Deepest tree the pipeline takes, trained ({@code --max-depth}) or read from a model file: the
   * emitter and javac's parser recurse once per level (see {@code cli.Limits}).
   */
  public static final int MAX_DEPTH = 100;

  private final Schema schema;
  private final Node root;
  private final int depth;
  private final int leaves;
  private final int internalNodes;

  /**
   * Creates a tree, checking that every split names a feature of the schema with the right kind and
   * every count vector has one entry per class.
   */
  public DecisionTree(Schema schema, Node root) {
    this.schema = Objects.requireNonNull(schema, "schema");
    this.root = Objects.requireNonNull(root, "root");
    int[] stats = new int[3];
    check(root, 0, stats);
    this.depth = stats[0];
    this.leaves = stats[1];
    this.internalNodes = stats[2];
  }

  private void check(Node node, int level, int[] stats) {
    // Iterative over the left spine would save stack, but trees are capped far below the default
    // stack depth (a depth of thousands is needed to overflow).
    if (node.counts().classCount() != schema.classCount()) {
      throw new IllegalArgumentException("node counts have " + node.counts().classCount()
          + " classes, schema has " + schema.classCount());
    }
    stats[0] = Math.max(stats[0], level);
    if (node instanceof Split split) {
      if (split.feature() >= schema.featureCount()) {
        throw new IllegalArgumentException("split on feature " + split.feature()
            + " but schema has " + schema.featureCount() + " features");
      }
      boolean categorical = schema.feature(split.feature()).isCategorical();
      if (categorical != (split instanceof CategoricalSplit)) {
        throw new IllegalArgumentException("split kind does not match feature '"
            + schema.feature(split.feature()).name() + "'");
      }
      stats[2]++;
      check(split.left(), level + 1, stats);
      check(split.right(), level + 1, stats);
    } else {
      stats[1]++;
    }
  }

  @Override
  public Schema schema() {
    return schema;
  }

  public Node root() {
    return root;
  }

  /** Longest root-to-leaf path, counted in splits (a single leaf has depth 0). */
  public int depth() {
    return depth;
  }

  public int leafCount() {
    return leaves;
  }

  public int internalNodeCount() {
    return internalNodes;
  }

  @Override
  public int predict(float[] x) {
    return leafFor(x).prediction();
  }

  /** Returns the leaf that input {@code x} reaches. */
  public Leaf leafFor(float[] x) {
    Node node = root;
    while (node instanceof Split split) {
      node = goesLeft(split, x[split.feature()]) ? split.left() : split.right();
    }
    return (Leaf) node;
  }

  /** Tells whether {@code value} goes left at {@code split}, missing values included. */
  public boolean goesLeft(Split split, float value) {
    Feature feature = schema.feature(split.feature());
    return feature.isMissing(value) ? split.missingLeft() : split.goesLeftPresent(value);
  }

  /** {@link #probabilities} narrowed to float, each value rounded once. */
  @Override
  public float[] floatProbabilities(float[] x) {
    double[] p = probabilities(x);
    float[] narrowed = new float[p.length];
    for (int c = 0; c < p.length; c++) {
      narrowed[c] = (float) p[c];
    }
    return narrowed;
  }

  /** Returns the leaf's class frequencies for input {@code x} (counts divided by their total). */
  public double[] probabilities(float[] x) {
    ClassCounts counts = leafFor(x).counts();
    double total = counts.total();
    double[] p = new double[counts.classCount()];
    for (int c = 0; c < p.length; c++) {
      p[c] = total == 0 ? 0 : counts.get(c) / total;
    }
    return p;
  }

  /** Returns every split in pre-order (node, left subtree, right subtree). */
  public List<Split> splitsPreOrder() {
    List<Split> out = new ArrayList<>();
    collect(root, out);
    return out;
  }

  private static void collect(Node node, List<Split> out) {
    if (node instanceof Split split) {
      out.add(split);
      collect(split.left(), out);
      collect(split.right(), out);
    }
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof DecisionTree other
        && schema.equals(other.schema) && root.equals(other.root);
  }

  @Override
  public int hashCode() {
    return Objects.hash(schema, root);
  }
}
