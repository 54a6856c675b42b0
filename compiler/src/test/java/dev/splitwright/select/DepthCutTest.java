package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.ClassWeights;
import dev.splitwright.train.TrainingOptions;
import java.util.List;
import org.junit.jupiter.api.Test;

class DepthCutTest {

  @Test
  void cuttingTheDeepestTreeEqualsGrowingToTheDepth() throws Exception {
    for (Dataset data : List.of(TestData.load(TestData.cancer()), TestData.pump())) {
      for (ClassWeights weights : List.of(ClassWeights.none(), ClassWeights.inverseFrequency())) {
        for (int minLeaf : List.of(1, 5)) {
          TrainingOptions base = TrainingOptions.builder().minLeaf(minLeaf).weights(weights)
              .build();
          DecisionTree deepest = CartTrainer.train(data, base.toBuilder().maxDepth(8).build());
          for (int depth = 1; depth <= 8; depth++) {
            assertThat(DepthCut.cut(deepest, depth, weights.resolve(data)))
                .as("depth %d, min-leaf %d, %s", depth, minLeaf, weights)
                .isEqualTo(CartTrainer.train(data, base.toBuilder().maxDepth(depth).build()));
          }
        }
      }
    }
  }
}
