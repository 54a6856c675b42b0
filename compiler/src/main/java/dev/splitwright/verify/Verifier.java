package dev.splitwright.verify;

import dev.splitwright.check.ClassFileInfo;
import dev.splitwright.check.CompilationException;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.ComparisonResult;
import dev.splitwright.check.Mismatch;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.OracleComparison;
import dev.splitwright.data.Dataset;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.InputKind;
import dev.splitwright.model.DecisionTree;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Proves an emitted classifier returns what the model returns: compiles the source in memory,
 * loads it in a fresh class loader and compares {@code classify} with {@link DecisionTree#predict}
 * on every data row, on boundary probes for every split and on seeded random inputs. A classifier
 * taking {@code int} inputs is also checked on int boundary probes ({@link IntProbes}): each
 * threshold's integer neighbours and the int extremes, with the model asked about their float
 * conversions.
 */
public final class Verifier {
  /** The javac options a user's build would use; the class file measured is the one they get. */
  public static final List<String> JAVAC_OPTIONS =
      List.of("--release", "17", "-Xlint:all", "-Werror");

  private static final int RANDOM_PROBES = 2000;
  private static final int REPORTED_MISMATCHES = 5;

  private final InMemoryCompiler compiler;

  public Verifier(InMemoryCompiler compiler) {
    this.compiler = Objects.requireNonNull(compiler, "compiler");
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
  public VerificationResult verify(DecisionTree tree, EmittedSource source, EmitOptions options,
      List<Dataset> data, long seed) throws CompilationException {
    CompiledClasses classes = compiler.compileOne(source.qualifiedName(), source.source());
    return check(tree, classes, source, options, data, seed);
  }

  /** Verifies an already compiled class; lets callers compile many candidates in one batch. */
  public VerificationResult check(DecisionTree tree, CompiledClasses classes, EmittedSource source,
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
    List<float[]> inputs = inputs(tree, data, seed);
    Coverage coverage = new Coverage(tree);
    for (float[] x : inputs) {
      coverage.record(candidate.modelInput(x));
    }
    ComparisonResult<float[], Integer> result = OracleComparison.compare(
        inputs, candidate::classify, x -> tree.predict(candidate.modelInput(x)),
        REPORTED_MISMATCHES);
    List<String> mismatches = new ArrayList<>();
    for (Mismatch<float[], Integer> m : result.firstMismatches()) {
      mismatches.add(m.describe());
    }
    long checked = result.checked();
    long mismatchCount = result.mismatchCount();
    if (options.inputKind() == InputKind.INT) {
      List<int[]> ints = IntProbes.of(tree);
      for (int[] x : ints) {
        coverage.record(EmittedClassifier.modelInput(x));
      }
      ComparisonResult<int[], Integer> intResult = OracleComparison.compare(ints,
          candidate::classifyInts, x -> tree.predict(EmittedClassifier.modelInput(x)),
          REPORTED_MISMATCHES);
      for (Mismatch<int[], Integer> m : intResult.firstMismatches()) {
        if (mismatches.size() < REPORTED_MISMATCHES) {
          mismatches.add("int probe " + m.describe());
        }
      }
      checked += intResult.checked();
      mismatchCount += intResult.mismatchCount();
    }
    String self = source.qualifiedName().replace('.', '/');
    List<String> foreign = info.referencedClasses().stream()
        .filter(name -> !name.equals(self) && !isJavaLang(name))
        .toList();
    return new VerificationResult(checked, mismatchCount, mismatches,
        coverage.splits(), coverage.covered(), bytes.length, info.debugAttributeBytes(),
        info.maxCodeLength(), options.maxMethodBytes(), info.methods(), info.constantPoolCount(),
        foreign);
  }

  private static boolean isJavaLang(String internalName) {
    return internalName.startsWith("java/lang/") && internalName.indexOf('/', 10) < 0;
  }

  /** Every data row, then the boundary probes, then the random probes. */
  static List<float[]> inputs(DecisionTree tree, List<Dataset> data, long seed) {
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
    inputs.addAll(BoundaryProbes.of(tree));
    inputs.addAll(RandomProbes.of(tree, reference, RANDOM_PROBES, seed));
    return inputs;
  }
}
