package dev.splitwright.bench;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.BenchmarkParams;
import weka.classifiers.Classifier;
import weka.core.Instances;

/**
 * Wall time of one training run, as a build would see it: JMH's single-shot mode, one cold run per
 * fresh JVM (no warm-up, so JIT compilation is included), several forks; the table reports the
 * median over forks. Every fork runs with the same {@code -Xmx2g}; run it with {@code -prof
 * dev.splitwright.bench.PeakHeapProfiler} for the peak heap. Data generation and conversion to
 * Weka's format happen in setup, outside the timed run, but the rows stay on the heap and count
 * towards its peak, as they would in a build.
 *
 * <p>Weka models trained here are offered to the {@link BenchStore}, so that the prediction
 * benchmark need not train J48 again.
 */
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 0)
@Measurement(iterations = 1)
@Fork(value = 5, jvmArgsAppend = "-Xmx2g")
public class TrainingBenchmark {

  /** The 200,000 x 16 synthetic set, for us and for Weka. */
  @State(Scope.Benchmark)
  public static class Synthetic200k {
    /** Depth limit of our trainer and of REPTree's {@code -L}; J48 has none. */
    @Param({"14"})
    public int depth;

    Dataset rows;
    Instances instances;
    Classifier trained;

    @Setup(Level.Trial)
    public void setUp(BenchmarkParams params) {
      rows = BenchModel.syntheticTrainingSet();
      if (params.getBenchmark().contains(".weka")) {
        instances = WekaData.of(rows, "synthetic");
      }
    }

    @TearDown(Level.Trial)
    public void offerToStore(BenchmarkParams params) throws Exception {
      if (trained != null) {
        WekaLearner learner = params.getBenchmark().endsWith("wekaJ48")
            ? WekaLearner.J48 : WekaLearner.REP_TREE;
        BenchStore.fromSystemProperty().offer(learner, depth, rows, trained);
      }
    }
  }

  /** The 1,000,000 x 20 synthetic set, for us alone, at depth 10. */
  @State(Scope.Benchmark)
  public static class Synthetic1M {
    static final int ROWS = 1_000_000;
    static final int FEATURES = 20;
    static final int DEPTH = 10;

    Dataset rows;

    @Setup(Level.Trial)
    public void setUp() {
      rows = SyntheticTable.generate(ROWS, FEATURES, BenchModel.SYNTHETIC_SEED + 10);
    }
  }

  @Benchmark
  public DecisionTree splitwright(Synthetic200k data) {
    return CartTrainer.train(data.rows, TrainingOptions.builder().maxDepth(data.depth).build());
  }

  @Benchmark
  public Classifier wekaRepTree(Synthetic200k data) throws Exception {
    data.trained = WekaLearner.REP_TREE.train(data.instances, data.depth);
    return data.trained;
  }

  @Benchmark
  public Classifier wekaJ48(Synthetic200k data) throws Exception {
    data.trained = WekaLearner.J48.train(data.instances, data.depth);
    return data.trained;
  }

  @Benchmark
  public DecisionTree splitwrightLarge(Synthetic1M data) {
    return CartTrainer.train(data.rows,
        TrainingOptions.builder().maxDepth(Synthetic1M.DEPTH).build());
  }
}
