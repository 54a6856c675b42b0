package dev.splitwright.bench;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.CompilationException;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.data.Dataset;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import weka.classifiers.Classifier;
import weka.core.Instances;

class BenchStoreTest {
  @TempDir Path dir;

  private final Dataset rows = SyntheticTable.generate(2_000, 8, 4);
  private final Instances instances = WekaData.of(rows, "t");

  @Test
  void storedModelLoadsAndPredictsLikeTheTrainedOne() throws Exception {
    BenchStore store = new BenchStore(dir);
    Classifier trained = store.trainedOn(WekaLearner.REP_TREE, 5, rows, () -> instances);
    Path file = store.fileFor(WekaLearner.REP_TREE, 5, rows);
    assertThat(file).isRegularFile();

    Classifier loaded = store.trainedOn(WekaLearner.REP_TREE, 5, rows, () -> instances);
    assertThat(loaded).isNotSameAs(trained);
    for (int i = 0; i < instances.numInstances(); i++) {
      assertThat(loaded.classifyInstance(instances.instance(i)))
          .isEqualTo(trained.classifyInstance(instances.instance(i)));
    }
    try (var files = Files.list(dir)) {
      assertThat(files).containsExactly(file);
    }
  }

  @Test
  void keyChangesWithOptionsLearnerAndEveryLabel() {
    BenchStore store = new BenchStore(dir);
    int[] labels = rows.labels();
    labels[labels.length - 1] = (labels[labels.length - 1] + 1) % SyntheticTable.CLASSES;
    float[][] columns = new float[rows.featureCount()][];
    for (int f = 0; f < columns.length; f++) {
      columns[f] = rows.column(f);
    }
    Dataset relabelled = Dataset.of(rows.schema(), columns, labels);

    Path base = store.fileFor(WekaLearner.REP_TREE, 5, rows);
    assertThat(store.fileFor(WekaLearner.REP_TREE, 6, rows)).isNotEqualTo(base);
    assertThat(store.fileFor(WekaLearner.J48, 5, rows)).isNotEqualTo(base);
    assertThat(store.fileFor(WekaLearner.REP_TREE, 5, relabelled)).isNotEqualTo(base);
    // J48 takes no depth, so the depth must not split its entries.
    assertThat(store.fileFor(WekaLearner.J48, 5, rows))
        .isEqualTo(store.fileFor(WekaLearner.J48, 14, rows));
  }

  /** Readings i = 0..n-1 with values (i, seed) and label i % 2, counting full generations. */
  private final List<Integer> generated = new ArrayList<>();

  private LabelledRows readings(int n, float offset) {
    generated.add(n);
    float[][] rows = new float[n][];
    int[] labels = new int[n];
    for (int i = 0; i < n; i++) {
      rows[i] = new float[] {i + offset, Float.NaN};
      labels[i] = i % 2;
    }
    return new LabelledRows(rows, labels);
  }

  @Test
  void readingsAreGeneratedOnceThenLoadedBitForBit() throws Exception {
    BenchStore store = new BenchStore(dir);
    LabelledRows first = store.readings("r", 1_000, 7, n -> readings(n, 0.5f));
    LabelledRows second = store.readings("r", 1_000, 7, n -> readings(n, 0.5f));

    // Each call fingerprints the generator with 64 rows; only the first generates all 1,000.
    assertThat(generated).containsExactly(64, 1_000, 64);
    assertThat(second.labels()).containsExactly(first.labels());
    for (int i = 0; i < first.size(); i++) {
      assertThat(second.rows()[i][0]).isEqualTo(first.rows()[i][0]);
      assertThat(second.rows()[i][1]).isNaN();
    }
  }

  @Test
  void changedGeneratorOutputIsGeneratedAfresh() throws Exception {
    BenchStore store = new BenchStore(dir);
    store.readings("r", 1_000, 7, n -> readings(n, 0.5f));
    LabelledRows changed = store.readings("r", 1_000, 7, n -> readings(n, 0.25f));

    assertThat(generated).containsExactly(64, 1_000, 64, 1_000);
    assertThat(changed.rows()[3][0]).isEqualTo(3.25f);
  }

  @Test
  void compiledClassesAreStoredBySourceText() throws Exception {
    BenchStore store = new BenchStore(dir);
    String source = "package p; public final class A { class Inner {} }";
    List<String> options = List.of("--release", "17");
    CompiledClasses first = store.compiled("p.A", source, options, () -> compile(source));
    CompiledClasses again = store.compiled("p.A", source, options, () -> {
      throw new AssertionError("must come from the store");
    });

    assertThat(again.names()).containsExactly("p.A", "p.A$Inner");
    assertThat(again.bytes("p.A$Inner")).isEqualTo(first.bytes("p.A$Inner"));
    String changed = source.replace("Inner", "Other");
    assertThat(store.compiled("p.A", changed, options, () -> compile(changed)).names())
        .containsExactly("p.A", "p.A$Other");
  }

  private static CompiledClasses compile(String source) throws CompilationException {
    try (InMemoryCompiler javac = InMemoryCompiler.create(List.of("--release", "17"))) {
      return javac.compileOne("p.A", source);
    }
  }
}
