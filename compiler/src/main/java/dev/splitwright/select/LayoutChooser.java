package dev.splitwright.select;

import dev.splitwright.check.CompilationException;
import dev.splitwright.check.CompileDiagnostic;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.SourceFile;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitLimitException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.Classifier;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Emits and compiles the layout a run asks for. For {@code smallest} it emits both layouts,
 * compiles them in one javac run (one run costs tens of milliseconds of fixed overhead) and keeps
 * the smaller class file, {@code branches} on a tie because it runs faster.
 */
public final class LayoutChooser {
  private LayoutChooser() {}

  /**
   * Emits and compiles {@code tree} (a single tree or an ensemble) with the layout of {@code
   * options}, choosing one first when it is {@link Layout#SMALLEST}.
   *
   * @throws InputException if the layout cannot hold the tree (too many class-file constants for
   *     {@code branches}) or the options do not fit it (named arguments for many features)
   * @throws IllegalStateException if javac rejects the source for another reason, a bug of ours
   */
  public static LayoutChoice resolve(Classifier tree, EmitOptions options, HeaderInfo header,
      InMemoryCompiler compiler) throws InputException {
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(options, "options");
    Objects.requireNonNull(header, "header");
    Objects.requireNonNull(compiler, "compiler");
    try {
      if (options.layout() != Layout.SMALLEST) {
        EmittedSource source = JavaEmitter.emit(tree, options, header);
        return single(source, options, compile(compiler, List.of(source)), "");
      }
      return smallest(tree, options, header, compiler);
    } catch (EmitLimitException e) {
      throw new InputException(e.option(), e.problem(), e.remedy());
    } catch (CompilationException e) {
      if (tooManyConstants(e)) {
        throw new InputException("layout", "javac found too many constants for one class file "
            + "(at most 65,535, JVM Specification 4.1)", "use --layout table");
      }
      throw new IllegalStateException("emitted source does not compile:\n" + e.getMessage(), e);
    }
  }

  private static LayoutChoice smallest(Classifier tree, EmitOptions options, HeaderInfo header,
      InMemoryCompiler compiler) throws CompilationException {
    EmitOptions tableOptions = options.toBuilder().layout(Layout.TABLE).build();
    EmittedSource table = JavaEmitter.emit(tree, tableOptions, header);
    EmitOptions branchesOptions = options.toBuilder().layout(Layout.BRANCHES).build();
    EmittedSource branches;
    try {
      branches = JavaEmitter.emit(tree, branchesOptions, header);
    } catch (EmitLimitException e) {
      if (!e.option().equals("layout")) {
        throw e;
      }
      return single(table, tableOptions, compile(compiler, List.of(table)),
          "branches not possible: " + e.problem());
    }
    // Both classes have the same name, so each needs a javac run of its own.
    CompiledClasses tableClass = compile(compiler, List.of(table));
    CompiledClasses branchesClass;
    try {
      branchesClass = compile(compiler, List.of(branches));
    } catch (CompilationException e) {
      if (!tooManyConstants(e)) {
        throw e;
      }
      return single(table, tableOptions, tableClass, "branches not possible: too many constants");
    }
    int tableBytes = tableClass.size(table.qualifiedName());
    int branchesBytes = branchesClass.size(branches.qualifiedName());
    Map<Layout, Integer> sizes = new EnumMap<>(Layout.class);
    sizes.put(Layout.BRANCHES, branchesBytes);
    sizes.put(Layout.TABLE, tableBytes);
    return tableBytes < branchesBytes
        ? new LayoutChoice(table, tableOptions, tableClass, sizes, "")
        : new LayoutChoice(branches, branchesOptions, branchesClass, sizes, "");
  }

  private static LayoutChoice single(EmittedSource source, EmitOptions options,
      CompiledClasses classes, String note) {
    Map<Layout, Integer> sizes = new EnumMap<>(Layout.class);
    sizes.put(options.layout(), classes.size(source.qualifiedName()));
    return new LayoutChoice(source, options, classes, sizes, note);
  }

  private static CompiledClasses compile(InMemoryCompiler compiler, List<EmittedSource> sources)
      throws CompilationException {
    return compiler.compile(sources.stream()
        .map(s -> new SourceFile(s.qualifiedName(), s.source()))
        .toList());
  }

  /** javac's "too many constants" (its limit on the constant pool, JVMS §4.1). */
  static boolean tooManyConstants(CompilationException e) {
    return e.errors().stream().map(CompileDiagnostic::message)
        .anyMatch(m -> m.contains("too many constants"));
  }
}
