package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.train.reference.ReferenceTrainer;
import java.io.InputStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import weka.core.Instances;
import weka.core.converters.ArffLoader;

/**
 * The trainer must grow exactly the trees it grew before it was made faster: {@link
 * ReferenceTrainer} is a frozen copy of it (commit f72b88f), and every tree here is compared with
 * the reference's node for node: features, thresholds to the float bit, left code sets, missing
 * sides, class counts and leaf predictions.
 */
class TrainerEquivalenceTest {
  /** Inside the Weka jar; see src/test/resources/datasets/README.md. */
  private static final String GERMAN_CREDIT = "/weka/gui/beans/templates/credit-g.arff";

  static Stream<Arguments> openDataSets() {
    // The open data sets of src/test/resources/datasets/README.md and Weka's German credit data.
    return Stream.of(
        Arguments.of("breast-cancer-wisconsin-diagnostic.csv", "diagnosis"),
        Arguments.of("pima-indians-diabetes-2.csv", "diabetes"),
        Arguments.of("house-votes-84.csv", "Class"),
        Arguments.of("credit-g.arff", "class"));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("openDataSets")
  void sameTreesOnOpenDataSets(String file, String target) throws Exception {
    Dataset data = load(file, target);
    int compared = 0;
    for (Impurity impurity : Impurity.values()) {
      for (ClassWeights weights : List.of(ClassWeights.none(), ClassWeights.inverseFrequency())) {
        for (int depth : new int[] {1, 3, 6, 40}) {
          for (int minLeaf : new int[] {1, 7}) {
            for (int maxLeaves : new int[] {2, 9, TrainingOptions.UNLIMITED_LEAVES}) {
              TrainingOptions options = TrainingOptions.builder().impurity(impurity)
                  .weights(weights).maxDepth(depth).minLeaf(minLeaf).maxLeaves(maxLeaves)
                  .build();
              assertSameTree(data, options, file);
              compared++;
            }
          }
        }
      }
    }
    assertThat(compared).isEqualTo(96);
  }

  /** 200 seeded tables of every shape the trainer meets, each with its own random options. */
  static IntStream seeds() {
    return IntStream.range(0, 200);
  }

  @ParameterizedTest(name = "seed {0}")
  @MethodSource("seeds")
  void sameTreesOnRandomDataSets(int seed) {
    Random random = new Random(1_700_000L + seed);
    Dataset data = randomTable(random);
    TrainingOptions options = randomOptions(random, data.schema());
    assertSameTree(data, options, "seed " + seed);
  }

  /** A larger table: long segments, many ties, missing values, four classes. */
  @Test
  void sameTreesOnALargerTable() {
    Dataset data = SyntheticData.generate(30_000, 8, 3, 9, 4, 0.05, 17);
    for (Impurity impurity : Impurity.values()) {
      assertSameTree(data, TrainingOptions.builder().impurity(impurity).maxDepth(14).build(),
          "larger " + impurity);
      assertSameTree(data, TrainingOptions.builder().impurity(impurity).maxDepth(30)
          .maxLeaves(200).minLeaf(3).weights(ClassWeights.inverseFrequency()).build(),
          "larger best-first " + impurity);
    }
  }

  /**
   * Past {@link JitPrimer#MIN_CELLS}, so that the first training of this size in the JVM is primed
   * first, and large enough that the sort, the split searches and the partitions of the upper
   * nodes run in two shares ({@link TwoShares}) on two cores: neither may change the tree.
   */
  @Test
  void sameTreesOnATablePastThePrimingSize() {
    Dataset data = SyntheticData.generate(240_000, 14, 4, 6, 4, 0.02, 23);
    assertThat((long) data.rows() * data.featureCount()).isGreaterThanOrEqualTo(
        JitPrimer.MIN_CELLS);
    TrainingOptions options = TrainingOptions.builder().maxDepth(9).build();
    assertSameTree(data, options, "past the priming size");
    assertSameTree(data, options.toBuilder().impurity(Impurity.ENTROPY).build(),
        "past the priming size, entropy");
  }

  private static void assertSameTree(Dataset data, TrainingOptions options, String what) {
    DecisionTree expected = ReferenceTrainer.train(data, options);
    DecisionTree actual = CartTrainer.train(data, options);
    String where = firstDifference(expected.root(), actual.root(), "root");
    assertThat(where).as("%s with %s: first differing node", what, describe(options)).isEmpty();
    assertThat(actual).isEqualTo(expected);
  }

  /** Returns the path to the first node that differs, or "" if the trees are equal. */
  private static String firstDifference(Node a, Node b, String path) {
    if (!a.counts().equals(b.counts())) {
      return path + ": counts " + a.counts() + " vs " + b.counts();
    }
    if (a instanceof Leaf la && b instanceof Leaf lb) {
      return la.prediction() == lb.prediction() ? "" : path + ": prediction";
    }
    if (a instanceof NumericSplit na && b instanceof NumericSplit nb) {
      if (na.feature() != nb.feature()
          || Float.floatToRawIntBits(na.threshold()) != Float.floatToRawIntBits(nb.threshold())
          || na.missingLeft() != nb.missingLeft()) {
        return path + ": " + na.feature() + " <= " + na.threshold() + " (missing left "
            + na.missingLeft() + ") vs " + nb.feature() + " <= " + nb.threshold()
            + " (missing left " + nb.missingLeft() + ")";
      }
      String left = firstDifference(na.left(), nb.left(), path + ".L");
      return left.isEmpty() ? firstDifference(na.right(), nb.right(), path + ".R") : left;
    }
    if (a instanceof CategoricalSplit ca && b instanceof CategoricalSplit cb) {
      if (ca.feature() != cb.feature() || !ca.leftCodes().equals(cb.leftCodes())
          || ca.missingLeft() != cb.missingLeft()) {
        return path + ": categorical split differs";
      }
      String left = firstDifference(ca.left(), cb.left(), path + ".L");
      return left.isEmpty() ? firstDifference(ca.right(), cb.right(), path + ".R") : left;
    }
    return path + ": node kinds differ";
  }

  private static String describe(TrainingOptions o) {
    return String.format(Locale.ROOT, "%s depth %d leaves %d minLeaf %d weights %s",
        o.impurity(), o.maxDepth(), o.maxLeaves(), o.minLeaf(), o.weights().optionText());
  }

  private static Dataset load(String file, String target) throws Exception {
    if (file.endsWith(".arff")) {
      ArffLoader loader = new ArffLoader();
      try (InputStream in = Instances.class.getResourceAsStream(GERMAN_CREDIT)) {
        loader.setSource(in);
        Instances instances = loader.getDataSet();
        instances.setClassIndex(instances.attribute(target).index());
        return WekaBridge.toDataset(instances);
      }
    }
    Path path = Path.of(TrainerEquivalenceTest.class.getResource("/datasets/" + file).toURI());
    return CsvLoader.load(path, LoadOptions.builder().target(target).build()).dataset();
  }

  /**
   * Up to 2,500 rows of numeric and categorical features drawn from distributions with few or
   * many distinct values (ties), infinities, signed zeros and missing cells, and 2 to 6 classes
   * that depend on a few features with label noise.
   */
  private static Dataset randomTable(Random random) {
    int rows = 1 + random.nextInt(random.nextInt(4) == 0 ? 60 : 2500);
    int numeric = random.nextInt(6);
    int categorical = random.nextInt(numeric == 0 ? 3 : 4) + (numeric == 0 ? 1 : 0);
    int classes = 2 + random.nextInt(5);
    double missingRate = random.nextInt(3) == 0 ? 0 : random.nextDouble() * 0.4;
    List<Feature> features = new ArrayList<>();
    int[] kinds = new int[numeric];
    for (int f = 0; f < numeric; f++) {
      features.add(Feature.numeric("x" + f));
      kinds[f] = random.nextInt(5);
    }
    int[] categoryCounts = new int[categorical];
    for (int f = 0; f < categorical; f++) {
      categoryCounts[f] = 1 + random.nextInt(random.nextBoolean() ? 4 : 40);
      List<String> codes = new ArrayList<>();
      for (int c = 0; c < categoryCounts[f]; c++) {
        codes.add("v" + c);
      }
      features.add(Feature.categorical("k" + f, codes));
    }
    List<String> labels = new ArrayList<>();
    for (int c = 0; c < classes; c++) {
      labels.add("y" + c);
    }
    Schema schema = new Schema(features, "label", labels);
    float[][] columns = new float[features.size()][rows];
    int[] y = new int[rows];
    double noise = random.nextDouble() * 0.3;
    for (int r = 0; r < rows; r++) {
      double score = 0;
      for (int f = 0; f < numeric; f++) {
        float v = numericValue(kinds[f], random);
        columns[f][r] = v;
        score += Float.isFinite(v) ? Math.sin(v * (f + 1)) : 1;
      }
      for (int f = 0; f < categorical; f++) {
        int code = random.nextInt(categoryCounts[f]);
        columns[numeric + f][r] = code;
        score += (code * 7 + f) % 5 * 0.4;
      }
      int label = Math.floorMod((int) Math.floor(score * 1.3), classes);
      if (random.nextDouble() < noise) {
        label = random.nextInt(classes);
      }
      y[r] = label;
      for (int f = 0; f < columns.length; f++) {
        if (random.nextDouble() < missingRate) {
          columns[f][r] = Float.NaN;
        }
      }
    }
    return Dataset.of(schema, columns, y);
  }

  private static float numericValue(int kind, Random random) {
    return switch (kind) {
      case 0 -> (float) random.nextGaussian();
      case 1 -> random.nextInt(4); // few distinct values
      case 2 -> (float) (Math.round(random.nextGaussian() * 20) / 10.0); // ties, signed zeros
      case 3 -> switch (random.nextInt(8)) {
        case 0 -> Float.NEGATIVE_INFINITY;
        case 1 -> Float.POSITIVE_INFINITY;
        case 2 -> -0.0f;
        case 3 -> Float.MAX_VALUE;
        default -> (float) (random.nextDouble() * 1e6);
      };
      default -> (float) Math.exp(random.nextGaussian() * 3);
    };
  }

  private static TrainingOptions randomOptions(Random random, Schema schema) {
    ClassWeights weights = switch (random.nextInt(3)) {
      case 0 -> ClassWeights.none();
      case 1 -> ClassWeights.inverseFrequency();
      default -> {
        Map<String, Double> byLabel = new TreeMap<>();
        for (String label : schema.classes()) {
          if (random.nextBoolean()) {
            byLabel.put(label, 0.1 + random.nextDouble() * 5);
          }
        }
        yield ClassWeights.of(byLabel);
      }
    };
    return TrainingOptions.builder()
        .impurity(random.nextBoolean() ? Impurity.GINI : Impurity.ENTROPY)
        .maxDepth(1 + random.nextInt(random.nextBoolean() ? 4 : 25))
        .minLeaf(random.nextInt(3) == 0 ? 1 + random.nextInt(20) : 1)
        .maxLeaves(random.nextBoolean() ? TrainingOptions.UNLIMITED_LEAVES
            : 2 + random.nextInt(40))
        .weights(weights)
        .build();
  }
}
