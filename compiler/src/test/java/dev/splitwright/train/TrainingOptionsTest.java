package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class TrainingOptionsTest {
  private static final Schema SCHEMA =
      new Schema(List.of(Feature.numeric("x")), "y", List.of("idle", "fault", "worn"));

  @Test
  void defaultsAreGiniDepthEightUnlimitedLeavesOneRowNoWeights() {
    TrainingOptions options = TrainingOptions.defaults();
    assertThat(options.impurity()).isEqualTo(Impurity.GINI);
    assertThat(options.maxDepth()).isEqualTo(8);
    assertThat(options.maxLeaves()).isEqualTo(Integer.MAX_VALUE);
    assertThat(options.minLeaf()).isEqualTo(1);
    assertThat(options.weights()).isEqualTo(ClassWeights.none());
    assertThat(options).hasToString(
        "impurity=gini, maxDepth=8, maxLeaves=unlimited, minLeaf=1, weights=none");
  }

  @Test
  void toBuilderKeepsEverySetting() {
    TrainingOptions options =
        TrainingOptions.builder()
            .impurity(Impurity.ENTROPY)
            .maxDepth(3)
            .maxLeaves(5)
            .minLeaf(4)
            .weights(ClassWeights.inverseFrequency())
            .build();
    assertThat(options.toBuilder().build()).isEqualTo(options).hasSameHashCodeAs(options);
    assertThat(options.toBuilder().maxDepth(4).build()).isNotEqualTo(options);
    assertThat(options).hasToString(
        "impurity=entropy, maxDepth=3, maxLeaves=5, minLeaf=4, weights=inverse-frequency");
  }

  @Test
  void rejectsOutOfRangeLimitsNamingOptionAndValue() {
    assertThatThrownBy(() -> TrainingOptions.builder().maxDepth(0))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("maxDepth must be at least 1, but it is 0");
    assertThatThrownBy(() -> TrainingOptions.builder().maxLeaves(1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("maxLeaves must be at least 2, but it is 1");
    assertThatThrownBy(() -> TrainingOptions.builder().minLeaf(-3))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("minLeaf must be at least 1, but it is -3");
    assertThatThrownBy(() -> TrainingOptions.builder().weights(null))
        .isInstanceOf(NullPointerException.class)
        .hasMessage("weights");
  }

  @Test
  void inverseFrequencyWeightsAreRowsOverClassesTimesClassRows() {
    // Worked by hand: n = 8 rows, k = 2 classes present: idle 8/(2*6) = 2/3, fault 8/(2*2) = 2;
    // "worn" has no rows and keeps weight 1.
    double[] w = ClassWeights.inverseFrequency().resolve(SCHEMA, new int[] {6, 2, 0});
    assertThat(w[0]).isCloseTo(2.0 / 3, within(1e-15));
    assertThat(w[1]).isEqualTo(2.0);
    assertThat(w[2]).isEqualTo(1.0);
  }

  @Test
  void explicitWeightsApplyByLabelAndDefaultToOne() {
    double[] w = ClassWeights.of(Map.of("worn", 4.0, "idle", 0.5)).resolve(SCHEMA, new int[3]);
    assertThat(w).containsExactly(0.5, 1.0, 4.0);
    assertThat(ClassWeights.of(Map.of("worn", 4.0, "idle", 0.5)))
        .hasToString("{idle=0.5, worn=4.0}");
    assertThat(ClassWeights.none().resolve(SCHEMA, new int[] {1, 2, 3})).containsExactly(1, 1, 1);
  }

  @Test
  void rejectsUnknownLabelListingValidOnes() {
    ClassWeights weights = ClassWeights.of(Map.of("broken", 2.0));
    assertThatThrownBy(() -> weights.resolve(SCHEMA, new int[3]))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage(
            "unknown class label 'broken' in class weights; valid labels: [idle, fault, worn]");
  }

  @Test
  void rejectsNonPositiveOrInfiniteWeight() {
    assertThatThrownBy(() -> ClassWeights.of(Map.of("idle", 0.0)))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("weight of class 'idle' must be positive and finite, but it is 0.0");
    assertThatThrownBy(() -> ClassWeights.of(Map.of("idle", Double.POSITIVE_INFINITY)))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("weight of class 'idle' must be positive and finite, but it is Infinity");
  }
}
