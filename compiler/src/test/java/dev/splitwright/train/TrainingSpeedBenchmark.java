package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import java.util.Locale;
import weka.classifiers.trees.REPTree;
import weka.core.Instances;

/**
 * Times training on seeded synthetic data; not part of the test run. Run each case in a fresh JVM
 * with the test class path and {@code -Xmx2g}, naming the case as the argument; cases:
 * {@code medium} (200,000 x 16, depth 8), {@code weka} (Weka REPTree on the same rows),
 * {@code large} (1,000,000 x 20, depth 10). The first run includes JIT warm-up, as a command-line
 * user would see it; later runs show the steady state.
 */
public final class TrainingSpeedBenchmark {
  private TrainingSpeedBenchmark() {}

  public static void main(String[] args) throws Exception {
    String which = args.length > 0 ? args[0] : "medium";
    switch (which) {
      case "medium" -> {
        Dataset data = SyntheticData.generate(200_000, 16, 0, 0, 2, 0, 11);
        TrainingOptions options = TrainingOptions.builder().maxDepth(8).build();
        for (int i = 0; i < 4; i++) {
          time("200k x 16 depth 8 gini, run " + (i + 1), data, options);
        }
        time("200k x 16 depth 8 entropy", data,
            options.toBuilder().impurity(Impurity.ENTROPY).build());
      }
      case "weka" -> {
        Dataset rows = SyntheticData.generate(200_000, 16, 0, 0, 2, 0, 11);
        Instances data = WekaBridge.toInstances(rows, "synthetic");
        for (String[] options : new String[][] {{"-L", "8"}, {"-L", "8", "-P"}}) {
          for (int i = 0; i < 2; i++) {
            REPTree tree = new REPTree();
            tree.setOptions(options.clone());
            long t0 = System.nanoTime();
            tree.buildClassifier(data);
            System.out.printf(Locale.ROOT, "Weka REPTree %s, 200k x 16, run %d: %.3f s%n",
                String.join(" ", options), i + 1, (System.nanoTime() - t0) / 1e9);
          }
        }
      }
      case "large" -> {
        Dataset data = SyntheticData.generate(1_000_000, 20, 0, 0, 2, 0, 12);
        TrainingOptions options = TrainingOptions.builder().maxDepth(10).build();
        for (int i = 0; i < 3; i++) {
          time("1M x 20 depth 10 gini, run " + (i + 1), data, options);
        }
        Runtime rt = Runtime.getRuntime();
        System.out.printf(Locale.ROOT, "max heap %d MB%n", rt.maxMemory() >> 20);
      }
      default -> throw new IllegalArgumentException("unknown case: " + which);
    }
  }

  private static void time(String what, Dataset data, TrainingOptions options) {
    long t0 = System.nanoTime();
    DecisionTree tree = CartTrainer.train(data, options);
    long t1 = System.nanoTime();
    int correct = 0;
    for (int r = 0; r < data.rows(); r++) {
      correct += tree.predict(data.row(r)) == data.label(r) ? 1 : 0;
    }
    System.out.printf(Locale.ROOT, "%s: %.3f s, %d leaves, depth %d, training accuracy %.4f%n",
        what, (t1 - t0) / 1e9, tree.leafCount(), tree.depth(), (double) correct / data.rows());
  }
}
