package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Trained ensembles predict what a straightforward recomputation from their trees gives, bit for
 * bit: votes counted here class by class, float32 sums in tree order, one float32 division.
 */
class EnsembleOracleTest {

  @Test
  void forestPredictionsAndSharesAreTheCountedVotes() throws Exception {
    Dataset data = BoostingTrainerTest.gesture();
    TreeEnsemble forest = ForestTrainer.train(data,
        ForestOptions.of(7, 3, TrainingOptions.builder().maxDepth(5).build()));
    int k = data.schema().classCount();
    int ties = 0;
    for (float[] x : inputs(data)) {
      int[] votes = new int[k];
      for (DecisionTree tree : forest.trees()) {
        votes[tree.predict(x)]++;
      }
      int best = 0;
      for (int c = 1; c < k; c++) {
        best = votes[c] > votes[best] ? c : best;
      }
      ties += countOf(votes, votes[best]) > 1 ? 1 : 0;
      assertThat(forest.predict(x)).isEqualTo(best);
      float[] p = forest.probabilities(x);
      for (int c = 0; c < k; c++) {
        // IEEE 754: the quotient of two binary32 values rounded once, here via an exact double
        // quotient rounded to binary32 (53 >= 2 * 24 + 2 bits: no double rounding).
        assertThat(p[c]).isEqualTo((float) ((double) votes[c] / forest.treeCount()));
      }
    }
    // Seven trees and five classes: ties (3-3-1, 2-2-2-1, ...) must have been met.
    assertThat(ties).isPositive();
  }

  @Test
  void boostedPredictionsAndSharesAreTheFloat32WeightedVotes() throws Exception {
    Dataset data = BoostingTrainerTest.gesture();
    TreeEnsemble boosted = BoostingTrainer.train(data,
        new BoostingOptions(12, 3, TrainingOptions.builder().maxDepth(2).build()));
    int k = data.schema().classCount();
    float total = 0f;
    for (int t = 0; t < boosted.treeCount(); t++) {
      total += boosted.weight(t);
    }
    assertThat(boosted.totalWeight()).isEqualTo(total);
    for (float[] x : inputs(data)) {
      float[] score = new float[k];
      for (int c = 0; c < k; c++) {
        for (int t = 0; t < boosted.treeCount(); t++) {
          if (boosted.trees().get(t).predict(x) == c) {
            score[c] += boosted.weight(t);
          }
        }
      }
      int best = 0;
      for (int c = 1; c < k; c++) {
        best = score[c] > score[best] ? c : best;
      }
      assertThat(boosted.predict(x)).isEqualTo(best);
      float[] p = boosted.probabilities(x);
      for (int c = 0; c < k; c++) {
        assertThat(Float.floatToIntBits(p[c])).isEqualTo(Float.floatToIntBits(score[c] / total));
      }
    }
  }

  /** Every row, then as many rows with random cells made missing. */
  private static List<float[]> inputs(Dataset data) {
    List<float[]> out = new ArrayList<>();
    Random random = new Random(16);
    for (int r = 0; r < data.rows(); r++) {
      out.add(data.row(r));
      float[] x = data.row(r);
      for (int f = 0; f < x.length; f++) {
        if (random.nextInt(4) == 0) {
          x[f] = Float.NaN;
        }
      }
      out.add(x);
    }
    return out;
  }

  private static int countOf(int[] values, int value) {
    int n = 0;
    for (int v : values) {
      n += v == value ? 1 : 0;
    }
    return n;
  }
}
