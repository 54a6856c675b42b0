package dev.splitwright.select;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.emit.EmittedSource;
import java.util.ArrayList;
import java.util.List;

/**
 * Measures what the chosen classifier weighs when built with other debug settings: {@code -g:none}
 * (no line numbers, no source file name) and {@code -g} (also local variable tables, which a
 * default Maven build adds: maven-compiler-plugin's {@code debug} is true and passes a bare {@code
 * -g}). Compiled, not estimated: subtracting the debug attributes alone would still count the
 * constant-pool entries that name them.
 */
final class DebugVariants {
  private DebugVariants() {}

  /** Class-file bytes of {@code source} with {@code -g:none} and with {@code -g}, in that order. */
  static int[] measure(EmittedSource source) {
    List<Integer> sizes = new ArrayList<>();
    for (String flag : List.of("-g:none", "-g")) {
      try (InMemoryCompiler compiler = InMemoryCompiler.create(List.of("--release", "17", flag))) {
        SizeMeter meter = new SizeMeter(compiler);
        CompiledClasses classes = meter.compileAlone(source);
        sizes.add(SizeMeter.sizesOf(classes, source.qualifiedName(), source.sourceBytes())
            .classFileBytes());
      }
    }
    return new int[] {sizes.get(0), sizes.get(1)};
  }
}
