package dev.splitwright.backend;

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
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.select.LayoutChoice;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Emits and compiles an ensemble as Java in the layout of the options; with {@code smallest} both
 * layouts are compiled and the smaller class file kept (branches on a tie), as {@link
 * dev.splitwright.select.LayoutChooser} does for a single tree.
 */
final class EnsembleLayouts {
  private EnsembleLayouts() {}

  static LayoutChoice resolve(TreeEnsemble ensemble, EmitOptions options, HeaderInfo header,
      InMemoryCompiler compiler) throws InputException {
    Objects.requireNonNull(ensemble, "ensemble");
    try {
      if (options.layout() != Layout.SMALLEST) {
        return compiled(ensemble, options, header, compiler);
      }
      EmitOptions table = options.toBuilder().layout(Layout.TABLE).build();
      LayoutChoice tableChoice = compiled(ensemble, table, header, compiler);
      LayoutChoice branches;
      try {
        branches = compiled(ensemble, options.toBuilder().layout(Layout.BRANCHES).build(),
            header, compiler);
      } catch (EmitLimitException e) {
        return withNote(tableChoice, "branches not possible: " + e.problem());
      } catch (CompilationException e) {
        if (!tooManyConstants(e)) {
          throw e;
        }
        return withNote(tableChoice, "branches not possible: too many constants");
      }
      int tableBytes = tableChoice.classFileBytes().get(Layout.TABLE);
      int branchesBytes = branches.classFileBytes().get(Layout.BRANCHES);
      Map<Layout, Integer> sizes = new EnumMap<>(Layout.class);
      sizes.put(Layout.BRANCHES, branchesBytes);
      sizes.put(Layout.TABLE, tableBytes);
      LayoutChoice kept = tableBytes < branchesBytes ? tableChoice : branches;
      return new LayoutChoice(kept.source(), kept.options(), kept.classes(), sizes, "");
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

  private static LayoutChoice compiled(TreeEnsemble ensemble, EmitOptions options,
      HeaderInfo header, InMemoryCompiler compiler) throws CompilationException {
    EmittedSource source = JavaEmitter.emit(ensemble, options, header);
    CompiledClasses classes = compiler.compile(
        List.of(new SourceFile(source.qualifiedName(), source.source())));
    Map<Layout, Integer> sizes = new EnumMap<>(Layout.class);
    sizes.put(options.layout(), classes.size(source.qualifiedName()));
    return new LayoutChoice(source, options, classes, sizes, "");
  }

  private static LayoutChoice withNote(LayoutChoice choice, String note) {
    return new LayoutChoice(choice.source(), choice.options(), choice.classes(),
        choice.classFileBytes(), note);
  }

  /** javac's "too many constants" (its limit on the constant pool, JVMS 4.1). */
  private static boolean tooManyConstants(CompilationException e) {
    return e.errors().stream().map(CompileDiagnostic::message)
        .anyMatch(m -> m.contains("too many constants"));
  }
}
