package dev.splitwright.bench;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.Dataset;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import weka.classifiers.Classifier;
import weka.core.Instances;

class ModelStoreTest {
  @TempDir Path dir;

  private final Dataset rows = SyntheticTable.generate(2_000, 8, 4);
  private final Instances instances = WekaData.of(rows, "t");

  @Test
  void storedModelLoadsAndPredictsLikeTheTrainedOne() throws Exception {
    ModelStore store = new ModelStore(dir);
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
    ModelStore store = new ModelStore(dir);
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
}
