package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import dev.splitwright.data.Dataset;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.model.TreeEnsemble;
import java.util.Locale;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import weka.classifiers.trees.RandomForest;
import weka.core.Instance;
import weka.core.Instances;

/**
 * Our voting forest against Weka 3.8.6's {@code weka.classifiers.trees.RandomForest} (the
 * reference library, test scope only) with the same number of trees and depth limit, trained on
 * the same rows of each shared open data set (provenance in src/test/resources/datasets/README.md)
 * and scored on the same test rows. Both use their default feature count per split, which is
 * {@code floor(log2 F) + 1} for both (Breiman 2001; Weka's default, from memory).
 *
 * <p>A test part of 87 to 200 rows moves one accuracy by 0.5 to 1.2 points a row, so each
 * accuracy is the mean over five seeded 60/20/20 splits ({@link ComparisonSplit}), each forest
 * seeded with its split's seed, for both libraries alike.
 */
class ForestWekaComparisonTest {
  /** The seeds of WekaComparisonTest; never tuned. */
  private static final long[] SPLIT_SEEDS = {1984, 1985, 1986, 1987, 1988};
  private static final int TREES = 32;
  private static final int DEPTH = 8;
  /** The bound (issue 16): within 2 points of Weka's accuracy. */
  private static final double POINTS = 0.02;

  @ParameterizedTest(name = "{0}")
  @ValueSource(strings = {"breast", "pima", "votes", "credit"})
  void forestIsAsAccurateAsWekaRandomForest(String key) throws Exception {
    Dataset data = OpenDataSets.load(key);
    double ours = 0;
    double weka = 0;
    System.out.printf(Locale.ROOT, "%s: %d trees, depth %d%n  seed  ours    Weka%n", key, TREES,
        DEPTH);
    for (long seed : SPLIT_SEEDS) {
      int[][] parts = ComparisonSplit.of(data.labels(), seed);
      Dataset train = data.subset(parts[0]);
      Dataset test = data.subset(parts[2]);

      long start = System.nanoTime();
      TreeEnsemble forest = ForestTrainer.train(train,
          ForestOptions.of(TREES, seed, TrainingOptions.builder().maxDepth(DEPTH).build()));
      long oursNanos = System.nanoTime() - start;
      double a = Evaluator.score(forest, test).accuracy();

      RandomForest reference = new RandomForest();
      reference.setNumIterations(TREES);
      reference.setMaxDepth(DEPTH);
      reference.setSeed((int) seed);
      start = System.nanoTime();
      reference.buildClassifier(WekaBridge.toInstances(train, key));
      long wekaNanos = System.nanoTime() - start;
      double b = accuracy(reference, WekaBridge.toInstances(test, key));
      System.out.printf(Locale.ROOT, "  %d  %.4f  %.4f  (train %d ms vs %d ms)%n", seed, a, b,
          oursNanos / 1_000_000, wekaNanos / 1_000_000);
      ours += a / SPLIT_SEEDS.length;
      weka += b / SPLIT_SEEDS.length;
    }
    System.out.printf(Locale.ROOT, "  mean  %.4f  %.4f  difference %+.4f%n", ours, weka,
        ours - weka);
    assertThat(ours).as("mean test accuracy against Weka's %.4f", weka)
        .isCloseTo(weka, within(POINTS));
  }

  private static double accuracy(RandomForest forest, Instances test) throws Exception {
    int correct = 0;
    for (int r = 0; r < test.numInstances(); r++) {
      Instance row = test.instance(r);
      correct += forest.classifyInstance(row) == row.classValue() ? 1 : 0;
    }
    return (double) correct / test.numInstances();
  }
}
