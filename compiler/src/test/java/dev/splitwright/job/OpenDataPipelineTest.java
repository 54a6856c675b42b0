package dev.splitwright.job;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.eval.SplitParts;
import dev.splitwright.eval.StratifiedSplit;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.train.AccuracyGap;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.train.WekaBridge;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.io.InputStream;
import java.lang.reflect.Method;
import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import weka.classifiers.trees.J48;
import weka.core.Attribute;
import weka.core.Instance;
import weka.core.Instances;
import weka.core.converters.ArffLoader;
import weka.core.converters.CSVLoader;

/**
 * Open data sets with categorical columns and missing cells through the real pipeline: split with
 * our stratified split, train a depth-4 tree, emit Java, compile it, and check that it returns
 * what the model returns on every row (rows with missing cells included) and every probe. Test
 * accuracy is compared with Weka 3.8.6's J48 (C4.5, default options) trained on the same training
 * rows, over several splits, within what the test rows can show ({@link AccuracyGap}).
 */
class OpenDataPipelineTest {
  /** The CLI's default seed, fixed before the first run and never tuned. */
  private static final long SEED = 1;
  /** Splits for the accuracy comparison: the default seed and the four after it, never tuned. */
  private static final long[] SPLIT_SEEDS = {1, 2, 3, 4, 5};
  private static final Verifier VERIFIER = Verifier.create();
  /** Inside the Weka jar; see src/test/resources/datasets/README.md. */
  private static final String GERMAN_CREDIT = "/weka/gui/beans/templates/credit-g.arff";

  @Test
  void germanCreditAllTwentyAttributesMatchesJ48AndCodeAgreesWithModel() throws Exception {
    // UCI Statlog (German Credit), 1000 rows, 7 numeric + 13 nominal attributes, read by Weka's
    // own ArffLoader and converted; J48 trains on the same rows converted back.
    Instances arff;
    try (InputStream in = Instances.class.getResourceAsStream(GERMAN_CREDIT)) {
      ArffLoader loader = new ArffLoader();
      loader.setSource(in);
      arff = loader.getDataSet();
    }
    arff.setClassIndex(arff.numAttributes() - 1);
    Dataset data = WekaBridge.toDataset(arff);
    long categorical = data.schema().features().stream().filter(f -> f.isCategorical()).count();
    assertThat(data.rows()).isEqualTo(1000);
    assertThat(categorical).isEqualTo(13);
    assertThat(data.featureCount() - categorical).isEqualTo(7);

    Outcome ours = runPipeline("credit-g", data);
    report("german credit (20 attributes)", ours);
    compareWithJ48(data, parts -> new Instances[] {
        WekaBridge.toInstances(parts.train(), "credit-train"),
        WekaBridge.toInstances(parts.test(), "credit-test")});
  }

  @Test
  void houseVotesWithMissingVotesKeepsEveryRowAndMatchesJ48() throws Exception {
    // UCI Congressional Voting Records: 16 y/n votes, empty cell = no vote; target FIRST column.
    Path file = resource("house-votes-84.csv");
    Dataset data = CsvLoader.load(file, LoadOptions.builder().target("Class").build()).dataset();
    assertThat(data.schema().features()).allSatisfy(f -> assertThat(f.isCategorical()).isTrue());
    Instances weka = wekaCsv("house-votes-84.csv", 0);
    assertSameTable(data, weka);

    Outcome ours = runPipeline("house-votes", data);
    report("house votes 84", ours);
    // 232 of the 435 rows are complete cases (from memory; awk over the file agrees).
    assertThat(ours.rowsWithMissingChecked).isEqualTo(435 - 232);
    assertThat(ours.trainRowsWithMissing).isPositive();
    compareWithJ48(data, parts -> new Instances[] {
        rows(weka, parts.trainRows()), rows(weka, parts.testRows())});
  }

  @Test
  void pimaWithMissingMeasurementsKeepsEveryRowAndMatchesJ48() throws Exception {
    // Pima Indians Diabetes (mlbench PimaIndiansDiabetes2): impossible zeros are empty cells.
    Path file = resource("pima-indians-diabetes-2.csv");
    Dataset data = CsvLoader.load(file).dataset();
    assertThat(data.schema().features()).noneSatisfy(f -> assertThat(f.isCategorical()).isTrue());
    Instances weka = wekaCsv("pima-indians-diabetes-2.csv", 8);
    assertSameTable(data, weka);

    Outcome ours = runPipeline("pima", data);
    report("pima diabetes", ours);
    // 392 of the 768 rows are complete cases (from memory; awk over the file agrees).
    assertThat(ours.rowsWithMissingChecked).isEqualTo(768 - 392);
    assertThat(ours.trainRowsWithMissing).isPositive();
    compareWithJ48(data, parts -> new Instances[] {
        rows(weka, parts.trainRows()), rows(weka, parts.testRows())});
  }

  /** Weka's copy of a split's training and test rows, in that order. */
  private interface WekaParts {
    Instances[] of(SplitParts parts) throws Exception;
  }

  /**
   * Trains our depth-4 tree and J48 on the same training rows of each split in {@link
   * #SPLIT_SEEDS}, prints the test accuracies and checks the mean gap.
   */
  private static void compareWithJ48(Dataset data, WekaParts weka) throws Exception {
    int k = SPLIT_SEEDS.length;
    double[] ours = new double[k];
    double[] j48 = new double[k];
    int testRows = 0;
    System.out.printf(Locale.ROOT, "  seed  test rows  splitwright     J48%n");
    for (int i = 0; i < k; i++) {
      SplitParts parts = StratifiedSplit.split(data, 0.6, 0.2, 0.2, SPLIT_SEEDS[i]);
      DecisionTree tree =
          CartTrainer.train(parts.train(), TrainingOptions.builder().maxDepth(4).build());
      ours[i] = accuracy(tree, parts.test());
      Instances[] wekaParts = weka.of(parts);
      j48[i] = j48Accuracy(wekaParts[0], wekaParts[1]);
      testRows = parts.test().rows();
      System.out.printf(Locale.ROOT, "  %4d  %9d  %11.4f  %6.4f%n",
          SPLIT_SEEDS[i], testRows, ours[i], j48[i]);
    }
    AccuracyGap.check("J48", ours, j48, testRows);
  }

  private static double accuracy(DecisionTree tree, Dataset test) {
    int correct = 0;
    for (int r = 0; r < test.rows(); r++) {
      correct += tree.predict(test.row(r)) == test.label(r) ? 1 : 0;
    }
    return (double) correct / test.rows();
  }

  /** What one run of split, train, emit and verify gave. */
  private record Outcome(SplitParts parts, DecisionTree tree, double accuracy,
      VerificationResult verification, int trainRowsWithMissing, int rowsWithMissingChecked) {}

  private static Outcome runPipeline(String name, Dataset data) throws Exception {
    SplitParts parts = StratifiedSplit.split(data, 0.6, 0.2, 0.2, SEED);
    DecisionTree tree =
        CartTrainer.train(parts.train(), TrainingOptions.builder().maxDepth(4).build());
    // No row was dropped: the root holds every training row, those with missing cells included.
    assertThat(parts.train().rows()).isEqualTo(parts.trainRows().length);
    assertThat(tree.root().counts().total()).isEqualTo(parts.train().rows());

    EmitOptions options = EmitOptions.builder("test.logs", "Classifier").build();
    EmittedSource source = JavaEmitter.emit(tree, options, HeaderInfo.none());
    List<Dataset> all = List.of(parts.train(), parts.validation(), parts.test());
    VerificationResult v = VERIFIER.verify(tree, source, options, all, SEED);
    assertThat(v.mismatches()).as(v.verdict()).isZero();
    assertThat(v.passed()).isTrue();
    assertThat(v.inputsChecked()).isGreaterThan(data.rows());

    // Independently of the verifier and of DecisionTree.predict: the compiled classify against
    // a walk of the tree written here from the split rules alone, on every row.
    CompiledClasses classes =
        VERIFIER.compiler().compileOne(source.qualifiedName(), source.source());
    Method classify = classes.load(source.qualifiedName()).getMethod("classify", float[].class);
    int withMissing = 0;
    for (Dataset part : all) {
      for (int r = 0; r < part.rows(); r++) {
        float[] x = part.row(r);
        withMissing += hasMissing(part.schema(), x) ? 1 : 0;
        assertThat((Integer) classify.invoke(null, (Object) x.clone()))
            .as("%s row %d", name, r).isEqualTo(walk(tree, x));
      }
    }
    int trainWithMissing = 0;
    for (int r = 0; r < parts.train().rows(); r++) {
      trainWithMissing += hasMissing(data.schema(), parts.train().row(r)) ? 1 : 0;
    }
    return new Outcome(parts, tree, accuracy(tree, parts.test()), v, trainWithMissing,
        withMissing);
  }

  /**
   * The leaf's class for {@code x}, from the rules the model documents: a numeric split sends
   * {@code x <= threshold} left and NaN to its missing side (IEEE 754: NaN compares false); a
   * categorical split sends a code in its set left and NaN or anything but a whole code in
   * {@code [0, k)} to its missing side.
   */
  private static int walk(DecisionTree tree, float[] x) {
    Node node = tree.root();
    while (node instanceof Split split) {
      float v = x[split.feature()];
      boolean left;
      if (split instanceof NumericSplit numeric) {
        left = Float.isNaN(v) ? numeric.missingLeft() : v <= numeric.threshold();
      } else {
        CategoricalSplit categorical = (CategoricalSplit) split;
        int k = tree.schema().feature(split.feature()).categories().size();
        boolean code = v >= 0 && v < k && v == Math.floor(v);
        left = code ? categorical.leftCodes().contains((int) v) : categorical.missingLeft();
      }
      node = left ? split.left() : split.right();
    }
    return ((Leaf) node).prediction();
  }

  private static boolean hasMissing(Schema schema, float[] x) {
    for (int f = 0; f < x.length; f++) {
      if (schema.feature(f).isMissing(x[f])) {
        return true;
      }
    }
    return false;
  }

  private static void report(String name, Outcome o) {
    System.out.printf(Locale.ROOT, "%s: train %d rows (%d with missing cells), test %d;"
            + " test accuracy splitwright depth 4 %.4f (%d leaves);"
            + " verified %d inputs (%d rows with missing cells), %d mismatches%n",
        name, o.parts.train().rows(), o.trainRowsWithMissing, o.parts.test().rows(), o.accuracy,
        o.tree.leafCount(), o.verification.inputsChecked(), o.rowsWithMissingChecked,
        o.verification.mismatches());
  }

  private static Path resource(String name) throws URISyntaxException {
    return Path.of(OpenDataPipelineTest.class.getResource("/datasets/" + name).toURI());
  }

  /** Reads the CSV with Weka's own parser, independently of ours. */
  private static Instances wekaCsv(String name, int classIndex) throws Exception {
    CSVLoader loader = new CSVLoader();
    loader.setMissingValue(""); // the files leave missing cells empty
    try (InputStream in = OpenDataPipelineTest.class.getResourceAsStream("/datasets/" + name)) {
      loader.setSource(in);
      Instances data = loader.getDataSet();
      data.setClassIndex(classIndex);
      return data;
    }
  }

  /**
   * Checks that our loader and Weka's read the same table, row by row, so the row indices of our
   * split select the same rows on both sides.
   */
  private static void assertSameTable(Dataset ours, Instances weka) {
    assertThat(weka.numInstances()).isEqualTo(ours.rows());
    Schema schema = ours.schema();
    for (int r = 0; r < ours.rows(); r++) {
      Instance row = weka.instance(r);
      assertThat(row.stringValue(weka.classIndex())).isEqualTo(schema.classes().get(ours.label(r)));
      for (int f = 0; f < schema.featureCount(); f++) {
        Attribute a = weka.attribute(schema.feature(f).name());
        float v = ours.value(r, f);
        assertThat(row.isMissing(a)).as("row %d %s", r, a.name()).isEqualTo(Float.isNaN(v));
        if (row.isMissing(a)) {
          continue;
        }
        if (a.isNominal()) {
          assertThat(row.stringValue(a)).isEqualTo(schema.feature(f).categories().get((int) v));
        } else {
          assertThat((float) row.value(a)).isEqualTo(v);
        }
      }
    }
  }

  private static Instances rows(Instances all, int[] indices) {
    Instances out = new Instances(all, indices.length);
    for (int r : indices) {
      out.add(all.instance(r));
    }
    return out;
  }

  private static double j48Accuracy(Instances train, Instances test) throws Exception {
    J48 j48 = new J48();
    j48.buildClassifier(train);
    int correct = 0;
    for (int r = 0; r < test.numInstances(); r++) {
      Instance row = test.instance(r);
      correct += j48.classifyInstance(row) == row.classValue() ? 1 : 0;
    }
    return (double) correct / test.numInstances();
  }
}
