package dev.splitwright.bench;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.data.Dataset;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import weka.classifiers.Classifier;
import weka.classifiers.trees.J48;
import weka.classifiers.trees.REPTree;
import weka.core.Instances;

/**
 * Describes the trees the prediction benchmark compares: size and accuracy on the fresh readings,
 * so that a reader sees the forms answer the same question about equally well. Run as {@code main
 * <out.md>} after the benchmarks (Weka models then come from the {@link BenchStore}).
 */
public final class ModelSummary {
  private ModelSummary() {}

  public static void main(String[] args) throws Exception {
    if (args.length != 1) {
      System.err.println("usage: ModelSummary <out.md>");
      System.exit(2);
    }
    Files.writeString(Path.of(args[0]), render(), StandardCharsets.UTF_8);
  }

  static String render() throws Exception {
    StringBuilder md = new StringBuilder("## The trees compared\n\n"
        + "| model | form | size | accuracy on the fresh readings |\n|---|---|---|---:|\n");
    BenchStore store = BenchStore.fromSystemProperty();
    for (BenchModel model : BenchModel.values()) {
      Dataset training = model.trainingSet();
      LabelledRows fresh = model.freshReadings(training);
      String name = String.format(Locale.ROOT, "%s (%d training rows)", model.paramName(),
          training.rows());
      DecisionTree tree = CartTrainer.train(training, model.trainingOptions());
      md.append(String.format(Locale.ROOT,
          "| %s | Splitwright CART, depth limit %d | depth %d, %d leaves; `branches` class file"
              + " %d bytes | %s |%n", name, model.depth(), tree.depth(), tree.leafCount(),
          branchesClassBytes(tree), percent(accuracy(tree, fresh))));
      Instances instances = WekaData.of(training, model.paramName());
      for (WekaLearner learner : WekaLearner.values()) {
        Classifier weka = store.trainedOn(learner, model.depth(), training, () -> instances);
        String options = String.join(" ", learner.options(model.depth()));
        md.append(String.format(Locale.ROOT, "| %s | Weka %s %s | %s | %s |%n", name,
            learner.displayName(), options.isEmpty() ? "(defaults)" : "`" + options + "`",
            size(weka), percent(accuracy(weka, instances, fresh))));
      }
    }
    return md.append("\nAccuracy: share of the ").append(BenchModel.INPUT_ROWS)
        .append(" fresh readings (independent rows, never trained on) whose logged label the"
            + " tree predicts.\n").toString();
  }

  private static int branchesClassBytes(DecisionTree tree) throws Exception {
    EmitOptions options = EmitOptions.builder(GeneratedClassifier.PACKAGE, "Sized").build();
    EmittedSource source = JavaEmitter.emit(tree, options, HeaderInfo.none());
    try (InMemoryCompiler javac = InMemoryCompiler.create(List.of("--release", "17"))) {
      CompiledClasses classes = javac.compileOne(source.qualifiedName(), source.source());
      return classes.names().stream().mapToInt(classes::size).sum();
    }
  }

  private static String size(Classifier weka) {
    if (weka instanceof J48 j48) {
      return String.format(Locale.ROOT, "%.0f nodes, %.0f leaves", j48.measureTreeSize(),
          j48.measureNumLeaves());
    }
    if (weka instanceof REPTree rep) {
      return rep.numNodes() + " nodes";
    }
    return "";
  }

  private static double accuracy(DecisionTree tree, LabelledRows rows) {
    int right = 0;
    for (int i = 0; i < rows.size(); i++) {
      right += tree.predict(rows.rows()[i]) == rows.labels()[i] ? 1 : 0;
    }
    return (double) right / rows.size();
  }

  private static double accuracy(Classifier weka, Instances header, LabelledRows rows)
      throws Exception {
    int right = 0;
    for (int i = 0; i < rows.size(); i++) {
      double predicted = weka.classifyInstance(WekaData.instance(header, rows.rows()[i]));
      right += (int) predicted == rows.labels()[i] ? 1 : 0;
    }
    return (double) right / rows.size();
  }

  private static String percent(double share) {
    return String.format(Locale.ROOT, "%.1f%%", 100 * share);
  }

}
