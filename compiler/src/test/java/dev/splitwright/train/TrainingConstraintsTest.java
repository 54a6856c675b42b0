package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class TrainingConstraintsTest {
  private static final int UNLIMITED = TrainingOptions.UNLIMITED_LEAVES;
  /** Numeric and categorical features, three classes, 5% missing cells. */
  private static final Dataset DATA = SyntheticData.generate(3000, 6, 2, 5, 3, 0.05, 21);

  static Stream<Arguments> limits() {
    return Stream.of(
        Arguments.of(1, UNLIMITED, 1),
        Arguments.of(3, UNLIMITED, 1),
        Arguments.of(6, UNLIMITED, 5),
        Arguments.of(12, UNLIMITED, 25),
        Arguments.of(4, 2, 1),
        Arguments.of(10, 7, 1),
        Arguments.of(10, 20, 3),
        Arguments.of(20, 60, 2));
  }

  @ParameterizedTest(name = "maxDepth {0}, maxLeaves {1}, minLeaf {2}")
  @MethodSource("limits")
  void respectsLimitsAndCountsEveryTrainingRowWhereTheTreeRoutesIt(
      int maxDepth, int maxLeaves, int minLeaf) {
    TrainingOptions options =
        TrainingOptions.builder().maxDepth(maxDepth).maxLeaves(maxLeaves).minLeaf(minLeaf).build();
    DecisionTree tree = CartTrainer.train(DATA, options);

    assertThat(tree.depth()).isLessThanOrEqualTo(maxDepth);
    assertThat(tree.leafCount()).isLessThanOrEqualTo(maxLeaves).isGreaterThan(1);
    for (Leaf leaf : leaves(tree.root())) {
      assertThat(leaf.counts().total()).isGreaterThanOrEqualTo(minLeaf);
    }
    // Each node's counts are exactly the training rows the finished tree sends there: thresholds
    // and missing-value sides reproduce the partition used during training.
    List<Integer> all = new ArrayList<>();
    for (int r = 0; r < DATA.rows(); r++) {
      all.add(r);
    }
    assertRouting(tree, tree.root(), all);
  }

  @Test
  void leafLimitedTreesArePrefixesOfBestFirstGrowth() {
    Dataset data = SyntheticData.generate(2000, 6, 1, 4, 2, 0.03, 8);
    TrainingOptions unlimited = TrainingOptions.builder().maxDepth(6).build();
    DecisionTree full = CartTrainer.train(data, unlimited);
    assertThat(full.leafCount()).isGreaterThan(30);
    DecisionTree previous = null;
    for (int limit = 2; limit <= 30; limit++) {
      DecisionTree tree = CartTrainer.train(data, unlimited.toBuilder().maxLeaves(limit).build());
      assertThat(tree.leafCount()).isEqualTo(limit);
      assertThat(isPrefix(tree.root(), full.root())).as("prefix of the full tree").isTrue();
      if (previous != null) {
        assertThat(isPrefix(previous.root(), tree.root())).isTrue();
        // Best first: the one new split is the frontier leaf whose split in the full tree removes
        // the most impurity, weighted by the leaf's share of the rows (N_t / N * delta i).
        double best = Double.NEGATIVE_INFINITY;
        double added = Double.NaN;
        for (Node[] pair : frontier(previous.root(), tree.root(), full.root())) {
          double gain = gain(pair[2], full.root().counts().total());
          best = Math.max(best, gain);
          if (pair[1] instanceof Split) {
            added = gain;
          }
        }
        assertThat(added).isGreaterThanOrEqualTo(best - 1e-12);
      }
      previous = tree;
    }
  }

  private static void assertRouting(DecisionTree tree, Node node, List<Integer> rows) {
    int[] counts = new int[DATA.schema().classCount()];
    for (int r : rows) {
      counts[DATA.label(r)]++;
    }
    assertThat(node.counts().toArray()).isEqualTo(counts);
    if (node instanceof Split split) {
      List<Integer> left = new ArrayList<>();
      List<Integer> right = new ArrayList<>();
      for (int r : rows) {
        (tree.goesLeft(split, DATA.value(r, split.feature())) ? left : right).add(r);
      }
      assertRouting(tree, split.left(), left);
      assertRouting(tree, split.right(), right);
    }
  }

  private static List<Leaf> leaves(Node node) {
    List<Leaf> out = new ArrayList<>();
    if (node instanceof Split split) {
      out.addAll(leaves(split.left()));
      out.addAll(leaves(split.right()));
    } else {
      out.add((Leaf) node);
    }
    return out;
  }

  /** Tells whether {@code small} is {@code big} with some subtrees cut back to their roots. */
  private static boolean isPrefix(Node small, Node big) {
    if (!small.counts().equals(big.counts())) {
      return false;
    }
    if (!(small instanceof Split s)) {
      return true;
    }
    if (!(big instanceof Split b) || !sameTest(s, b)) {
      return false;
    }
    return isPrefix(s.left(), b.left()) && isPrefix(s.right(), b.right());
  }

  private static boolean sameTest(Split a, Split b) {
    if (a.feature() != b.feature() || a.missingLeft() != b.missingLeft()) {
      return false;
    }
    if (a instanceof NumericSplit x && b instanceof NumericSplit y) {
      return Float.compare(x.threshold(), y.threshold()) == 0;
    }
    return a instanceof CategoricalSplit x
        && b instanceof CategoricalSplit y
        && x.leftCodes().equals(y.leftCodes());
  }

  /** Leaves of {@code before} that the full tree splits, with the same node after and in full. */
  private static List<Node[]> frontier(Node before, Node after, Node full) {
    List<Node[]> out = new ArrayList<>();
    if (before instanceof Split b) {
      Split a = (Split) after;
      Split f = (Split) full;
      out.addAll(frontier(b.left(), a.left(), f.left()));
      out.addAll(frontier(b.right(), a.right(), f.right()));
    } else if (full instanceof Split) {
      out.add(new Node[] {before, after, full});
    }
    return out;
  }

  private static double gain(Node node, double rootRows) {
    Split split = (Split) node;
    return (giniMass(node) - giniMass(split.left()) - giniMass(split.right())) / rootRows;
  }

  private static double giniMass(Node node) {
    int[] counts = node.counts().toArray();
    double[] x = new double[counts.length];
    for (int c = 0; c < counts.length; c++) {
      x[c] = counts[c];
    }
    return node.counts().total() * Impurity.GINI.of(x);
  }
}
