package dev.splitwright.backend;

import dev.splitwright.check.CompilationException;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.SourceFile;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.verify.Verifier;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Warms javac and the emitter up in the background while the data loads and the first trees
 * grow: on a cold JVM the first compilation costs a second or more of class loading and
 * interpreted code, paid otherwise by the first measurement. It compiles a small tree of its own,
 * emitted with the job's options, through the job's compiler (whose calls run one at a time), and
 * stops as soon as the job compiles something itself. It only warms: a failure here is left for
 * the job's own compilation to report.
 */
final class JavacWarmUp {
  /** Compilations: the JIT starts compiling javac's hot methods after a few. */
  static final int ROUNDS = 4;

  private JavacWarmUp() {}

  /** Starts the warm-up; the returned action stops it after its current compilation. */
  static Runnable start(EmitOptions options, Verifier verifier) {
    AtomicBoolean stop = new AtomicBoolean();
    // Counted here, not on the new thread, so that a compilation right after start is the job's.
    int before = verifier.compiler().calls();
    Thread thread = new Thread(() -> run(options, verifier, stop, before),
        "splitwright-javac-warm-up");
    thread.setDaemon(true);
    thread.start();
    return () -> stop.set(true);
  }

  private static void run(EmitOptions options, Verifier verifier, AtomicBoolean stop,
      int before) {
    try {
      DecisionTree tree = sampleTree();
      InMemoryCompiler compiler = verifier.compiler();
      // Once the job has compiled anything, its own work is warming javac up.
      for (int i = 0; i < ROUNDS && !stop.get() && compiler.calls() == before + i; i++) {
        EmittedSource source = JavaEmitter.emit(tree, options, HeaderInfo.none());
        compiler.compile(
            List.of(new SourceFile(source.qualifiedName(), source.source())));
      }
    } catch (CompilationException | RuntimeException e) {
      // Only a warm-up; the job's own compilation reports any real problem.
    }
  }

  /** Three splits over two numeric features and two classes. */
  static DecisionTree sampleTree() {
    Schema schema = new Schema(List.of(Feature.numeric("a"), Feature.numeric("b")), "c",
        List.of("x", "y"));
    NumericSplit inner = new NumericSplit(1, 2.5f, true, new Leaf(0, ClassCounts.of(3, 1)),
        new Leaf(1, ClassCounts.of(1, 4)), ClassCounts.of(4, 5));
    NumericSplit right = new NumericSplit(1, -1.25f, false, new Leaf(1, ClassCounts.of(0, 6)),
        inner, ClassCounts.of(4, 11));
    return new DecisionTree(schema, new NumericSplit(0, 0.5f, true,
        new Leaf(0, ClassCounts.of(7, 2)), right, ClassCounts.of(11, 13)));
  }
}
