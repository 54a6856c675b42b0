package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Minimal cost-complexity pruning, Breiman, Friedman, Olshen and Stone (1984), chapter 3. */
class PruningPathTest {
  private static final Schema SCHEMA =
      new Schema(List.of(Feature.numeric("x")), "y", List.of("A", "B"));
  private static final double[] EQUAL = {1, 1};

  private static Leaf leaf(int prediction, int a, int b) {
    return new Leaf(prediction, ClassCounts.of(a, b));
  }

  private static NumericSplit split(float t, Node left, Node right) {
    int[] l = left.counts().toArray();
    int[] r = right.counts().toArray();
    return new NumericSplit(0, t, false, left, right, ClassCounts.of(l[0] + r[0], l[1] + r[1]));
  }

  /**
   * t1 [10,10] splits into t2 [8,2] (leaves [8,0], [0,2]) and t3 [2,8]; t3 into t6 [1,7] (leaves
   * [1,3], [0,4]) and t7 [1,1] (leaves [1,0], [0,1]).
   */
  private static final Node T6 = split(6, leaf(1, 1, 3), leaf(1, 0, 4));
  private static final Node T7 = split(9, leaf(0, 1, 0), leaf(1, 0, 1));
  private static final Node T2 = split(2, leaf(0, 8, 0), leaf(1, 0, 2));
  private static final Node FULL = split(5, T2, split(8, T6, T7));

  @Test
  void followsHandWorkedSequence() {
    // Worked by hand, R(t) = misclassified rows / 20: R(t1) = .5, R(t2) = R(t3) = .1, R(t6) =
    // R(t7) = .05, R([1,3]) = .05, other leaves 0.
    // T1: t6's split leaves its cost at .05, so it is removed at alpha 0; 5 leaves, R = .05.
    // g(t2) = .1/1 = .1; g(t7) = .05/1 = .05; g(t3) = (.1 - .05)/2 = .025; g(t1) = (.5 - .05)/4 =
    // .1125. Weakest link t3 at alpha .025. Then g(t2) = .1, g(t1) = (.5 - .1)/2 = .2: prune t2 at
    // .1. Then g(t1) = (.5 - .2)/1 = .3: the root alone at .3.
    List<PrunedTree> path = PruningPath.of(new DecisionTree(SCHEMA, FULL), EQUAL);

    assertThat(path).extracting(PrunedTree::alpha).hasSize(4);
    double[] alphas = {0, 0.025, 0.1, 0.3};
    for (int i = 0; i < alphas.length; i++) {
      assertThat(path.get(i).alpha()).isCloseTo(alphas[i], within(1e-12));
    }
    Node t1 = split(5, T2, split(8, leaf(1, 1, 7), T7));
    Node t2 = split(5, T2, leaf(1, 2, 8));
    Node t3 = split(5, leaf(0, 8, 2), leaf(1, 2, 8));
    Node t4 = leaf(0, 10, 10); // a tie predicts the lower class index
    assertThat(path).extracting(PrunedTree::tree).containsExactly(
        new DecisionTree(SCHEMA, t1),
        new DecisionTree(SCHEMA, t2),
        new DecisionTree(SCHEMA, t3),
        new DecisionTree(SCHEMA, t4));
  }

  @Test
  void prunesAllWeakestLinksAtOnce() {
    // Worked by hand: both children of the root cost .1 as leaves and 0 as subtrees, so both have
    // g = .1 and go together; then the root at g = (.5 - .2)/1 = .3.
    Node full =
        split(5, split(2, leaf(0, 8, 0), leaf(1, 0, 2)), split(8, leaf(0, 2, 0), leaf(1, 0, 8)));
    List<PrunedTree> path = PruningPath.of(new DecisionTree(SCHEMA, full), EQUAL);
    assertThat(path).hasSize(3);
    assertThat(path.get(1).alpha()).isCloseTo(0.1, within(1e-12));
    assertThat(path.get(1).tree().root())
        .isEqualTo(split(5, leaf(0, 8, 2), leaf(1, 2, 8)));
    assertThat(path.get(2).alpha()).isCloseTo(0.3, within(1e-12));
  }

  /**
   * Risks far below 1e-12 of the root's weight: an absolute tolerance took the right node's real
   * gain for rounding and collapsed it in T1. Worked by hand, classes [a, b, c] weighted [1000, 1,
   * 1], root [2e9, 2, 1] of weight W = 2e12 + 3: left leaf [2e9, 0, 0]; right node [0, 2, 1] costs
   * 1/W as a leaf (predicting b) and 0 split into [0, 2, 0] | [0, 0, 1]. So T1 is the full tree
   * (3 leaves, R = 0), g(right) = 1/W (about 5e-13), g(root) = (3/W)/2; the right node goes at
   * alpha 1/W, then g(root) = (3/W - 1/W)/1 = 2/W.
   */
  @Test
  void smallRisksUnderHeavyWeightsAreNotTakenForRounding() {
    Schema schema = new Schema(List.of(Feature.numeric("x")), "y", List.of("a", "b", "c"));
    Node right = new NumericSplit(0, 2, false, new Leaf(1, ClassCounts.of(0, 2, 0)),
        new Leaf(2, ClassCounts.of(0, 0, 1)), ClassCounts.of(0, 2, 1));
    Node root = new NumericSplit(0, 1, false, new Leaf(0, ClassCounts.of(2_000_000_000, 0, 0)),
        right, ClassCounts.of(2_000_000_000, 2, 1));
    double[] w = {1000, 1, 1};
    double rootWeight = 2e12 + 3;

    List<PrunedTree> path = PruningPath.of(new DecisionTree(schema, root), w);

    assertThat(path).extracting(p -> p.tree().leafCount()).containsExactly(3, 2, 1);
    assertThat(path.get(1).alpha()).isCloseTo(1 / rootWeight, within(1e-24));
    assertThat(path.get(2).alpha()).isCloseTo(2 / rootWeight, within(1e-24));
  }

  @Test
  void pruneReturnsTheSubtreeForAnAlpha() {
    DecisionTree full = new DecisionTree(SCHEMA, FULL);
    List<PrunedTree> path = PruningPath.of(full, EQUAL);
    assertThat(PruningPath.prune(full, EQUAL, 0)).isEqualTo(path.get(0).tree());
    assertThat(PruningPath.prune(full, EQUAL, 0.05)).isEqualTo(path.get(1).tree());
    assertThat(PruningPath.prune(full, EQUAL, 0.1)).isEqualTo(path.get(2).tree());
    assertThat(PruningPath.prune(full, EQUAL, 7)).isEqualTo(path.get(3).tree());
  }

  @Test
  void collapsedNodesPredictTheWeightedMajority() {
    // With B weighing 3, the root [10 A, 10 B] predicts B once everything is pruned.
    List<PrunedTree> path = PruningPath.of(new DecisionTree(SCHEMA, FULL), new double[] {1, 3});
    assertThat(path.get(path.size() - 1).tree().root()).isEqualTo(leaf(1, 10, 10));
    List<PrunedTree> same = PruningPath.of(new DecisionTree(SCHEMA, FULL), ClassWeights.none());
    assertThat(same).isEqualTo(PruningPath.of(new DecisionTree(SCHEMA, FULL), EQUAL));
  }

  @Test
  void eachSubtreeIsTheSmallestMinimiserOfCostComplexity() {
    // Breiman et al. (1984), Theorem 3.10: for alpha in [alpha_k, alpha_k+1), T_k minimises R(T) +
    // alpha |leaves(T)| over all pruned subtrees and is the smallest such. Checked by enumerating
    // every pruned subtree of trained trees with up to 12 leaves.
    for (long seed = 1; seed <= 6; seed++) {
      Dataset data = SyntheticData.generate(600, 4, 1, 4, 2 + (int) (seed % 2), 0.05, seed);
      DecisionTree full =
          CartTrainer.train(data, TrainingOptions.builder().maxLeaves(12).maxDepth(6).build());
      double[] w = seed % 3 == 0 ? new double[] {1, 2.5, 0.5} : new double[] {1, 1, 1};
      w = Arrays.copyOf(w, data.schema().classCount());
      double rootWeight = weight(full.root(), w);
      List<double[]> all = prunings(full.root(), w, rootWeight);
      List<PrunedTree> path = PruningPath.of(full, w);
      for (int k = 0; k < path.size(); k++) {
        double lo = path.get(k).alpha();
        double hi = k + 1 < path.size() ? path.get(k + 1).alpha() : lo + 1;
        for (double alpha : new double[] {lo, lo + (hi - lo) / 2, lo + (hi - lo) * 0.99}) {
          Node root = path.get(k).tree().root();
          double mine = cost(root, w, rootWeight) + alpha * leafCount(root);
          double best = Double.POSITIVE_INFINITY;
          for (double[] t : all) {
            best = Math.min(best, t[0] + alpha * t[1]);
          }
          assertThat(mine).as("seed %d, alpha %s", seed, alpha).isCloseTo(best, within(1e-9));
          for (double[] t : all) {
            if (t[0] + alpha * t[1] <= best + 1e-12) {
              assertThat(leafCount(root)).as("seed %d, alpha %s", seed, alpha)
                  .isLessThanOrEqualTo((int) t[1]);
            }
          }
        }
      }
    }
  }

  /** Every pruned subtree below {@code node} as {R(T), |leaves(T)|}. */
  private static List<double[]> prunings(Node node, double[] w, double rootWeight) {
    List<double[]> out = new ArrayList<>();
    out.add(new double[] {leafCost(node, w, rootWeight), 1});
    if (node instanceof Split split) {
      for (double[] l : prunings(split.left(), w, rootWeight)) {
        for (double[] r : prunings(split.right(), w, rootWeight)) {
          out.add(new double[] {l[0] + r[0], l[1] + r[1]});
        }
      }
    }
    return out;
  }

  private static double cost(Node node, double[] w, double rootWeight) {
    if (node instanceof Split split) {
      return cost(split.left(), w, rootWeight) + cost(split.right(), w, rootWeight);
    }
    return leafCost(node, w, rootWeight);
  }

  private static double leafCost(Node node, double[] w, double rootWeight) {
    double max = 0;
    for (int c = 0; c < w.length; c++) {
      max = Math.max(max, w[c] * node.counts().get(c));
    }
    return (weight(node, w) - max) / rootWeight;
  }

  private static double weight(Node node, double[] w) {
    double total = 0;
    for (int c = 0; c < w.length; c++) {
      total += w[c] * node.counts().get(c);
    }
    return total;
  }

  private static int leafCount(Node node) {
    return node instanceof Split split ? leafCount(split.left()) + leafCount(split.right()) : 1;
  }
}
