package dev.splitwright.train;

import dev.splitwright.data.Schema;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
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
  /**
   * Relative tolerance of cost comparisons. At a node t, R(t) and R(T_t) are sums of non-negative
   * terms of at most R(t) each (R(T_t) &le; R(t)), so their rounding errors are a few ulps of R(t):
   * two costs, or a price times its leaf count, closer than {@code TOLERANCE * R(t)} count as
   * equal. An absolute bound would not do: under a heavily weighted class or with very many rows a
   * node's whole risk can be far below 1e-12 of the root's weight, and real gains were taken for
   * rounding. Alphas are compared relative to their own size.
   */
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
      root.collapseAtPrice(alpha);
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
    return at(of(fullTree, classWeights), alpha);
  }

  /**
   * Returns the last subtree of {@code path} whose alpha does not exceed {@code alpha} (up to a
   * relative {@link #TOLERANCE}); the first subtree if none does.
   */
  public static DecisionTree at(List<PrunedTree> path, double alpha) {
    Objects.requireNonNull(path, "path");
    if (path.isEmpty()) {
      throw new IllegalArgumentException("path is empty");
    }
    DecisionTree chosen = path.get(0).tree();
    for (PrunedTree step : path) {
      if (step.alpha() <= alpha + TOLERANCE * Math.abs(alpha)) {
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
      int[] counts = node.counts().toArray();
      int majority = node.counts().weightedMajority(w);
      // The weight of the other classes, summed directly: "own - kept" would leave a rounding
      // error of the node's whole weight, far above TOLERANCE * R(t) for a nearly pure node.
      double misclassified = 0;
      for (int c = 0; c < counts.length; c++) {
        misclassified += c == majority ? 0 : w[c] * counts[c];
      }
      double cost = rootWeight > 0 ? misclassified / rootWeight : 0;
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
      if (leafCost <= subtreeCost + TOLERANCE * leafCost) {
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

    /**
     * Collapses every internal node whose g(t) is at most {@code price}, up to rounding (see
     * {@code TOLERANCE}), outermost first.
     */
    void collapseAtPrice(double price) {
      refresh();
      collapseWalk(price);
    }

    private void collapseWalk(double price) {
      if (isLeaf()) {
        return;
      }
      if ((leafCost - subtreeCost) / (leaves - 1)
          <= price + TOLERANCE * leafCost / (leaves - 1)) {
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
        return Leaf.collapse(original, w);
      }
      return ((Split) original).withChildren(left.toNode(w), right.toNode(w));
    }
  }
}
