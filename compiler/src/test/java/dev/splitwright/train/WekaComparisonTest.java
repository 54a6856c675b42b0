package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import java.io.InputStream;
import java.util.Locale;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import weka.classifiers.Classifier;
import weka.classifiers.trees.J48;
import weka.classifiers.trees.REPTree;
import weka.core.Instance;
import weka.core.Instances;
import weka.core.converters.ArffLoader;
import weka.core.converters.CSVLoader;

/**
 * Compares test accuracy with Weka 3.8.6's J48 (C4.5, default options) and REPTree (depth limit
 * 4) trained on the same rows of open data sets (src/test/resources/datasets/README.md), over
 * several seeded 60/20/20 splits. A depth-4 CART tree should be about as accurate, within what
 * test sets of 80 to 200 rows can show ({@link AccuracyGap}).
 */
class WekaComparisonTest {
  /** The first fixed before the first run, the others the four after it; never tuned. */
  private static final long[] SPLIT_SEEDS = {1984, 1985, 1986, 1987, 1988};
  /** Inside the Weka jar; see the data sets README. */
  private static final String GERMAN_CREDIT = "/weka/gui/beans/templates/credit-g.arff";

  static Stream<Arguments> dataSets() {
    return Stream.of(
        Arguments.of("breast cancer (569 x 30 numeric)", "breast"),
        // Pima first without the 376 rows that have a missing cell (the complete cases) ...
        Arguments.of("pima, rows with missing cells dropped", "pima-complete"),
        // ... then with them, exercising our learned routing of missing values.
        Arguments.of("pima, rows with missing cells kept", "pima-all"),
        Arguments.of("german credit, 7 numeric attributes only", "credit-numeric"),
        Arguments.of("german credit, all 20 attributes", "credit-all"));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("dataSets")
  void depthFourTreeIsAsAccurateAsWekaTrees(String description, String key) throws Exception {
    Dataset data = WekaBridge.toDataset(load(key));
    int k = SPLIT_SEEDS.length;
    double[] ours = new double[k];
    double[] j48 = new double[k];
    double[] rep = new double[k];
    int testRows = 0;
    System.out.printf(Locale.ROOT, "%s%n  seed  test rows  splitwright     J48  REPTree -L 4%n",
        description);
    for (int i = 0; i < k; i++) {
      int[][] parts = ComparisonSplit.of(data.labels(), SPLIT_SEEDS[i]);
      Dataset train = data.subset(parts[0]);
      Dataset test = data.subset(parts[2]);
      testRows = test.rows();

      DecisionTree tree = CartTrainer.train(train, TrainingOptions.builder().maxDepth(4).build());
      ours[i] = accuracy(tree, test);
      Instances wekaTrain = WekaBridge.toInstances(train, key);
      Instances wekaTest = WekaBridge.toInstances(test, key);
      j48[i] = accuracy(new J48(), wekaTrain, wekaTest);
      REPTree repTree = new REPTree();
      repTree.setOptions(new String[] {"-L", "4"});
      rep[i] = accuracy(repTree, wekaTrain, wekaTest);
      System.out.printf(Locale.ROOT, "  %4d  %9d  %11.4f  %6.4f  %12.4f%n",
          SPLIT_SEEDS[i], testRows, ours[i], j48[i], rep[i]);
    }
    AccuracyGap.check("J48", ours, j48, testRows);
    AccuracyGap.check("REPTree", ours, rep, testRows);
  }

  private static Instances load(String key) throws Exception {
    Instances data;
    if (key.startsWith("credit")) {
      ArffLoader loader = new ArffLoader();
      try (InputStream in = Instances.class.getResourceAsStream(GERMAN_CREDIT)) {
        loader.setSource(in);
        data = loader.getDataSet();
      }
    } else {
      String file =
          key.equals("breast")
              ? "breast-cancer-wisconsin-diagnostic.csv"
              : "pima-indians-diabetes-2.csv";
      CSVLoader loader = new CSVLoader();
      loader.setMissingValue(""); // the files leave missing cells empty
      try (InputStream in = WekaComparisonTest.class.getResourceAsStream("/datasets/" + file)) {
        loader.setSource(in);
        data = loader.getDataSet();
      }
    }
    data.setClassIndex(data.numAttributes() - 1);
    if (key.equals("pima-complete")) {
      for (int a = 0; a < data.numAttributes(); a++) {
        data.deleteWithMissing(a);
      }
    }
    if (key.equals("credit-numeric")) {
      for (int a = data.numAttributes() - 1; a >= 0; a--) {
        if (a != data.classIndex() && data.attribute(a).isNominal()) {
          data.deleteAttributeAt(a);
        }
      }
    }
    return data;
  }

  private static double accuracy(DecisionTree tree, Dataset test) {
    int correct = 0;
    for (int r = 0; r < test.rows(); r++) {
      correct += tree.predict(test.row(r)) == test.label(r) ? 1 : 0;
    }
    return (double) correct / test.rows();
  }

  private static double accuracy(Classifier classifier, Instances train, Instances test)
      throws Exception {
    classifier.buildClassifier(train);
    int correct = 0;
    for (int r = 0; r < test.numInstances(); r++) {
      Instance row = test.instance(r);
      correct += classifier.classifyInstance(row) == row.classValue() ? 1 : 0;
    }
    return (double) correct / test.numInstances();
  }
}
