package dev.splitwright.bench;

import dev.splitwright.data.Dataset;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.train.ForestOptions;
import dev.splitwright.train.ForestTrainer;
import java.lang.invoke.MethodHandle;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.BenchmarkParams;

/**
 * Cost of one prediction by a voting forest in each generated layout: {@link #TREES} trees on the
 * pump demo, each at most the pump model's depth, on the same input rows and call path as {@link
 * PredictionBenchmark}. A forest walks every tree for every row, so it shows what a layout's walk
 * costs when many independent walks follow one another.
 *
 * <p>Setup checks that the generated class returns what the in-memory forest returns on every
 * input row. The constant handles are {@link PredictionBenchmark}'s: one trial is one JVM.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 6, time = 1)
@Measurement(iterations = 3, time = 500, timeUnit = TimeUnit.MILLISECONDS)
@Fork(1)
@State(Scope.Thread)
public class EnsembleBenchmark {
  /** Trees in the forest. */
  static final int TREES = 10;
  /** The forest's seed: its bootstrap samples and feature draws. */
  static final long SEED = 1;
  private static final int MASK = BenchModel.INPUT_ROWS - 1;

  @Param({"shuffled", "timeOrdered"})
  public String order;

  private float[][] rows;
  private int next;

  @Setup
  public void setUp(BenchmarkParams params) throws Throwable {
    String method = params.getBenchmark().substring(params.getBenchmark().lastIndexOf('.') + 1);
    Dataset training = BenchModel.PUMP.trainingSet();
    rows = BenchModel.PUMP.inputs(training, InputOrder.ofParam(order)).rows();
    TreeEnsemble forest = forest(training);
    switch (method) {
      case "forestBranches" -> load(forest, Layout.BRANCHES, ConstantHandles.Slot.BRANCHES);
      case "forestTable" -> load(forest, Layout.TABLE, ConstantHandles.Slot.TABLE);
      case "forestFlat" -> load(forest, Layout.FLAT, ConstantHandles.Slot.FLAT);
      default -> throw new IllegalStateException("no setup for benchmark method " + method);
    }
  }

  private void load(TreeEnsemble forest, Layout layout, ConstantHandles.Slot slot)
      throws Throwable {
    MethodHandle classify = GeneratedClassifier.emitLoadAndCheck(forest, layout, rows);
    ConstantHandles.offer(slot, classify);
    ConstantHandles.check(slot, classify);
  }

  /** The benchmark's forest: {@link #TREES} trees, each limited as the pump model is. */
  static TreeEnsemble forest(Dataset training) {
    return ForestTrainer.train(training,
        ForestOptions.of(TREES, SEED, BenchModel.PUMP.trainingOptions()));
  }

  private float[] nextRow() {
    float[] x = rows[next];
    next = (next + 1) & MASK;
    return x;
  }

  @Benchmark
  public int forestBranches() throws Throwable {
    return (int) ConstantHandles.Branches.CLASSIFY.invokeExact(nextRow());
  }

  @Benchmark
  public int forestTable() throws Throwable {
    return (int) ConstantHandles.Table.CLASSIFY.invokeExact(nextRow());
  }

  @Benchmark
  public int forestFlat() throws Throwable {
    return (int) ConstantHandles.Flat.CLASSIFY.invokeExact(nextRow());
  }
}
