package dev.splitwright.bench;

import dev.splitwright.check.CompilationException;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.lang.invoke.MethodHandle;
import java.lang.invoke.MethodHandles;
import java.lang.invoke.MethodType;
import java.util.List;
import java.util.Locale;

/**
 * Emits a tree, compiles the source with javac in this JVM (or takes the class files compiled from
 * the same source earlier from the {@link BenchStore}) and loads the class in a fresh class loader,
 * as the verifier does, and hands out its {@code int classify(float[])} and, for {@code flat},
 * its {@code void classifyAll(float[][], int[])}.
 */
final class GeneratedClassifier {
  static final String PACKAGE = "bench.generated";
  static final MethodType CLASSIFY = MethodType.methodType(int.class, float[].class);
  static final MethodType CLASSIFY_ALL =
      MethodType.methodType(void.class, float[][].class, int[].class);
  static final List<String> JAVAC_OPTIONS = List.of("--release", "17");

  /**
   * A hand-written classifier of one comparison-free line, compiled and loaded the same way:
   * calling it measures what the call path adds to a generated classifier's own cost.
   */
  static final String TRIVIAL_SOURCE = "package " + PACKAGE + ";\n"
      + "public final class Trivial {\n"
      + "  private Trivial() {}\n"
      + "  public static int classify(float[] x) {\n"
      + "    return Float.floatToRawIntBits(x[0]) >>> 31;\n"
      + "  }\n"
      + "}\n";

  private GeneratedClassifier() {}

  /**
   * Emits {@code model} (a tree or an ensemble) in {@code layout}, compiles and loads it.
   *
   * @throws IllegalArgumentException for {@link Layout#SMALLEST}, which is a choice, not a layout
   */
  static MethodHandle emitAndLoad(Classifier model, Layout layout) {
    return handle(emitAndLoadClass(model, layout), "classify", CLASSIFY);
  }

  /**
   * Emits, compiles and loads {@code model} as {@link #emitAndLoad} does, and checks that the
   * class returns what the model returns on every one of {@code rows}: a benchmark of the wrong
   * classifier would measure nothing.
   *
   * @throws IllegalStateException naming the first row where they differ
   */
  static MethodHandle emitLoadAndCheck(Classifier model, Layout layout, float[][] rows)
      throws Throwable {
    MethodHandle classify = emitAndLoad(model, layout);
    for (int i = 0; i < rows.length; i++) {
      int got = (int) classify.invokeExact(rows[i]);
      int want = model.predict(rows[i]);
      if (got != want) {
        throw new IllegalStateException("generated " + layout.optionName() + " class returns "
            + got + " but the model returns " + want + " on input row " + i);
      }
    }
    return classify;
  }

  /** Emits {@code tree} flat, compiles and loads it, and hands out its many-row entry. */
  static MethodHandle emitAndLoadBatch(DecisionTree tree) {
    return handle(emitAndLoadClass(tree, Layout.FLAT), JavaEmitter.BATCH_METHOD, CLASSIFY_ALL);
  }

  private static Class<?> emitAndLoadClass(Classifier model, Layout layout) {
    EmittedSource source = emit(model, layout);
    return compileAndLoad(source.qualifiedName(), source.source());
  }

  private static EmittedSource emit(Classifier model, Layout layout) {
    EmitOptions options = EmitOptions.builder(PACKAGE,
            (model instanceof TreeEnsemble ? "Forest" : "Model")
                + layout.optionName().substring(0, 1).toUpperCase(Locale.ROOT)
                + layout.optionName().substring(1))
        .layout(layout)
        .build();
    return JavaEmitter.emit(model, options, HeaderInfo.none());
  }

  /** Loads the hand-written {@link #TRIVIAL_SOURCE}. */
  static MethodHandle trivial() {
    return handle(compileAndLoad(PACKAGE + ".Trivial", TRIVIAL_SOURCE), "classify", CLASSIFY);
  }

  private static Class<?> compileAndLoad(String name, String source) {
    CompiledClasses classes;
    try {
      classes = BenchStore.fromSystemProperty().compiled(name, source, JAVAC_OPTIONS, () -> {
        try (InMemoryCompiler javac = InMemoryCompiler.create(JAVAC_OPTIONS)) {
          return javac.compileOne(name, source);
        }
      });
    } catch (CompilationException e) {
      throw new IllegalStateException("generated source of " + name + " does not compile:\n"
          + e.getMessage(), e);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return classes.load(name);
  }

  private static MethodHandle handle(Class<?> type, String name, MethodType signature) {
    try {
      return MethodHandles.publicLookup().findStatic(type, name, signature);
    } catch (NoSuchMethodException | IllegalAccessException e) {
      throw new IllegalStateException(type.getName() + " has no public static " + name
          + signature, e);
    }
  }
}
