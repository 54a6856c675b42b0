package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.InputException;
import dev.splitwright.data.Schema;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.util.HashSet;
import java.util.List;
import org.junit.jupiter.api.Test;

class CandidateGeneratorTest {
  private static final Schema SCHEMA =
      new Schema(List.of(Feature.numeric("x")), "y", List.of("A", "B"));

  /** x = 1..13; A at 1-5 and 9, B elsewhere: 6 A, 7 B. */
  private static Dataset handTable() {
    float[][] rows = new float[13][];
    int[] labels = new int[13];
    for (int i = 0; i < 13; i++) {
      int x = i + 1;
      rows[i] = new float[] {x};
      labels[i] = x <= 5 || x == 9 ? 0 : 1;
    }
    return Dataset.ofRows(SCHEMA, rows, labels);
  }

  @Test
  void candidatesAreTheHandWorkedPruningPath() {
    // Worked by hand, Gini, n_L g_L + n_R g_R = 2ab/(a+b) per side:
    // root [6A,7B]: x<=5 gives 0 + 2*1*7/8 = 1.75, every other cut more (x<=4: 3.11, x<=6: 3.38,
    // x<=9: 4.0) -> left [5A] pure, right N1 [1A,7B] (x = 6..13).
    // N1: x<=9 gives 2*1*3/4 = 1.5 + 0; x<=8: 0 + 1.6; x<=10: 1.6 + 0 -> N2 [1A,3B] and [4B].
    // N2 (x = 6..9): x<=8 gives [3B] and [1A], both pure. T_max: 4 pure leaves, depth 3.
    // Costs R = errors/13: R(root) = 6/13, R(N1) = R(N2) = 1/13, leaves 0.
    // g(N2) = 1/13, g(N1) = (1/13)/2 = 1/26, g(root) = (6/13)/3 = 2/13: N1 goes first at 1/26,
    // leaving x<=5 alone (R = 1/13); then g(root) = (6/13 - 1/13)/1 = 5/13: the single leaf B.
    SearchSettings settings = SearchSettings.builder(1000).build();
    CandidateGenerator.Result result =
        CandidateGenerator.generate(handTable(), settings, SearchProgress.none());

    List<DistinctTree> trees = result.trees();
    assertThat(trees).extracting(g -> ((DecisionTree) g.model()).leafCount())
        .containsExactly(2, 1, 4);
    // First met at depth limit 1 (its path: the root split at 0, the leaf at 5/13), then the full
    // tree at depth limit 3 (its path starts at 0 and is next pruned at 1/26).
    assertRecipe(trees.get(0).recipe(), 1, 1, 0, 5.0 / 13);
    assertRecipe(trees.get(1).recipe(), 1, 1, 5.0 / 13, Double.POSITIVE_INFINITY);
    assertRecipe(trees.get(2).recipe(), 3, 1, 0, 1.0 / 26);
    assertThat(predictions((DecisionTree) trees.get(2).model())).isEqualTo("AAAAABBBABBBB");
    assertThat(predictions((DecisionTree) trees.get(0).model())).isEqualTo("AAAAABBBBBBBB");
    assertThat(predictions((DecisionTree) trees.get(1).model())).isEqualTo("BBBBBBBBBBBBB");
    // Path lengths summed over the grid, worked by hand: min-leaf 1 gives 2 + 2 + 6 * 3 = 22
    // (depth 2's extra split does not lower the cost and is dropped); min-leaf 2 gives 2 per depth
    // (its deeper splits never lower the cost) = 16; min-leaf 5 gives 2 per depth = 16 (N1's 8
    // rows cannot make two leaves of 5); min-leaf 10 and 20 give the single leaf: 8 + 8.
    assertThat(result.settingsTried()).isEqualTo(22 + 16 + 16 + 8 + 8);
  }

  @Test
  void keepsEveryTreeOnce() throws InputException {
    Dataset train = TestData.split(TestData.pump()).train();
    List<DistinctTree> trees = CandidateGenerator.generate(train,
        SearchSettings.builder(1000).maxDepth(6).build(), SearchProgress.none()).trees();

    assertThat(new HashSet<>(trees.stream().map(DistinctTree::model).toList()))
        .hasSameSizeAs(trees);
    assertThat(trees).extracting(DistinctTree::index)
        .isEqualTo(java.util.stream.IntStream.range(0, trees.size()).boxed().toList());
  }

  @Test
  void includesEveryDirectlyTrainedTreeOfTheGrid() throws InputException {
    Dataset train = TestData.split(TestData.pump()).train();
    SearchSettings settings = SearchSettings.builder(1000).maxDepth(5).build();
    List<Classifier> trees = CandidateGenerator.generate(train, settings, SearchProgress.none())
        .trees().stream().map(DistinctTree::model).toList();

    // Each tree the trainer grows for a grid point, pruned of splits that do not lower the
    // training cost (the first entry of its pruning path), is a candidate.
    for (int depth = 1; depth <= 5; depth++) {
      for (int minLeaf : settings.minLeafs()) {
        DecisionTree grown = CartTrainer.train(train,
            TrainingOptions.builder().maxDepth(depth).minLeaf(minLeaf).build());
        DecisionTree first = dev.splitwright.train.PruningPath
            .of(grown, dev.splitwright.train.ClassWeights.none()).get(0).tree();
        assertThat(trees).as("depth %d, min-leaf %d", depth, minLeaf).contains(first);
      }
    }
  }

  private static void assertRecipe(CandidateRecipe s, int depth, int minLeaf, double alpha,
      double next) {
    assertThat(s.maxDepth()).isEqualTo(depth);
    assertThat(s.minLeaf()).isEqualTo(minLeaf);
    assertThat(s.alpha()).isCloseTo(alpha, within(1e-12));
    if (Double.isInfinite(next)) {
      assertThat(s.nextAlpha()).isInfinite();
    } else {
      assertThat(s.nextAlpha()).isCloseTo(next, within(1e-12));
    }
  }

  private static String predictions(DecisionTree tree) {
    StringBuilder out = new StringBuilder();
    for (int x = 1; x <= 13; x++) {
      out.append(SCHEMA.classes().get(tree.predict(new float[] {x})));
    }
    return out.toString();
  }
}
