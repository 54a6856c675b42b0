package dev.splitwright.select;

import dev.splitwright.check.ClassFileInfo;
import dev.splitwright.check.CompilationException;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.SourceFile;
import dev.splitwright.emit.EmittedSource;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Measures emitted sources by compiling them, many per javac run: each run costs a fixed 20 ms or
 * so with {@code --release 17} and about a millisecond per small class (see {@link
 * InMemoryCompiler}), so batches of a hundred make the fixed cost negligible. Sources are renamed
 * by {@link BatchRenamer} to share a run; should a batch fail to compile anyway, its sources are
 * compiled one by one under their own names. With a {@link DexMeter}, each batch's classes are also
 * dexed, in one D8 run.
 */
final class SizeMeter {
  /** Sources per javac run. */
  static final int BATCH_SOURCES = 100;
  /** Characters per javac run, so that a batch of large trees does not hold much memory. */
  static final int BATCH_CHARS = 2_000_000;

  private final InMemoryCompiler compiler;
  private final Optional<DexMeter> dex;
  private int javacRuns;
  private int sourcesCompiled;

  SizeMeter(InMemoryCompiler compiler) {
    this(compiler, Optional.empty());
  }

  /** Measures DEX bytes too when {@code dex} is present. */
  SizeMeter(InMemoryCompiler compiler, Optional<DexMeter> dex) {
    this.compiler = Objects.requireNonNull(compiler, "compiler");
    this.dex = Objects.requireNonNull(dex, "dex");
  }

  int javacRuns() {
    return javacRuns;
  }

  int sourcesCompiled() {
    return sourcesCompiled;
  }

  /** The sizes of {@code sources} (all of one class name), in order. */
  List<Sizes> measure(List<EmittedSource> sources) {
    List<Sizes> sizes = new ArrayList<>(sources.size());
    if (sources.isEmpty()) {
      return sizes;
    }
    BatchRenamer renamer = new BatchRenamer(sources.get(0).qualifiedName());
    int limit = Math.min(BATCH_SOURCES, renamer.capacity());
    int start = 0;
    while (start < sources.size()) {
      int end = start;
      long chars = 0;
      while (end < sources.size() && end - start < limit
          && (end == start || chars + sources.get(end).source().length() <= BATCH_CHARS)) {
        chars += sources.get(end).source().length();
        end++;
      }
      sizes.addAll(measureBatch(sources.subList(start, end), renamer));
      start = end;
    }
    return sizes;
  }

  private List<Sizes> measureBatch(List<EmittedSource> batch, BatchRenamer renamer) {
    List<SourceFile> files = new ArrayList<>(batch.size());
    for (int i = 0; i < batch.size(); i++) {
      files.add(renamer.alias(batch.get(i), i));
    }
    CompiledClasses classes;
    try {
      classes = compile(files);
    } catch (CompilationException e) {
      List<Sizes> sizes = new ArrayList<>(batch.size());
      for (EmittedSource source : batch) {
        sizes.add(measureAlone(source));
      }
      return sizes;
    }
    List<Sizes> sizes = new ArrayList<>(batch.size());
    List<String> names = new ArrayList<>(batch.size());
    for (int i = 0; i < batch.size(); i++) {
      names.add(files.get(i).binaryClassName());
      sizes.add(sizesOf(classes, names.get(i), batch.get(i).sourceBytes()));
    }
    return withDex(sizes, classes, names);
  }

  /** Compiles {@code source} under its own name and measures it. */
  Sizes measureAlone(EmittedSource source) {
    return measured(compileAlone(source), source);
  }

  /** The sizes of {@code source}, already compiled under its own name into {@code classes}. */
  Sizes measured(CompiledClasses classes, EmittedSource source) {
    Sizes sizes = sizesOf(classes, source.qualifiedName(), source.sourceBytes());
    return withDex(List.of(sizes), classes, List.of(source.qualifiedName())).get(0);
  }

  /** {@code sizes} with the DEX bytes of the classes {@code names}, if DEX is measured. */
  private List<Sizes> withDex(List<Sizes> sizes, CompiledClasses classes, List<String> names) {
    if (dex.isEmpty()) {
      return sizes;
    }
    int[] dexBytes = dex.get().measure(classes, names);
    List<Sizes> all = new ArrayList<>(sizes.size());
    for (int i = 0; i < sizes.size(); i++) {
      all.add(sizes.get(i).withDexBytes(dexBytes[i]));
    }
    return all;
  }

  /** Compiles {@code source} under its own name. */
  CompiledClasses compileAlone(EmittedSource source) {
    try {
      return compile(List.of(new SourceFile(source.qualifiedName(), source.source())));
    } catch (CompilationException e) {
      // The emitter made source javac rejects: a bug of ours, not the user's input.
      throw new IllegalStateException("emitted source does not compile:\n" + e.getMessage(), e);
    }
  }

  private CompiledClasses compile(List<SourceFile> files) throws CompilationException {
    javacRuns++;
    sourcesCompiled += files.size();
    return compiler.compile(files);
  }

  /** Adds up the class {@code binaryName} and its nested classes. */
  static Sizes sizesOf(CompiledClasses classes, String binaryName, int sourceBytes) {
    int bytes = 0;
    int code = 0;
    int largest = 0;
    for (String name : classes.names()) {
      if (name.equals(binaryName) || name.startsWith(binaryName + "$")) {
        byte[] file = classes.bytes(name);
        ClassFileInfo info = ClassFileInfo.parse(file);
        bytes += file.length;
        code += info.totalCodeLength();
        largest = Math.max(largest, info.maxCodeLength());
      }
    }
    if (bytes == 0) {
      throw new IllegalStateException("no class " + binaryName + " in " + classes);
    }
    return new Sizes(bytes, code, sourceBytes, largest);
  }
}
