package dev.splitwright.train;

import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Minimal cost-complexity pruning (Breiman, Friedman, Olshen and Stone 1984, chapter 3).
 *
 * <p>The cost R(t) of a node is the class-weighted training rows it would misclassify as a leaf,
 * divided by the root's weight. For an internal node g(t) = (R(t) - R(T_t)) / (|leaves(T_t)| - 1)
 * is the complexity price at which its subtree stops paying for itself. The sequence starts with
 * T1 (the full tree with every split that does not lower the cost removed, at alpha 0) and
 * repeatedly collapses all nodes of minimal g at once, ending with the root alone. A collapsed
 * node becomes a leaf predicting its weighted majority class.
 */
public final class PruningPath {
  /** Costs lie in [0, 1]; g values closer than this count as equal. */
  static final double TOLERANCE = 1e-12;

  private PruningPath() {}

  /**
   * Computes the pruning sequence of {@code fullTree} with class weights resolved from its root
   * counts (the training rows).
   *
   * @throws IllegalArgumentException if the weights name a label the tree's schema lacks
   */
  public static List<PrunedTree> of(DecisionTree fullTree, ClassWeights weights) {
    Objects.requireNonNull(fullTree, "fullTree");
    Objects.requireNonNull(weights, "weights");
    Schema schema = fullTree.schema();
    return of(fullTree, weights.resolve(schema, fullTree.root().counts().toArray()));
  }

  /** Computes the pruning sequence of {@code fullTree}, in increasing alpha. */
  public static List<PrunedTree> of(DecisionTree fullTree, double[] classWeights) {
    Objects.requireNonNull(fullTree, "fullTree");
    double[] w = checkWeights(fullTree.schema(), classWeights);
    Work root = Work.of(fullTree.root(), w, weightOf(fullTree.root(), w));
    root.collapseWhereNoGain();
    List<PrunedTree> path = new ArrayList<>();
    path.add(new PrunedTree(0, new DecisionTree(fullTree.schema(), root.toNode(w))));
    double previous = 0;
    while (!root.isLeaf()) {
      double alpha = Math.max(previous, root.minimalPrice());
      root.collapseAtPrice(alpha + TOLERANCE);
      path.add(new PrunedTree(alpha, new DecisionTree(fullTree.schema(), root.toNode(w))));
      previous = alpha;
    }
    return List.copyOf(path);
  }

  /**
   * Returns the smallest subtree of the sequence that minimises R_alpha(T) = R(T) + alpha |leaves|:
   * the last entry whose alpha does not exceed {@code alpha}.
   */
  public static DecisionTree prune(DecisionTree fullTree, double[] classWeights, double alpha) {
    if (!(alpha >= 0)) {
      throw new IllegalArgumentException("alpha must be non-negative, but it is " + alpha);
    }
    DecisionTree chosen = null;
    for (PrunedTree step : of(fullTree, classWeights)) {
      if (step.alpha() <= alpha + TOLERANCE) {
        chosen = step.tree();
      }
    }
    return chosen;
  }

  private static double[] checkWeights(Schema schema, double[] classWeights) {
    Objects.requireNonNull(classWeights, "classWeights");
    if (classWeights.length != schema.classCount()) {
      throw new IllegalArgumentException("expected " + schema.classCount()
          + " class weights but got " + classWeights.length);
    }
    for (double x : classWeights) {
      if (!(x > 0) || Double.isInfinite(x)) {
        throw new IllegalArgumentException(
            "class weights must be positive and finite, but one is " + x);
      }
    }
    return classWeights.clone();
  }

  private static double weightOf(Node node, double[] w) {
    double total = 0;
    for (int c = 0; c < w.length; c++) {
      total += w[c] * node.counts().get(c);
    }
    return total;
  }

  /** A mutable mirror of the tree for pruning; {@code collapsed} turns a split into a leaf. */
  private static final class Work {
    final Node original;
    /** R(t): this node's cost as a leaf. */
    final double leafCost;
    final Work left;
    final Work right;
    boolean collapsed;
    /** Filled by {@link #refresh()}: R(T_t) and |leaves(T_t)| of the current subtree. */
    double subtreeCost;
    int leaves;

    private Work(Node original, double leafCost, Work left, Work right) {
      this.original = original;
      this.leafCost = leafCost;
      this.left = left;
      this.right = right;
    }

    static Work of(Node node, double[] w, double rootWeight) {
      double own = weightOf(node, w);
      int[] counts = node.counts().toArray();
      int majority = TreeGrower.weightedMajority(counts, w);
      double kept = w[majority] * counts[majority];
      double cost = rootWeight > 0 ? (own - kept) / rootWeight : 0;
      if (node instanceof Split split) {
        return new Work(
            node, cost, of(split.left(), w, rootWeight), of(split.right(), w, rootWeight));
      }
      return new Work(node, cost, null, null);
    }

    boolean isLeaf() {
      return left == null || collapsed;
    }

    /** Recomputes subtree cost and leaf count below this node. */
    void refresh() {
      if (isLeaf()) {
        subtreeCost = leafCost;
        leaves = 1;
        return;
      }
      left.refresh();
      right.refresh();
      subtreeCost = left.subtreeCost + right.subtreeCost;
      leaves = left.leaves + right.leaves;
    }

    /** Turns T_max into T1: collapses, bottom-up, every split that leaves the cost unchanged. */
    void collapseWhereNoGain() {
      if (isLeaf()) {
        subtreeCost = leafCost;
        leaves = 1;
        return;
      }
      left.collapseWhereNoGain();
      right.collapseWhereNoGain();
      subtreeCost = left.subtreeCost + right.subtreeCost;
      leaves = left.leaves + right.leaves;
      if (leafCost <= subtreeCost + TOLERANCE) {
        collapsed = true;
        subtreeCost = leafCost;
        leaves = 1;
      }
    }

    /** The smallest g(t) over internal nodes of the current tree. */
    double minimalPrice() {
      refresh();
      return minPrice();
    }

    private double minPrice() {
      if (isLeaf()) {
        return Double.POSITIVE_INFINITY;
      }
      double g = (leafCost - subtreeCost) / (leaves - 1);
      return Math.min(g, Math.min(left.minPrice(), right.minPrice()));
    }

    /** Collapses every internal node whose g(t) is at most {@code price}, outermost first. */
    void collapseAtPrice(double price) {
      refresh();
      collapseWalk(price);
    }

    private void collapseWalk(double price) {
      if (isLeaf()) {
        return;
      }
      if ((leafCost - subtreeCost) / (leaves - 1) <= price) {
        collapsed = true;
        return;
      }
      left.collapseWalk(price);
      right.collapseWalk(price);
    }

    Node toNode(double[] w) {
      if (left == null) {
        return original;
      }
      if (collapsed) {
        int[] counts = original.counts().toArray();
        return new Leaf(TreeGrower.weightedMajority(counts, w), original.counts());
      }
      Node l = left.toNode(w);
      Node r = right.toNode(w);
      if (original instanceof NumericSplit s) {
        return l == s.left() && r == s.right()
            ? s
            : new NumericSplit(s.feature(), s.threshold(), s.missingLeft(), l, r, s.counts());
      }
      CategoricalSplit s = (CategoricalSplit) original;
      return l == s.left() && r == s.right()
          ? s
          : new CategoricalSplit(s.feature(), s.leftCodes(), s.missingLeft(), l, r, s.counts());
    }
  }
}
