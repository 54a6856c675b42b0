package dev.splitwright.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The combination rule of {@link TreeEnsemble} on a hand-built ensemble of three stumps over one
 * numeric feature and three classes a, b, c; every expected value is worked by hand.
 */
class TreeEnsembleTest {
  private static final Schema SCHEMA =
      new Schema(List.of(Feature.numeric("x")), "label", List.of("a", "b", "c"));

  /** Goes to {@code low} when {@code x <= threshold} (missing values too), else to {@code high}. */
  private static DecisionTree stump(float threshold, int low, int high) {
    int[] lowCounts = new int[3];
    int[] highCounts = new int[3];
    lowCounts[low] = 1;
    highCounts[high] = 1;
    int[] both = lowCounts.clone();
    both[high]++;
    return new DecisionTree(SCHEMA, new NumericSplit(0, threshold, true,
        new Leaf(low, ClassCounts.of(lowCounts)), new Leaf(high, ClassCounts.of(highCounts)),
        ClassCounts.of(both)));
  }

  /** T0: x <= 1.5 ? a : b; T1: x <= 2.5 ? b : c; T2: x <= 0.5 ? c : a. */
  private static final List<DecisionTree> STUMPS =
      List.of(stump(1.5f, 0, 1), stump(2.5f, 1, 2), stump(0.5f, 2, 0));

  private static float[] x(float value) {
    return new float[] {value};
  }

  @Test
  void forestVotesAndBreaksTiesToTheLowestClass() {
    TreeEnsemble forest = TreeEnsemble.forest(STUMPS);

    // Worked by hand. x = 0: T0 a, T1 b, T2 c: one vote each, the tie goes to a (index 0).
    assertThat(forest.votes(x(0f))).containsExactly(0, 1, 2);
    assertThat(forest.scores(x(0f))).containsExactly(1f, 1f, 1f);
    assertThat(forest.predict(x(0f))).isZero();
    // x = 1: T0 a, T1 b, T2 a: a wins 2 to 1.
    assertThat(forest.predict(x(1f))).isZero();
    // x = 2: T0 b, T1 b, T2 a: b wins 2 to 1.
    assertThat(forest.predict(x(2f))).isOne();
    // x = 3: T0 b, T1 c, T2 a: a three-way tie again, to a.
    assertThat(forest.predict(x(3f))).isZero();
    // Missing goes left in all three stumps: as x = 0.
    assertThat(forest.votes(x(Float.NaN))).containsExactly(0, 1, 2);
  }

  @Test
  void forestProbabilitiesAreVoteSharesRoundedOnceToFloat32() {
    TreeEnsemble forest = TreeEnsemble.forest(STUMPS);

    // Worked by hand: 2/3 and 1/3 rounded to nearest binary32 (IEEE 754) are 0x3f2aaaab and
    // 0x3eaaaaab.
    float[] p = forest.probabilities(x(1f));
    assertThat(Float.floatToIntBits(p[0])).isEqualTo(0x3f2aaaab);
    assertThat(Float.floatToIntBits(p[1])).isEqualTo(0x3eaaaaab);
    assertThat(p[2]).isZero();
    assertThat(forest.totalWeight()).isEqualTo(3f);
    assertThat(forest.weight(2)).isEqualTo(1f);
  }

  @Test
  void boostedScoresAreWeightedVotesAndTiesGoToTheLowestClass() {
    TreeEnsemble boosted = TreeEnsemble.boosted(STUMPS, new float[] {0.25f, 0.25f, 0.5f});

    // Worked by hand (all sums exact in binary32). x = 1: a gets T0 0.25 + T2 0.5, b gets T1.
    assertThat(boosted.scores(x(1f))).containsExactly(0.75f, 0.25f, 0f);
    assertThat(boosted.predict(x(1f))).isZero();
    // x = 0: a 0.25, b 0.25, c 0.5: c wins though every tree votes once.
    assertThat(boosted.predict(x(0f))).isEqualTo(2);
    // x = 2: T0 b 0.25, T1 b 0.25, T2 a 0.5: a tie at 0.5, to a.
    assertThat(boosted.scores(x(2f))).containsExactly(0.5f, 0.5f, 0f);
    assertThat(boosted.predict(x(2f))).isZero();
    assertThat(boosted.probabilities(x(2f))).containsExactly(0.5f, 0.5f, 0f);
  }

  @Test
  void boostedSumsRunInTreeOrderInFloat32() {
    float tiny = 0x1p-24f;
    TreeEnsemble boosted = TreeEnsemble.boosted(STUMPS, new float[] {1f, tiny, tiny});

    // Worked by hand: x = 1 sends T0 and T2 to a. 1 + 2^-24 lies halfway between 1 and the next
    // binary32 above it, 1 + 2^-23, and rounds to the even one, 1 (IEEE 754 round to nearest,
    // ties to even). Summed the other way round, 2^-24 + 2^-24 = 2^-23 and 1 + 2^-23 is exact.
    assertThat(boosted.scores(x(1f))).containsExactly(1f, tiny, 0f);
    assertThat(tiny + tiny + 1f).isEqualTo(1f + 0x1p-23f);
    // The total is summed in the same order: (1 + 2^-24) + 2^-24 = 1 + 2^-24 = 1.
    assertThat(boosted.totalWeight()).isEqualTo(1f);
    // So a's share is 1 and b's 2^-24: documented shares need not add up to exactly 1.
    assertThat(boosted.probabilities(x(1f))).containsExactly(1f, tiny, 0f);
  }

  @Test
  void boostedProbabilitiesDivideByTheFloat32Total() {
    TreeEnsemble boosted = TreeEnsemble.boosted(STUMPS, new float[] {0.1f, 0.2f, 0.3f});

    // Worked by hand, each step rounded to binary32 (checked with Python's struct module, whose
    // double result of one + or / of two binary32 values rounds to binary32 exactly as a binary32
    // operation would, since 53 >= 2 * 24 + 2): 0.1f + 0.2f = 0x3e99999a (= 0.3f), plus 0.3f is
    // 0x3f19999a (= 0.6f).
    assertThat(Float.floatToIntBits(boosted.totalWeight())).isEqualTo(0x3f19999a);
    float[] p = boosted.probabilities(x(0f));
    // 0.1f / 0.6f = 0x3e2aaaaa, 0.2f / 0.6f = 0x3eaaaaaa (one ulp below 1/3 rounded, 0x3eaaaaab),
    // 0.3f / 0.6f = 0.5 exactly.
    assertThat(Float.floatToIntBits(p[0])).isEqualTo(0x3e2aaaaa);
    assertThat(Float.floatToIntBits(p[1])).isEqualTo(0x3eaaaaaa);
    assertThat(p[2]).isEqualTo(0.5f);
  }

  @Test
  void refusesBadWeightsAndMixedSchemas() {
    assertThatThrownBy(() -> TreeEnsemble.boosted(STUMPS, new float[] {1f, 0f, 1f}))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("weight of tree 1 must be positive and finite, but it is 0.0");
    assertThatThrownBy(() -> TreeEnsemble.boosted(STUMPS, new float[] {1f, 1f}))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("expected 3 tree weights but got 2");
    assertThatThrownBy(() -> TreeEnsemble.boosted(STUMPS,
        new float[] {Float.MAX_VALUE, Float.MAX_VALUE, 1f}))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("the tree weights sum beyond the float32 range");
    assertThatThrownBy(() -> TreeEnsemble.forest(List.of()))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("an ensemble needs 1 to 4096 trees, not 0");
    Schema other = new Schema(List.of(Feature.numeric("y")), "label", List.of("a", "b", "c"));
    DecisionTree foreign = new DecisionTree(other, new Leaf(0, ClassCounts.of(1, 0, 0)));
    assertThatThrownBy(() -> TreeEnsemble.forest(List.of(STUMPS.get(0), foreign)))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("tree 1 has another schema than tree 0");
  }

  @Test
  void equalEnsemblesNeedTheSameKindTreesAndWeights() {
    assertThat(TreeEnsemble.forest(STUMPS)).isEqualTo(TreeEnsemble.forest(STUMPS))
        .isNotEqualTo(TreeEnsemble.boosted(STUMPS, new float[] {1f, 1f, 1f}))
        .isNotEqualTo(TreeEnsemble.forest(STUMPS.subList(0, 2)));
    assertThat(TreeEnsemble.forest(STUMPS)).hasToString("forest of 3 trees");
  }
}
