package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import java.util.Comparator;
import java.util.PriorityQueue;

/**
 * Grows one tree best-first: the expandable leaf whose split removes the most impurity (weighted
 * by its share of the root's weight) is split next, earlier-created nodes first on ties. Without a
 * leaf limit every expandable leaf is split, so the order does not change the tree.
 */
final class TreeGrower {
  /** A split must remove more than this fraction of the node's impurity mass. */
  static final double RELATIVE_MIN_DECREASE = 1e-12;

  private static final Comparator<GrowingNode> BEST_FIRST =
      Comparator.comparingDouble((GrowingNode n) -> -n.choice.gain)
          .thenComparingInt(n -> n.id);

  private final Schema schema;
  private final int[] rootCounts;
  /** Rows in the columns, repeats counted. */
  private final int sampleSize;
  private final TrainingOptions options;
  private final double[] classWeights;
  private final SortedColumns columns;
  private final Criterion criterion;
  private final SplitSearch search;
  /** One bit a row (see {@link SortedColumns#partition}): set when the row goes left. */
  private final long[] goesLeft;
  private final double rootWeight;
  private int nextId;

  TreeGrower(Dataset data, TrainingOptions options) {
    this(data.schema(), SortedColumns.of(data), data.classCounts(), data.rows(), options,
        options.weights().resolve(data), null);
  }

  /**
   * A grower over columns already sorted, possibly of a sample with repeated rows (see {@link
   * SortedColumns#resample}); the grower partitions them in place.
   *
   * @param rootCounts rows of each class in {@code columns}
   * @param rowIds one more than the largest row index {@code columns} holds
   * @param classWeights the resolved class weights
   * @param sampler the features each node may split on, or {@code null} for all
   */
  TreeGrower(Schema schema, SortedColumns columns, int[] rootCounts, int rowIds,
      TrainingOptions options, double[] classWeights, FeatureSampler sampler) {
    this.schema = schema;
    this.rootCounts = rootCounts;
    this.options = options;
    this.classWeights = classWeights;
    this.columns = columns;
    int size = 0;
    for (int c : rootCounts) {
      size += c;
    }
    this.sampleSize = size;
    this.criterion = new Criterion(options.impurity(), classWeights, size);
    this.search = new SplitSearch(columns, schema, criterion, options.minLeaf(), sampler);
    this.goesLeft = new long[(rowIds + 63) >>> 6];
    this.rootWeight = criterion.weight(rootCounts);
  }

  DecisionTree grow() {
    GrowingNode root = newNode(0, 0, sampleSize, rootCounts.clone());
    PriorityQueue<GrowingNode> frontier = new PriorityQueue<>(BEST_FIRST);
    if (chooseSplit(root)) {
      frontier.add(root);
    }
    int leaves = 1;
    while (!frontier.isEmpty() && leaves < options.maxLeaves()) {
      GrowingNode node = frontier.poll();
      leaves++;
      // The last allowed split's children stay leaves: no need to search them.
      expand(node, leaves < options.maxLeaves());
      if (node.left.choice != null) {
        frontier.add(node.left);
      }
      if (node.right.choice != null) {
        frontier.add(node.right);
      }
    }
    return new DecisionTree(schema, toNode(root));
  }

  private GrowingNode newNode(int depth, int lo, int hi, int[] counts) {
    return new GrowingNode(nextId++, depth, lo, hi, counts);
  }

  private boolean splittable(GrowingNode node) {
    return node.depth < options.maxDepth() && node.rows() >= 2 * options.minLeaf() && !node.pure();
  }

  /** Searches the node's best split; returns whether it is worth making. */
  private boolean chooseSplit(GrowingNode node) {
    SplitChoice choice = search.best(node);
    if (choice == null) {
      return false;
    }
    double own = criterion.cost(node.counts);
    double decrease = own - choice.cost;
    if (decrease <= RELATIVE_MIN_DECREASE * own) {
      return false;
    }
    choice.gain = decrease / rootWeight;
    node.choice = choice;
    return true;
  }

  private void expand(GrowingNode node, boolean searchChildren) {
    SplitChoice choice = node.choice;
    int[] rows = columns.rows[choice.feature];
    float[] values = columns.values[choice.feature];
    char[] labels = columns.labels[choice.feature];
    boolean[] leftCode = null;
    if (choice.categorical()) {
      leftCode = new boolean[schema.feature(choice.feature).categories().size()];
      for (int code : choice.leftCodes) {
        leftCode[code] = true;
      }
    }
    int[] leftCounts = new int[node.counts.length];
    int nLeft = 0;
    boolean anyMissing = false;
    for (int i = node.lo; i < node.hi; i++) {
      float v = values[i];
      boolean left;
      if (Float.isNaN(v)) {
        anyMissing = true;
        left = choice.missingLeft;
      } else if (leftCode != null) {
        left = leftCode[(int) v];
      } else {
        left = v <= choice.threshold;
      }
      int row = rows[i];
      long bit = 1L << row;
      goesLeft[row >>> 6] = left ? goesLeft[row >>> 6] | bit : goesLeft[row >>> 6] & ~bit;
      if (left) {
        leftCounts[labels[i]]++;
        nLeft++;
      }
    }
    int[] rightCounts = new int[leftCounts.length];
    for (int c = 0; c < rightCounts.length; c++) {
      rightCounts[c] = node.counts[c] - leftCounts[c];
    }
    int mid = node.lo + nLeft;
    node.left = newNode(node.depth + 1, node.lo, mid, leftCounts);
    node.right = newNode(node.depth + 1, mid, node.hi, rightCounts);
    boolean searchLeft = searchChildren && splittable(node.left);
    boolean searchRight = searchChildren && splittable(node.right);
    if (searchLeft || searchRight) {
      // A numeric split's own feature is sorted: present rows at most the threshold come first,
      // then the others, then the missing ones; only missing rows going left would have to move.
      boolean sorted = !choice.categorical() && !(anyMissing && choice.missingLeft);
      columns.partition(node.lo, node.hi, goesLeft, searchLeft, searchRight,
          sorted ? choice.feature : -1);
      if (searchLeft) {
        chooseSplit(node.left);
      }
      if (searchRight) {
        chooseSplit(node.right);
      }
    }
  }

  private Node toNode(GrowingNode node) {
    ClassCounts counts = ClassCounts.of(node.counts);
    if (!node.expanded()) {
      return new Leaf(counts.weightedMajority(classWeights), counts);
    }
    SplitChoice c = node.choice;
    Node left = toNode(node.left);
    Node right = toNode(node.right);
    if (c.categorical()) {
      return new CategoricalSplit(
          c.feature, CategoricalSplit.CodeSet.of(c.leftCodes), c.missingLeft, left, right, counts);
    }
    return new NumericSplit(c.feature, c.threshold, c.missingLeft, left, right, counts);
  }
}
