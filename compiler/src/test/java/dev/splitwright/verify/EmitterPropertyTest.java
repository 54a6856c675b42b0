package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.SourceFile;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.emit.RandomTrees;
import dev.splitwright.model.DecisionTree;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Random trees of every shape, emitted in both layouts with varied input types and options, must
 * agree with their model on the boundary probes of every split (t, nextUp, nextDown, NaN, the
 * infinities and signed zeros; for double input the rounding boundaries) and on random inputs.
 * Classes are compiled 50 to a javac run, because one run has a fixed cost of about 20 ms; every
 * tenth run also with {@code -Xdoclint:all}, so their comments pass Javadoc's checks.
 */
class EmitterPropertyTest {
  private static final int TREES = Integer.getInteger("splitwright.propertyTrees", 2000);
  private static final int TREES_PER_BATCH = 25;
  private static final long SEED = 0x5EED_2024L;

  private record Case(DecisionTree tree, EmitOptions options, EmittedSource source, long seed) {}

  @Test
  void randomTreesAgreeWithTheirModelInBothLayouts() throws Exception {
    long started = System.nanoTime();
    ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    long cpuStarted = threads.getCurrentThreadCpuTime();
    long processCpuStarted = processCpuNanos();
    long compileNanos = 0;
    InMemoryCompiler compiler = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);
    // Every tenth batch also runs javac's Javadoc checks, down to private members.
    List<String> doclintOptions = new ArrayList<>(Verifier.JAVAC_OPTIONS);
    doclintOptions.add("-Xdoclint:all");
    InMemoryCompiler doclint = InMemoryCompiler.create(doclintOptions);
    Verifier verifier = new Verifier(compiler).withRandomProbes(100);
    SplittableRandom random = new SplittableRandom(SEED);
    List<String> failures = new ArrayList<>();
    long inputs = 0;
    long nodes = 0;
    int largest = 0;
    int deepest = 0;
    int classes = 0;
    for (int first = 0; first < TREES; first += TREES_PER_BATCH) {
      List<Case> batch = new ArrayList<>();
      for (int i = first; i < Math.min(TREES, first + TREES_PER_BATCH); i++) {
        DecisionTree tree = RandomTrees.tree(random, RandomTrees.shape(random));
        int size = tree.leafCount() + tree.internalNodeCount();
        nodes += size;
        largest = Math.max(largest, size);
        deepest = Math.max(deepest, tree.depth());
        EmitOptions options = options(random, new SplittableRandom(SEED + i), tree);
        for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
          EmitOptions o = new EmitOptions("prop", "Tree" + i + "_" + layout.optionName(), layout,
              options.inputKind(), options.namedArgs(), options.probabilities(),
              options.maxMethodBytes(), options.bare());
          batch.add(new Case(tree, o, JavaEmitter.emit(tree, o, HeaderInfo.none()), i));
        }
      }
      long compileStarted = System.nanoTime();
      boolean checkDocs = first % (10 * TREES_PER_BATCH) == 0;
      CompiledClasses compiled = (checkDocs ? doclint : compiler).compile(batch.stream()
          .map(c -> new SourceFile(c.source().qualifiedName(), c.source().source()))
          .toList());
      compileNanos += System.nanoTime() - compileStarted;
      for (Case c : batch) {
        VerificationResult result = verifier.check(c.tree(), compiled, c.source(), c.options(),
            List.of(), c.seed());
        inputs += result.inputsChecked();
        classes++;
        if (!result.passed()) {
          failures.add(c.source().qualifiedName() + " (" + describe(c) + "): " + result.verdict());
        }
      }
    }
    // Wall time depends on what else the machine runs; CPU time much less so. The JVM's other
    // threads (JIT compilers, GC) add to the process's CPU time and can run on a second core.
    System.out.printf(Locale.ROOT, "EmitterPropertyTest: %d trees, %d nodes (largest %d, deepest "
        + "%d), %d classes, %d inputs; %.1f s wall (javac %.1f s); CPU: %.1f s test thread, %.1f s "
        + "process%n", TREES, nodes, largest, deepest, classes, inputs,
        (System.nanoTime() - started) / 1e9, compileNanos / 1e9,
        (threads.getCurrentThreadCpuTime() - cpuStarted) / 1e9,
        (processCpuNanos() - processCpuStarted) / 1e9);
    assertThat(failures).isEmpty();
    assertThat(classes).isEqualTo(2 * TREES);
    if (TREES >= 2000) {
      // The shapes the issue asks for were really drawn.
      assertThat(largest).isGreaterThan(10_000);
      assertThat(deepest).isEqualTo(20);
    }
  }

  private static long processCpuNanos() {
    return ManagementFactory.getOperatingSystemMXBean()
        instanceof com.sun.management.OperatingSystemMXBean os ? os.getProcessCpuTime() : 0;
  }

  /**
   * Float input mostly; double and int, named arguments, probabilities and small caps often.
   * {@code extra} draws what was added later (more named arguments, caps of 256 to 512 bytes,
   * where a split and two calls with 32 named double arguments just fit), so that the shared
   * random stream, and with it the drawn shapes, stay as they were.
   */
  private static EmitOptions options(SplittableRandom random, SplittableRandom extra,
      DecisionTree tree) {
    int kind = random.nextInt(20);
    boolean fewFeatures = tree.schema().featureCount() <= EmitOptions.MAX_NAMED_ARGS;
    boolean named = fewFeatures && random.nextInt(5) == 0;
    named |= fewFeatures && extra.nextInt(3) == 0;
    EmitOptions.Builder b = EmitOptions.builder("prop", "Template")
        .inputKind(kind < 14 ? InputKind.FLOAT : kind < 17 ? InputKind.DOUBLE : InputKind.INT)
        .namedArgs(named)
        .probabilities(random.nextInt(5) == 0)
        // Chosen from the tree, not the shared random, so the drawn shapes stay as they were.
        .bare(tree.internalNodeCount() % 4 == 1);
    if (random.nextInt(5) == 0) {
      b.maxMethodBytes(256 + random.nextInt(2000));
    }
    if (extra.nextInt(4) == 0) {
      b.maxMethodBytes(256 + extra.nextInt(257));
    }
    return b.build();
  }

  private static String describe(Case c) {
    EmitOptions o = c.options();
    return String.format(Locale.ROOT, "%s, %s input%s%s, cap %d, depth %d, %d splits",
        o.layout().optionName(), o.inputKind().optionName(), o.namedArgs() ? ", named" : "",
        o.probabilities() ? ", probabilities" : "", o.maxMethodBytes(), c.tree().depth(),
        c.tree().internalNodeCount());
  }
}
