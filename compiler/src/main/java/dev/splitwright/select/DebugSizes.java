package dev.splitwright.select;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.emit.EmittedSource;
import java.util.List;
import java.util.Objects;

/**
 * What an emitted classifier weighs when built with other debug settings than javac's default:
 * {@code -g:none} (no line numbers, no source file name) and {@code -g} (also local variable
 * tables, which a default Maven build adds: maven-compiler-plugin's {@code debug} is true and
 * passes a bare {@code -g}). Compiled, not estimated: subtracting the debug attributes alone would
 * still count the constant-pool entries that name them.
 */
public final class DebugSizes {
  private DebugSizes() {}

  /** Class-file bytes of {@code source} compiled with {@code javac --release 17 -g:none}. */
  public static int noDebug(EmittedSource source) {
    return compiled(source, "-g:none");
  }

  /** Class-file bytes of {@code source} compiled with {@code javac --release 17 -g}. */
  public static int fullDebug(EmittedSource source) {
    return compiled(source, "-g");
  }

  private static int compiled(EmittedSource source, String flag) {
    Objects.requireNonNull(source, "source");
    InMemoryCompiler compiler = flag.equals("-g:none") ? Compilers.NO_DEBUG : Compilers.FULL_DEBUG;
    CompiledClasses classes = new SizeMeter(compiler).compileAlone(source);
    return SizeMeter.sizesOf(classes, source.qualifiedName(), source.sourceBytes())
        .classFileBytes();
  }

  /**
   * One compiler per setting for the life of the JVM, made on first use: a compiler's first run
   * sets up javac's view of the JDK, which costs more than compiling one classifier.
   */
  private static final class Compilers {
    static final InMemoryCompiler NO_DEBUG =
        InMemoryCompiler.create(List.of("--release", "17", "-g:none"));
    static final InMemoryCompiler FULL_DEBUG =
        InMemoryCompiler.create(List.of("--release", "17", "-g"));
  }
}
