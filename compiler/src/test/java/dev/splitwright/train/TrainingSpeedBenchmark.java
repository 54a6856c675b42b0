package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import java.util.Locale;
import weka.classifiers.trees.REPTree;
import weka.core.Instances;

/**
 * Times training on seeded synthetic data (not part of the test run). Run with the test class path
 * and {@code -Xmx2g}: {@code java -Xmx2g -cp ... dev.splitwright.train.TrainingSpeedBenchmark}.
 */
public final class TrainingSpeedBenchmark {
  private TrainingSpeedBenchmark() {}

  public static void main(String[] args) throws Exception {
    Dataset medium = SyntheticData.generate(200_000, 16, 0, 0, 2, 0, 11);
    TrainingOptions depth8 = TrainingOptions.builder().maxDepth(8).build();
    time("splitwright 200k x 16 depth 8 (cold)", medium, depth8);
    for (int i = 0; i < 3; i++) {
      time("splitwright 200k x 16 depth 8 (warm)", medium, depth8);
    }
    time("splitwright 200k x 16 depth 8 entropy",
        medium, depth8.toBuilder().impurity(Impurity.ENTROPY).build());
    Instances instances = WekaBridge.toInstances(medium, "synthetic");
    for (String[] opts : new String[][] {{"-L", "8"}, {"-L", "8", "-P"}}) {
      for (int i = 0; i < 2; i++) {
        REPTree rep = new REPTree();
        rep.setOptions(opts.clone());
        long t0 = System.nanoTime();
        rep.buildClassifier(instances);
        System.out.printf(Locale.ROOT, "weka REPTree %s 200k x 16: %.3f s%n",
            String.join(" ", opts), (System.nanoTime() - t0) / 1e9);
      }
    }
    instances = null;
    medium = null;
    Dataset large = SyntheticData.generate(1_000_000, 20, 0, 0, 2, 0, 12);
    TrainingOptions depth10 = TrainingOptions.builder().maxDepth(10).build();
    time("splitwright 1M x 20 depth 10 (cold)", large, depth10);
    time("splitwright 1M x 20 depth 10 (warm)", large, depth10);
    Runtime rt = Runtime.getRuntime();
    System.out.printf(Locale.ROOT, "max heap %d MB, used now %d MB%n",
        rt.maxMemory() >> 20, (rt.totalMemory() - rt.freeMemory()) >> 20);
  }

  private static void time(String what, Dataset data, TrainingOptions options) {
    long t0 = System.nanoTime();
    DecisionTree tree = CartTrainer.train(data, options);
    long t1 = System.nanoTime();
    int correct = 0;
    for (int r = 0; r < data.rows(); r++) {
      correct += tree.predict(data.row(r)) == data.label(r) ? 1 : 0;
    }
    System.out.printf(Locale.ROOT, "%s: %.3f s, %d leaves, depth %d, train accuracy %.4f%n",
        what, (t1 - t0) / 1e9, tree.leafCount(), tree.depth(), (double) correct / data.rows());
  }
}
