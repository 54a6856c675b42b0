package dev.splitwright.bench;

import dev.splitwright.data.Dataset;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import java.lang.invoke.MethodHandle;
import java.util.Arrays;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.BenchmarkParams;
import weka.classifiers.Classifier;
import weka.core.Instance;
import weka.core.Instances;

/**
 * Cost of one prediction, in nanoseconds, for one trained tree in each form a user could ship: the
 * generated class in each layout, our in-memory model, and Weka's J48 and REPTree trained on the
 * same rows. Each call takes the next of {@link BenchModel#INPUT_ROWS} fresh input rows, so the
 * branch predictor cannot memorise them; the result goes to JMH's blackhole as the return value.
 *
 * <p>{@link #baseline} only fetches the row; {@link #handleBaseline} also calls a hand-written
 * one-line classifier through the same constant method handle the generated classes are called
 * through, so {@code generated - handleBaseline} is the tree's own cost.
 *
 * <p>The annotations hold the quick profile. The generated classes get a longer warm-up: HotSpot
 * compiles a big branchy method from the paths seen so far, and each path first taken later traps
 * back to the interpreter and forces a recompilation, so a tree of thousands of leaves takes
 * several seconds of calls to settle (seen with {@code -XX:+PrintCompilation}); the other forms are
 * small code and settle in well under a second.
 *
 * <p>Setup builds only what the running method needs (one trial = one method in one JVM), checks
 * that each generated class returns what the in-memory tree returns on every input row, and takes
 * Weka models from the {@link BenchStore}.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 2, time = 500, timeUnit = TimeUnit.MILLISECONDS)
@Measurement(iterations = 3, time = 500, timeUnit = TimeUnit.MILLISECONDS)
@Fork(1)
@State(Scope.Thread)
public class PredictionBenchmark {
  private static final int MASK = BenchModel.INPUT_ROWS - 1;
  /** Rows per call of the block methods; the rows are cut into blocks once, in setup. */
  static final int BLOCK = 256;

  @Param({"pump", "synthetic", "synthetic10"})
  public String model;

  @Param({"shuffled", "timeOrdered"})
  public String order;

  private float[][] rows;
  private Instance[] instances;
  private int next;
  private float[][][] blocks;
  private int[] out;
  private DecisionTree tree;
  private Classifier weka;

  @Setup
  public void setUp(BenchmarkParams params) throws Throwable {
    String method = params.getBenchmark().substring(params.getBenchmark().lastIndexOf('.') + 1);
    BenchModel bench = BenchModel.ofParam(model);
    // The baselines need only the inputs; the synthetic inputs need no training set.
    boolean needsTraining = !method.endsWith("aseline") || bench == BenchModel.PUMP;
    Dataset training = needsTraining ? bench.trainingSet() : null;
    rows = bench.inputs(training, InputOrder.ofParam(order)).rows();
    if (rows.length != BenchModel.INPUT_ROWS || Integer.bitCount(rows.length) != 1) {
      throw new IllegalStateException("the cursor needs a power-of-two row count");
    }
    switch (method) {
      case "baseline" -> { }
      case "handleBaseline" -> {
        MethodHandle trivial = GeneratedClassifier.trivial();
        ConstantHandles.offer(ConstantHandles.Slot.TRIVIAL, trivial);
        ConstantHandles.check(ConstantHandles.Slot.TRIVIAL, trivial);
      }
      case "inMemoryModel" -> tree = CartTrainer.train(training, bench.trainingOptions());
      case "generatedBranches" -> loadGenerated(training, bench, Layout.BRANCHES,
          ConstantHandles.Slot.BRANCHES);
      case "generatedTable" -> loadGenerated(training, bench, Layout.TABLE,
          ConstantHandles.Slot.TABLE);
      case "generatedFlat" -> loadGenerated(training, bench, Layout.FLAT,
          ConstantHandles.Slot.FLAT);
      case "generatedBranchesBlock" -> {
        loadGenerated(training, bench, Layout.BRANCHES, ConstantHandles.Slot.BRANCHES);
        cutBlocks();
      }
      case "generatedFlatBlock" -> {
        loadBatch(training, bench);
        cutBlocks();
      }
      case "wekaJ48" -> loadWeka(training, bench, WekaLearner.J48);
      case "wekaRepTree" -> loadWeka(training, bench, WekaLearner.REP_TREE);
      default -> throw new IllegalStateException("no setup for benchmark method " + method);
    }
  }

  private void loadGenerated(Dataset training, BenchModel bench, Layout layout,
      ConstantHandles.Slot slot) throws Throwable {
    DecisionTree trained = CartTrainer.train(training, bench.trainingOptions());
    MethodHandle classify = GeneratedClassifier.emitLoadAndCheck(trained, layout, rows);
    ConstantHandles.offer(slot, classify);
    ConstantHandles.check(slot, classify);
  }

  private void loadBatch(Dataset training, BenchModel bench) throws Throwable {
    DecisionTree trained = CartTrainer.train(training, bench.trainingOptions());
    MethodHandle classifyAll = GeneratedClassifier.emitAndLoadBatch(trained);
    int[] got = new int[rows.length];
    classifyAll.invokeExact(rows, got);
    for (int i = 0; i < rows.length; i++) {
      int want = trained.predict(rows[i]);
      if (got[i] != want) {
        throw new IllegalStateException("generated flat classifyAll returns " + got[i]
            + " but the model returns " + want + " on input row " + i);
      }
    }
    ConstantHandles.offer(ConstantHandles.Slot.FLAT_ALL, classifyAll);
    ConstantHandles.check(ConstantHandles.Slot.FLAT_ALL, classifyAll);
  }

  private void cutBlocks() {
    blocks = new float[rows.length / BLOCK][][];
    for (int b = 0; b < blocks.length; b++) {
      blocks[b] = Arrays.copyOfRange(rows, b * BLOCK, (b + 1) * BLOCK);
    }
    out = new int[BLOCK];
  }

  private float[][] nextBlock() {
    float[][] block = blocks[next];
    next = (next + 1) % blocks.length;
    return block;
  }

  private void loadWeka(Dataset training, BenchModel bench, WekaLearner learner)
      throws Exception {
    weka = BenchStore.fromSystemProperty().trainedOn(learner, bench.depth(), training,
        () -> WekaData.of(training, bench.paramName()));
    Instances header = WekaData.header(training.schema(), bench.paramName(), 0);
    instances = new Instance[rows.length];
    for (int i = 0; i < rows.length; i++) {
      instances[i] = WekaData.instance(header, rows[i]);
    }
  }

  private float[] nextRow() {
    float[] x = rows[next];
    next = (next + 1) & MASK;
    return x;
  }

  private Instance nextInstance() {
    Instance x = instances[next];
    next = (next + 1) & MASK;
    return x;
  }

  /** Fetches the next row and reads its first value: the floor under every other method. */
  @Benchmark
  public float baseline() {
    return nextRow()[0];
  }

  /** A one-line hand-written classifier through the generated classes' call path. */
  @Benchmark
  public int handleBaseline() throws Throwable {
    return (int) ConstantHandles.Trivial.CLASSIFY.invokeExact(nextRow());
  }

  @Benchmark
  @Warmup(iterations = 6, time = 1)
  public int generatedBranches() throws Throwable {
    return (int) ConstantHandles.Branches.CLASSIFY.invokeExact(nextRow());
  }

  @Benchmark
  @Warmup(iterations = 6, time = 1)
  public int generatedTable() throws Throwable {
    return (int) ConstantHandles.Table.CLASSIFY.invokeExact(nextRow());
  }

  /** The {@code flat} layout: no branch on a comparison, so shuffled inputs cost no misses. */
  @Benchmark
  @Warmup(iterations = 6, time = 1)
  public int generatedFlat() throws Throwable {
    return (int) ConstantHandles.Flat.CLASSIFY.invokeExact(nextRow());
  }

  /**
   * {@link #BLOCK} rows through {@code branches}: the loop a caller writes, one {@code classify}
   * a row; the time is per row, beside {@link #generatedFlatBlock}.
   */
  @Benchmark
  @Warmup(iterations = 6, time = 1)
  @OperationsPerInvocation(BLOCK)
  public int[] generatedBranchesBlock() throws Throwable {
    float[][] block = nextBlock();
    for (int r = 0; r < block.length; r++) {
      out[r] = (int) ConstantHandles.Branches.CLASSIFY.invokeExact(block[r]);
    }
    return out;
  }

  /** {@link #BLOCK} rows through the flat class's {@code classifyAll}, four walked side by side. */
  @Benchmark
  @Warmup(iterations = 6, time = 1)
  @OperationsPerInvocation(BLOCK)
  public int[] generatedFlatBlock() throws Throwable {
    ConstantHandles.FlatAll.CLASSIFY_ALL.invokeExact(nextBlock(), out);
    return out;
  }

  /** Our in-memory model walking its node objects: what the generated class is verified against. */
  @Benchmark
  public int inMemoryModel() {
    return tree.predict(nextRow());
  }

  @Benchmark
  public double wekaJ48() throws Exception {
    return weka.classifyInstance(nextInstance());
  }

  @Benchmark
  public double wekaRepTree() throws Exception {
    return weka.classifyInstance(nextInstance());
  }
}
