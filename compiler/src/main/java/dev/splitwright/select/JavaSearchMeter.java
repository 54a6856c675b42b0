package dev.splitwright.select;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.Dataset;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.Classifier;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.Future;

/**
 * The budget search's measurements in Java: candidates emitted by {@link CandidateEmitter} and
 * compiled by javac in batches ({@link SizeMeter}), dexed when the budget counts DEX bytes; the
 * chosen class compiled under its real name and checked by the {@link Verifier}.
 */
public final class JavaSearchMeter implements SearchMeter<LayoutChoice> {
  private final BudgetUnit unit;
  private final EmitOptions options;
  private final Verifier verifier;
  private final Optional<DexMeter> dex;
  private final CandidateEmitter emitter;
  private final SizeMeter meter;
  private SizeMeter second;

  /**
   * Measures in {@code unit}, emitting with {@code options} and compiling and checking with {@code
   * verifier}'s javac.
   *
   * @param dex the D8 a DEX budget dexes every candidate with; empty for other units
   * @throws IllegalArgumentException if the unit is not Java's, or it counts DEX bytes but {@code
   *     dex} is empty
   */
  public JavaSearchMeter(BudgetUnit unit, EmitOptions options, Verifier verifier,
      Optional<DexMeter> dex) {
    this.unit = Objects.requireNonNull(unit, "unit");
    this.options = Objects.requireNonNull(options, "options");
    this.verifier = Objects.requireNonNull(verifier, "verifier");
    this.dex = Objects.requireNonNull(dex, "dex");
    if (unit == BudgetUnit.FLASH) {
      throw new IllegalArgumentException("Java is not measured in flash bytes");
    }
    if (unit == BudgetUnit.DEX && dex.isEmpty()) {
      throw new IllegalArgumentException("a DEX budget needs a DexMeter");
    }
    this.emitter = CandidateEmitter.of(options);
    this.meter = new SizeMeter(verifier.compiler(),
        unit == BudgetUnit.DEX ? dex : Optional.empty());
  }

  @Override
  public BudgetUnit unit() {
    return unit;
  }

  @Override
  public List<Measured> measure(List<Classifier> models, HeaderInfo header) {
    if (!SecondJavac.AVAILABLE || dex.isPresent() || models.size() < 2) {
      return measure(models, header, meter);
    }
    // Two shares at once: javac is most of a search's time, and one compilation uses one core.
    // Every other model each, since a batch runs from small to large.
    List<Classifier> even = new ArrayList<>();
    List<Classifier> odd = new ArrayList<>();
    for (int i = 0; i < models.size(); i++) {
      (i % 2 == 0 ? even : odd).add(models.get(i));
    }
    Future<List<Measured>> second = SecondJavac.thread().submit(
        () -> measure(odd, header, secondMeter()));
    List<Measured> first = measure(even, header, meter);
    List<Measured> rest = joined(second);
    List<Measured> measured = new ArrayList<>(models.size());
    for (int i = 0; i < models.size(); i++) {
      measured.add((i % 2 == 0 ? first : rest).get(i / 2));
    }
    return measured;
  }

  private static <T> T joined(Future<T> task) {
    try {
      return task.get();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while measuring", e);
    } catch (ExecutionException e) {
      if (e.getCause() instanceof RuntimeException r) {
        throw r;
      }
      throw new IllegalStateException(e.getCause());
    }
  }

  private synchronized SizeMeter secondMeter() {
    if (second == null) {
      second = new SizeMeter(SecondJavac.compiler(verifier.compiler().options()));
    }
    return second;
  }

  /** Emits {@code models} and measures them with {@code sizeMeter}. */
  private List<Measured> measure(List<Classifier> models, HeaderInfo header,
      SizeMeter sizeMeter) {
    List<EmittedSource> sources = new ArrayList<>();
    List<Integer> variants = new ArrayList<>();
    for (Classifier model : models) {
      List<EmittedSource> emitted = emitter.emit(model, header);
      sources.addAll(emitted);
      variants.add(emitted.size());
    }
    List<Sizes> sizes = sizeMeter.measure(sources);
    List<Measured> measured = new ArrayList<>(models.size());
    int at = 0;
    for (int count : variants) {
      int pick = at;
      for (int v = at + 1; v < at + count; v++) {
        if (sizes.get(v).in(unit) < sizes.get(pick).in(unit)) {
          pick = v;
        }
      }
      measured.add(new Measured(sizes.get(pick), sources.get(pick).layout()));
      at += count;
    }
    return measured;
  }

  @Override
  public boolean usable(Sizes sizes) {
    return sizes.maxMethodBytes() <= options.maxMethodBytes();
  }

  @Override
  public OptionalInt bareSize(Classifier model, HeaderInfo header) {
    if (options.bare()) {
      return OptionalInt.empty();
    }
    // Measured, not estimated: the same tree emitted with --bare and compiled.
    return CandidateEmitter.of(options.toBuilder().bare(true).build())
        .emit(model, header).stream()
        .mapToInt(source -> meter.measureAlone(source).in(unit))
        .min();
  }

  @Override
  public Emitted<LayoutChoice> emit(Classifier model, HeaderInfo header) {
    Map<Layout, Integer> classFileBytes = new EnumMap<>(Layout.class);
    EmittedSource best = null;
    CompiledClasses bestClasses = null;
    Sizes bestSizes = null;
    Layout smallestClass = null;
    for (EmittedSource source : emitter.emit(model, header)) {
      CompiledClasses classes = meter.compileAlone(source);
      Sizes sizes = meter.measured(classes, source);
      classFileBytes.put(source.layout(), classes.size(source.qualifiedName()));
      if (smallestClass == null
          || classFileBytes.get(source.layout()) < classFileBytes.get(smallestClass)) {
        smallestClass = source.layout();
      }
      if (best == null || sizes.in(unit) < bestSizes.in(unit)) {
        best = source;
        bestClasses = classes;
        bestSizes = sizes;
      }
    }
    String note = best.layout() == smallestClass ? "" : "smallest in the budget's unit";
    LayoutChoice choice = new LayoutChoice(best, options.toBuilder().layout(best.layout()).build(),
        bestClasses, classFileBytes, note);
    return new Emitted<>(choice, bestSizes, best.layout());
  }

  @Override
  public VerificationResult verify(Classifier model, LayoutChoice emitted, List<Dataset> rows,
      long seed) {
    return verifier.check(model, emitted.classes(), emitted.source(), emitted.options(), rows,
        seed);
  }

  @Override
  public ChosenBytes chosenBytes(Emitted<LayoutChoice> emitted) {
    EmittedSource source = emitted.emitted().source();
    Sizes sizes = emitted.sizes();
    if (!SecondJavac.AVAILABLE) {
      return new ChosenBytes(sizes.classFileBytes(), DebugSizes.noDebug(source),
          DebugSizes.fullDebug(source), sizes.bytecodeBytes(), null);
    }
    // Two more javac runs, each with its own compiler: one on each core.
    Future<Integer> noDebug = SecondJavac.thread().submit(() -> DebugSizes.noDebug(source));
    int fullDebug = DebugSizes.fullDebug(source);
    return new ChosenBytes(sizes.classFileBytes(), joined(noDebug), fullDebug,
        sizes.bytecodeBytes(), null);
  }

  @Override
  public String compilerName() {
    return "javac";
  }

  @Override
  public synchronized int compilerRuns() {
    return meter.javacRuns() + (second == null ? 0 : second.javacRuns());
  }

  @Override
  public synchronized int sourcesCompiled() {
    return meter.sourcesCompiled() + (second == null ? 0 : second.sourcesCompiled());
  }

  @Override
  public int d8Runs() {
    return unit == BudgetUnit.DEX ? dex.map(DexMeter::d8Runs).orElse(0) : 0;
  }
}
