package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

class CartTrainerTest {
  private static final float NAN = Float.NaN;
  private static final Schema TWO_NUMERIC =
      new Schema(List.of(Feature.numeric("x0"), Feature.numeric("x1")), "y", List.of("A", "B"));

  /**
   * Worked by hand (Gini). Root [4 A, 4 B], Gini 0.5. Splitting x0 after the k-th row gives child
   * costs W_L*Gini_L + W_R*Gini_R of: k=1: 7*24/49 = 3.43; k=2: 6*16/36 = 2.67; k=3: 0 + 5*8/25 =
   * 1.6; k=4: 4*6/16*2 = 3; k=5: 5*8/25 + 0 = 1.6; k=6: 6*16/36 = 2.67; k=7: 3.43. x1 (1 or 2)
   * gives [3,1] | [1,3]: 2 * 4*6/16 = 3. Best: k=3 and k=5 tie at 1.6, the lower threshold wins:
   * x0 <= 3.5 (midpoint of 3 and 4), impurity decrease 0.5 - 1.6/8 = 0.3. The right node [1 A, 4 B]
   * (x0 = 4..8) has x0 <= 5.5 giving [1,1] | [0,3], cost 1, and x1 <= 1.5 giving [1,1] | [0,3],
   * also cost 1: the lower feature index wins.
   */
  private static Dataset handTable() {
    float[][] rows = {
      {1, 1}, {2, 1}, {3, 2}, {4, 2}, {5, 1}, {6, 1}, {7, 2}, {8, 2},
    };
    int[] labels = {0, 0, 0, 1, 0, 1, 1, 1};
    return Dataset.ofRows(TWO_NUMERIC, rows, labels);
  }

  @Test
  void findsHandWorkedSplitsOfTinyTable() {
    TrainingOptions depthTwo = TrainingOptions.builder().maxDepth(2).build();
    DecisionTree tree = CartTrainer.train(handTable(), depthTwo);

    // No row is missing, so missing values follow the side with more rows (right, both times).
    Node expected =
        new NumericSplit(0, 3.5f, false,
            new Leaf(0, ClassCounts.of(3, 0)),
            new NumericSplit(0, 5.5f, false,
                new Leaf(0, ClassCounts.of(1, 1)), // a tie predicts the lower class index
                new Leaf(1, ClassCounts.of(0, 3)),
                ClassCounts.of(1, 4)),
            ClassCounts.of(4, 4));
    assertThat(tree).isEqualTo(new DecisionTree(TWO_NUMERIC, expected));
    assertThat(decrease(Impurity.GINI, tree.root())).isCloseTo(0.3, within(1e-12));
  }

  @Test
  void entropyChoosesTheSameRootSplitWithHandWorkedDecrease() {
    // Worked by hand: k=3 and k=5 leave one pure child and one [1,4]: 1 - 5/8 * H(0.2)
    // = 1 - 0.625 * 0.721928 = 0.548795 bits; k=2: 1 - 6/8 * H(1/3) = 0.311278; k=4: 0.188722.
    DecisionTree tree =
        CartTrainer.train(
            handTable(), TrainingOptions.builder().maxDepth(1).impurity(Impurity.ENTROPY).build());
    NumericSplit root = (NumericSplit) tree.root();
    assertThat(root.threshold()).isEqualTo(3.5f);
    assertThat(decrease(Impurity.ENTROPY, root)).isCloseTo(0.548795, within(1e-6));
  }

  /**
   * Two features whose best splits have equal cost mathematically but not in double arithmetic:
   * the documented rule (lowest feature index) must decide, not the last bit. Worked by hand, Gini
   * mass n - sum(n_c^2) / n of a node [2 A, 6 B]: x0 splits it into [1,1] | [1,5], costing
   * (2 - 2/2) + (6 - 26/6) = 1 + 5/3 = 8/3; x1 into [0,2] | [2,4], costing 0 + (6 - 20/6) = 8/3.
   * In doubles (IEEE 754 round to nearest) 26/6 rounds down, so 6 - 26/6 rounds up and x0's cost
   * is 2.666666666666667; x1's is 2.6666666666666665, one ulp lower, which used to win.
   */
  @Test
  void equalCostsUpToRoundingGoToTheLowerFeatureIndex() {
    float[][] rows = {
      {0, 1}, {1, 1}, {0, 1}, {1, 0}, {1, 0}, {1, 1}, {1, 1}, {1, 1},
    };
    int[] labels = {0, 0, 1, 1, 1, 1, 1, 1};
    Dataset data = Dataset.ofRows(TWO_NUMERIC, rows, labels);
    // The premise: the two costs as the trainer's criterion computes them differ in the last bit.
    Criterion gini = new Criterion(Impurity.GINI, new double[] {1, 1}, rows.length);
    double x0 = gini.cost(new int[] {1, 1}) + gini.cost(new int[] {1, 5});
    double x1 = gini.cost(new int[] {0, 2}) + gini.cost(new int[] {2, 4});
    assertThat(x1).isEqualTo(Math.nextDown(x0));

    DecisionTree tree = CartTrainer.train(data, TrainingOptions.builder().maxDepth(1).build());

    Node expected = new NumericSplit(0, 0.5f, false,
        new Leaf(0, ClassCounts.of(1, 1)), new Leaf(1, ClassCounts.of(1, 5)),
        ClassCounts.of(2, 6));
    assertThat(tree.root()).isEqualTo(expected);
  }

  @Test
  void classWeightsChangePredictionsButCountsStayRaw() {
    // Worked by hand with weights A=1, B=3: root split x0 <= 3.5 costs 0 + [1,12]: 13 - 145/13 =
    // 1.85 (next best k=2: 3.43); right node x0 <= 5.5 costs [1,3] + [0,9]: 4 - 10/4 = 1.5 (x0 <=
    // 4.5: 1.8). Same tree, but the [1 A, 1 B] leaf now predicts B (weight 1 versus 3).
    TrainingOptions options =
        TrainingOptions.builder().maxDepth(2).weights(ClassWeights.of(Map.of("B", 3.0))).build();
    DecisionTree tree = CartTrainer.train(handTable(), options);
    NumericSplit root = (NumericSplit) tree.root();
    NumericSplit right = (NumericSplit) root.right();
    assertThat(root.threshold()).isEqualTo(3.5f);
    assertThat(right.threshold()).isEqualTo(5.5f);
    assertThat(right.left()).isEqualTo(new Leaf(1, ClassCounts.of(1, 1)));
    assertThat(root.counts()).isEqualTo(ClassCounts.of(4, 4));
  }

  @ParameterizedTest
  @EnumSource(Impurity.class)
  void missingRowsGoToTheSideTheyBelongWith(Impurity impurity) {
    Schema schema = new Schema(List.of(Feature.numeric("x")), "y", List.of("A", "B"));
    for (int missingLabel = 0; missingLabel < 2; missingLabel++) {
      // x = 1, 2, 3 are A; 7, 8, 9 are B; three more rows are missing, all of one class.
      float[][] rows = {{1}, {2}, {3}, {7}, {8}, {9}, {NAN}, {NAN}, {NAN}};
      int m = missingLabel;
      int[] labels = {0, 0, 0, 1, 1, 1, m, m, m};
      DecisionTree tree =
          CartTrainer.train(
              Dataset.ofRows(schema, rows, labels),
              TrainingOptions.builder().maxDepth(1).impurity(impurity).build());
      NumericSplit root = (NumericSplit) tree.root();
      // Scored on present rows: worked by hand, the midpoint of 3 and 7.
      assertThat(root.threshold()).isEqualTo(5f);
      // Missing A rows make the left child pure, missing B rows the right one.
      assertThat(root.missingLeft()).isEqualTo(missingLabel == 0);
      assertThat(root.counts().total()).as("no row dropped").isEqualTo(9);
      assertThat(tree.predict(new float[] {NAN})).isEqualTo(missingLabel);
    }
  }

  @Test
  void withoutMissingTrainingRowsMissingValuesFollowTheLargerChild() {
    Schema schema = new Schema(List.of(Feature.numeric("x")), "y", List.of("A", "B"));
    TrainingOptions options = TrainingOptions.builder().maxDepth(1).build();
    // Two A rows left, three B rows right: missing goes right and is predicted B.
    DecisionTree right =
        CartTrainer.train(
            Dataset.ofRows(
                schema, new float[][] {{1}, {2}, {7}, {8}, {9}}, new int[] {0, 0, 1, 1, 1}),
            options);
    assertThat(((Split) right.root()).missingLeft()).isFalse();
    assertThat(right.predict(new float[] {NAN})).isEqualTo(1);
    // Two and two: a tie goes left.
    DecisionTree tie =
        CartTrainer.train(
            Dataset.ofRows(schema, new float[][] {{1}, {2}, {8}, {9}}, new int[] {0, 0, 1, 1}),
            options);
    assertThat(((Split) tie.root()).missingLeft()).isTrue();
  }

  @Test
  void unseenAndInvalidCategoryCodesCountAsMissing() {
    Schema schema =
        new Schema(
            List.of(Feature.categorical("colour", List.of("red", "green"))),
            "y",
            List.of("A", "B"));
    // red -> A, green -> B; codes 5 and -1 and 0.5 are no category, so missing; they are all B.
    float[][] rows = {{0}, {0}, {0}, {1}, {1}, {1}, {5}, {-1}, {0.5f}, {NAN}};
    int[] labels = {0, 0, 0, 1, 1, 1, 1, 1, 1, 1};
    DecisionTree tree =
        CartTrainer.train(Dataset.ofRows(schema, rows, labels), TrainingOptions.defaults());
    CategoricalSplit root = (CategoricalSplit) tree.root();
    assertThat(root.leftCodes()).isEqualTo(CategoricalSplit.CodeSet.of(0));
    assertThat(root.missingLeft()).isFalse();
    assertThat(root.right().counts()).isEqualTo(ClassCounts.of(0, 7));
    assertThat(tree.predict(new float[] {7})).isEqualTo(1);
  }

  @Test
  void findsHandWorkedOptimalCategorySubset() {
    // Four categories with (A, B) rows a [4,0], b [1,3], c [3,1], d [0,4]; Gini costs worked by
    // hand for every left set (a set and its complement are the same split):
    // {a} 0 + [4,8] 5.33; {b} 1.5 + [7,5] 5.83 = 7.33; {c} 7.33; {d} 5.33; {a,b} [5,3]+[3,5] 7.5;
    // {a,c} [7,1]+[1,7] 1.75+1.75 = 3.5; {a,d} [4,4]+[4,4] 8. Optimal: {a,c}, which is also the
    // two-prefix of the order by share of B (a 0, c 0.25, b 0.75, d 1).
    Schema schema =
        new Schema(
            List.of(Feature.categorical("k", List.of("a", "b", "c", "d"))), "y", List.of("A", "B"));
    int[][] perCategory = {{4, 0}, {1, 3}, {3, 1}, {0, 4}};
    Dataset data = tableFromCounts(schema, perCategory);
    DecisionTree tree = CartTrainer.train(data, TrainingOptions.builder().maxDepth(1).build());
    CategoricalSplit root = (CategoricalSplit) tree.root();
    assertThat(root.leftCodes()).isEqualTo(CategoricalSplit.CodeSet.of(0, 2));
    assertThat(root.left().counts()).isEqualTo(ClassCounts.of(7, 1));
    assertThat(childCost(Impurity.GINI, root)).isCloseTo(3.5, within(1e-12));
  }

  @ParameterizedTest
  @EnumSource(Impurity.class)
  void twoClassCategorySplitIsOptimalOverAllSubsets(Impurity impurity) {
    // Breiman et al. (1984), section 9.4: with two classes, ordering categories by the share of
    // one class and splitting the ordering finds the best subset for a concave impurity. Checked
    // here against exhaustive search over all subsets.
    Schema schema =
        new Schema(
            List.of(Feature.categorical("k", List.of("a", "b", "c", "d", "e", "f", "g"))),
            "y",
            List.of("A", "B"));
    Random random = new Random(94);
    for (int trial = 0; trial < 200; trial++) {
      int[][] perCategory = new int[7][2];
      for (int[] counts : perCategory) {
        counts[0] = random.nextInt(6);
        counts[1] = random.nextInt(6);
      }
      Dataset data = tableFromCounts(schema, perCategory);
      if (data.rows() < 2) {
        continue;
      }
      DecisionTree tree =
          CartTrainer.train(data, TrainingOptions.builder().maxDepth(1).impurity(impurity).build());
      double best = bestSubsetCost(impurity, perCategory);
      if (tree.root() instanceof CategoricalSplit root) {
        assertThat(childCost(impurity, root)).isCloseTo(best, within(1e-9));
      } else {
        // No split: the node is pure, has one category, or no subset lowers the impurity.
        double own = weightedImpurity(impurity, data.classCounts());
        assertThat(best).isGreaterThanOrEqualTo(own - 1e-9);
      }
    }
  }

  @Test
  void sameInputGivesEqualTreeEvenWithRowsShuffled() {
    Dataset data = SyntheticData.generate(3000, 5, 2, 6, 3, 0.05, 3);
    TrainingOptions options = TrainingOptions.builder().maxDepth(7).minLeaf(3).build();
    DecisionTree first = CartTrainer.train(data, options);
    DecisionTree second = CartTrainer.train(data, options);
    assertThat(second).isEqualTo(first);
    // The tree depends on the rows, not their order: every tie is broken by value or index.
    int[] order = new int[data.rows()];
    for (int i = 0; i < order.length; i++) {
      order[i] = i;
    }
    Random random = new Random(5);
    for (int i = order.length - 1; i > 0; i--) {
      int j = random.nextInt(i + 1);
      int t = order[i];
      order[i] = order[j];
      order[j] = t;
    }
    assertThat(CartTrainer.train(data.subset(order), options)).isEqualTo(first);
    assertThat(first.leafCount()).isGreaterThan(10);
  }

  @Test
  void rejectsEmptyDataAndUnknownWeightLabels() {
    assertThatThrownBy(
            () -> CartTrainer.train(Dataset.ofRows(TWO_NUMERIC, new float[0][], new int[0]),
                TrainingOptions.defaults()))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("cannot train on a data set with no rows");
    TrainingOptions options =
        TrainingOptions.builder().weights(ClassWeights.of(Map.of("C", 2.0))).build();
    assertThatThrownBy(() -> CartTrainer.train(handTable(), options))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("unknown class label 'C' in class weights; valid labels: [A, B]");
  }

  @Test
  void pureOrConstantDataGivesSingleLeaf() {
    DecisionTree pure =
        CartTrainer.train(
            Dataset.ofRows(TWO_NUMERIC, new float[][] {{1, 2}, {3, 4}}, new int[] {1, 1}),
            TrainingOptions.defaults());
    assertThat(pure.root()).isEqualTo(new Leaf(1, ClassCounts.of(0, 2)));
    DecisionTree constant =
        CartTrainer.train(
            Dataset.ofRows(TWO_NUMERIC, new float[][] {{1, 2}, {1, 2}, {1, NAN}},
                new int[] {0, 1, 1}),
            TrainingOptions.defaults());
    assertThat(constant.root()).isEqualTo(new Leaf(1, ClassCounts.of(1, 2)));
  }

  @Test
  void negativeAndPositiveZeroAreOneValue() {
    // IEEE 754: -0.0 == 0.0, so no threshold can separate them; the only split is x0 <= 0.5.
    DecisionTree tree =
        CartTrainer.train(
            Dataset.ofRows(TWO_NUMERIC, new float[][] {{-0f, NAN}, {0f, NAN}, {1, NAN}, {1, NAN}},
                new int[] {0, 1, 1, 1}),
            TrainingOptions.defaults());
    NumericSplit root = (NumericSplit) tree.root();
    assertThat(root.threshold()).isEqualTo(0.5f);
    assertThat(root.left()).isEqualTo(new Leaf(0, ClassCounts.of(1, 1)));
    assertThat(tree.leafCount()).isEqualTo(2);
  }

  private static Dataset tableFromCounts(Schema schema, int[][] perCategory) {
    int n = 0;
    for (int[] counts : perCategory) {
      n += counts[0] + counts[1];
    }
    float[][] rows = new float[n][1];
    int[] labels = new int[n];
    int r = 0;
    for (int code = 0; code < perCategory.length; code++) {
      for (int c = 0; c < 2; c++) {
        for (int i = 0; i < perCategory[code][c]; i++) {
          rows[r][0] = code;
          labels[r++] = c;
        }
      }
    }
    return Dataset.ofRows(schema, rows, labels);
  }

  private static double bestSubsetCost(Impurity impurity, int[][] perCategory) {
    double best = Double.POSITIVE_INFINITY;
    for (int mask = 1; mask < (1 << perCategory.length) - 1; mask++) {
      int[] left = new int[2];
      int[] right = new int[2];
      for (int code = 0; code < perCategory.length; code++) {
        int[] side = (mask >> code & 1) == 1 ? left : right;
        side[0] += perCategory[code][0];
        side[1] += perCategory[code][1];
      }
      if (left[0] + left[1] > 0 && right[0] + right[1] > 0) {
        best = Math.min(best, weightedImpurity(impurity, left) + weightedImpurity(impurity, right));
      }
    }
    return best;
  }

  private static double weightedImpurity(Impurity impurity, int[] counts) {
    double[] x = new double[counts.length];
    double total = 0;
    for (int c = 0; c < counts.length; c++) {
      x[c] = counts[c];
      total += x[c];
    }
    return total * impurity.of(x);
  }

  private static double childCost(Impurity impurity, Split split) {
    return weightedImpurity(impurity, split.left().counts().toArray())
        + weightedImpurity(impurity, split.right().counts().toArray());
  }

  /** Impurity decrease i(t) - p_L i(t_L) - p_R i(t_R), from the tree's counts. */
  private static double decrease(Impurity impurity, Node node) {
    Split split = (Split) node;
    double n = node.counts().total();
    return weightedImpurity(impurity, node.counts().toArray()) / n - childCost(impurity, split) / n;
  }
}
