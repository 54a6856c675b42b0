package dev.splitwright.verify;

import dev.splitwright.check.ClassFileInfo;
import dev.splitwright.check.ComparisonResult;
import dev.splitwright.check.CompilationException;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.MethodSize;
import dev.splitwright.check.Mismatch;
import dev.splitwright.check.OracleComparison;
import dev.splitwright.data.Dataset;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.function.Function;

/**
 * Proves an emitted classifier returns what the model returns: compiles the source in memory,
 * loads it in a fresh class loader and compares {@code classify} with {@link DecisionTree#predict}
 * or {@link TreeEnsemble#predict} on every data row, on boundary probes for every split of every
 * tree and on seeded random inputs. A classifier
 * taking {@code int} inputs is also checked on int boundary probes ({@link IntProbes}): each
 * threshold's integer neighbours and the int extremes, with the model asked about their float
 * conversions. A class with the many-row entry {@link JavaEmitter#BATCH_METHOD} is checked through
 * it too, on the same inputs.
 */
public final class Verifier {
  /** The javac options a user's build would use; the class file measured is the one they get. */
  public static final List<String> JAVAC_OPTIONS =
      List.of("--release", "17", "-Xlint:all", "-Werror");

  static final int RANDOM_PROBES = 2000;
  private static final int REPORTED_MISMATCHES = 5;

  private final InMemoryCompiler compiler;
  private final int randomProbes;

  public Verifier(InMemoryCompiler compiler) {
    this(compiler, RANDOM_PROBES);
  }

  private Verifier(InMemoryCompiler compiler, int randomProbes) {
    this.compiler = Objects.requireNonNull(compiler, "compiler");
    this.randomProbes = randomProbes;
  }

  /** This verifier with {@code count} seeded random inputs per check instead of 2,000. */
  public Verifier withRandomProbes(int count) {
    if (count < 0) {
      throw new IllegalArgumentException("count must be >= 0, but it is " + count);
    }
    return new Verifier(compiler, count);
  }

  /** A verifier with its own compiler using {@link #JAVAC_OPTIONS}. */
  public static Verifier create() {
    return new Verifier(InMemoryCompiler.create(JAVAC_OPTIONS));
  }

  public InMemoryCompiler compiler() {
    return compiler;
  }

  /**
   * Verifies {@code source}, emitted from {@code tree} with {@code options}, on the rows of {@code
   * data} (any parts; may be empty) plus boundary and random probes seeded with {@code seed}.
   *
   * @throws CompilationException if the source does not compile (a bug in the emitter)
   */
  public VerificationResult verify(Classifier tree, EmittedSource source, EmitOptions options,
      List<Dataset> data, long seed) throws CompilationException {
    CompiledClasses classes = compiler.compileOne(source.qualifiedName(), source.source());
    return check(tree, classes, source, options, data, seed);
  }

  /**
   * Verifies an already compiled class; lets callers compile many candidates in one batch.
   *
   * <p>Compares {@code classify} with the model on every input; for {@code double} input also on
   * {@link DoubleProbes}, where rounding to float decides; with {@code --probabilities} also
   * {@code classProbabilities} with {@link DecisionTree#probabilities} narrowed to float (for an
   * ensemble {@link TreeEnsemble#probabilities}), bit for bit. Mismatches of all comparisons are
   * counted together.
   */
  public VerificationResult check(Classifier tree, CompiledClasses classes, EmittedSource source,
      EmitOptions options, List<Dataset> data, long seed) {
    byte[] bytes = classes.bytes(source.qualifiedName());
    ClassFileInfo info = ClassFileInfo.parse(bytes);
    EmittedClassifier candidate;
    try {
      candidate = EmittedClassifier.of(classes.load(source.qualifiedName()), options,
          tree.schema());
    } catch (ReflectiveOperationException e) {
      throw new IllegalStateException("emitted class has no usable classify method", e);
    }
    List<float[]> inputs = inputs(tree, data, seed, randomProbes);
    Coverage coverage = new Coverage(tree);
    for (float[] x : inputs) {
      coverage.record(candidate.modelInput(x));
    }
    Tally tally = new Tally();
    tally.add("", OracleComparison.compare(inputs, candidate::classify,
        x -> tree.predict(candidate.modelInput(x)), REPORTED_MISMATCHES));
    long inputsChecked = inputs.size();
    if (options.inputKind() == InputKind.DOUBLE) {
      List<double[]> doubles = Trees.probes(tree, DoubleProbes::of);
      for (double[] x : doubles) {
        coverage.record(DoubleProbes.narrow(x));
      }
      tally.add("double input ", OracleComparison.compare(doubles, candidate::classifyDouble,
          x -> tree.predict(DoubleProbes.narrow(x)), REPORTED_MISMATCHES));
      if (candidate.hasBatch()) {
        compareBatch(tally, doubles, candidate::classifyAllArrays,
            x -> tree.predict(DoubleProbes.narrow(x)));
      }
      inputsChecked += doubles.size();
    }
    if (options.probabilities()) {
      tally.add("classProbabilities ", OracleComparison.compare(inputs, candidate::probabilities,
          x -> tree.floatProbabilities(candidate.modelInput(x)), REPORTED_MISMATCHES));
    }
    if (options.inputKind() == InputKind.INT) {
      List<int[]> ints = Trees.probes(tree, IntProbes::of);
      for (int[] x : ints) {
        coverage.record(EmittedClassifier.modelInput(x));
      }
      tally.add("int probe ", OracleComparison.compare(ints, candidate::classifyInts,
          x -> tree.predict(EmittedClassifier.modelInput(x)), REPORTED_MISMATCHES));
      if (candidate.hasBatch()) {
        compareBatch(tally, ints, candidate::classifyAllArrays,
            x -> tree.predict(EmittedClassifier.modelInput(x)));
      }
      inputsChecked += ints.size();
    }
    if (candidate.hasBatch()) {
      compareBatch(tally, inputs, candidate::classifyAll,
          x -> tree.predict(candidate.modelInput(x)));
    }
    String self = source.qualifiedName().replace('.', '/');
    List<String> foreign = info.referencedClasses().stream()
        .filter(name -> !name.equals(self) && !isJavaLang(name))
        .toList();
    return new VerificationResult(inputsChecked, tally.mismatches, tally.first,
        coverage.splits(), coverage.covered(), bytes.length, largestPerCallMethod(info),
        options.maxMethodBytes(), info.methods(), info.constantPoolCount(), foreign);
  }

  /**
   * The largest code of any method but the static initializer. The cap is there so HotSpot
   * compiles what runs per call; {@code <clinit>} runs once, when the class is initialised, and
   * its size does not grow with the tree (the tree is data there), so only the JVM's own limit of
   * 65,535 bytes (JVMS §4.7.3) applies to it, which javac enforces.
   */
  public static int largestPerCallMethod(ClassFileInfo info) {
    return info.methods().stream()
        .filter(m -> !m.name().equals("<clinit>"))
        .mapToInt(MethodSize::codeLength)
        .max()
        .orElse(0);
  }

  /**
   * Compares {@link JavaEmitter#BATCH_METHOD} with the model: once from each of the first {@link
   * JavaEmitter#BATCH_LANES} inputs on, so that every input is walked in every position of a
   * group of rows, and among the rows after the last group.
   */
  private static <I> void compareBatch(Tally tally, List<I> inputs,
      Function<List<I>, int[]> batch, Function<I, Integer> model) {
    for (int from = 0; from < Math.min(JavaEmitter.BATCH_LANES, inputs.size()); from++) {
      List<I> part = inputs.subList(from, inputs.size());
      int[] answers;
      RuntimeException failure;
      try {
        answers = batch.apply(part);
        failure = null;
      } catch (RuntimeException e) {
        // Reported against every input, as a throwing classify is.
        answers = null;
        failure = e;
      }
      Map<I, Integer> position = new IdentityHashMap<>();
      for (int k = 0; k < part.size(); k++) {
        position.put(part.get(k), k);
      }
      int[] got = answers;
      RuntimeException thrown = failure;
      tally.add(JavaEmitter.BATCH_METHOD + " from input " + from + " on, ",
          OracleComparison.compare(part, x -> {
            if (thrown != null) {
              throw thrown;
            }
            return got[position.get(x)];
          }, model, REPORTED_MISMATCHES));
    }
  }

  /** Mismatches of several comparisons, the first few described. */
  private static final class Tally {
    long mismatches;
    final List<String> first = new ArrayList<>();

    <I, R> void add(String what, ComparisonResult<I, R> result) {
      mismatches += result.mismatchCount();
      for (Mismatch<I, R> m : result.firstMismatches()) {
        if (first.size() < REPORTED_MISMATCHES) {
          first.add(what + m.describe());
        }
      }
    }
  }

  private static boolean isJavaLang(String internalName) {
    return internalName.startsWith("java/lang/") && internalName.indexOf('/', 10) < 0;
  }

  /** Every data row, then the boundary probes, then the random probes. */
  static List<float[]> inputs(Classifier tree, List<Dataset> data, long seed, int randomProbes) {
    List<float[]> inputs = new ArrayList<>();
    Dataset reference = null;
    for (Dataset part : data) {
      for (int r = 0; r < part.rows(); r++) {
        inputs.add(part.row(r));
      }
      if (reference == null && part.rows() > 0) {
        reference = part;
      }
    }
    inputs.addAll(Trees.probes(tree, BoundaryProbes::of));
    inputs.addAll(RandomProbes.of(tree, reference, randomProbes, seed));
    return inputs;
  }
}
