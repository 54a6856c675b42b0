package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.Classifier;
import dev.splitwright.verify.VerificationResult;
import java.util.List;
import java.util.Objects;
import java.util.OptionalInt;
import java.util.function.Function;

/**
 * What the budget search needs of an output language: candidates emitted and measured compiled in
 * batches, the chosen one emitted under its real name, and that file checked against the model.
 * The search itself ({@link BudgetSelection}) knows no language; Java's meter is {@link
 * JavaSearchMeter}, C's lives beside the C back end.
 *
 * @param <E> what the language emits for the chosen tree
 */
public interface SearchMeter<E> {

  /** The unit every size is compared in. */
  BudgetUnit unit();

  /**
   * Emits every tree in the layouts worth measuring and measures each compiled, many per compiler
   * run; for each tree, in order, the layout smallest in {@link #unit()} (the first on a tie).
   *
   * @throws InputException if the compiler needed cannot be run with the user's options
   */
  List<Measured> measure(List<Classifier> models, HeaderInfo header) throws InputException;

  /** Whether a candidate of these sizes can be emitted at all (e.g. within a method-size cap). */
  default boolean usable(Sizes sizes) {
    return true;
  }

  /**
   * The size of {@code tree} without the label and feature tables, measured, or empty when the
   * options already leave them out.
   */
  OptionalInt bareSize(Classifier model, HeaderInfo header) throws InputException;

  /**
   * Emits {@code tree} with its real header, compiled under its real names, in the layout
   * smallest in {@link #unit()}.
   */
  Emitted<E> emit(Classifier model, HeaderInfo header) throws InputException;

  /** Checks {@code emitted} against {@code tree}, as the language's proof does. */
  VerificationResult verify(Classifier model, E emitted, List<Dataset> rows, long seed)
      throws InputException;

  /** The sizes of the chosen file the report's selection section states beside its size. */
  ChosenBytes chosenBytes(Emitted<E> emitted);

  /** The compiler's name for the search's statistics, e.g. {@code javac}. */
  String compilerName();

  /** Compiler runs so far. */
  int compilerRuns();

  /** Sources compiled so far. */
  int sourcesCompiled();

  /** D8 runs so far; none unless a meter dexes. */
  default int d8Runs() {
    return 0;
  }

  /** A candidate's measured sizes in the layout kept for it. */
  record Measured(Sizes sizes, Layout layout) {

    public Measured {
      Objects.requireNonNull(sizes, "sizes");
      Objects.requireNonNull(layout, "layout");
    }
  }

  /** The file emitted for the chosen tree with its measured sizes. */
  record Emitted<E>(E emitted, Sizes sizes, Layout layout) {

    public Emitted {
      Objects.requireNonNull(emitted, "emitted");
      Objects.requireNonNull(sizes, "sizes");
      Objects.requireNonNull(layout, "layout");
    }
  }

  /**
   * Figures of the chosen file for the report, each null when the language has none: class files
   * (default debug information, {@code -g:none}, {@code -g}), bytecode and flash.
   */
  record ChosenBytes(Integer classFile, Integer classFileNoDebug, Integer classFileFullDebug,
      Integer bytecode, Integer flash) {}

  /**
   * This meter with its emitted files wrapped by {@code wrap} and unwrapped by {@code unwrap}, for
   * a language whose emission type holds what the meter makes.
   */
  default <F> SearchMeter<F> mapped(Function<E, F> wrap, Function<F, E> unwrap) {
    SearchMeter<E> inner = this;
    return new SearchMeter<>() {
      @Override
      public BudgetUnit unit() {
        return inner.unit();
      }

      @Override
      public List<Measured> measure(List<Classifier> models, HeaderInfo header)
          throws InputException {
        return inner.measure(models, header);
      }

      @Override
      public boolean usable(Sizes sizes) {
        return inner.usable(sizes);
      }

      @Override
      public OptionalInt bareSize(Classifier model, HeaderInfo header) throws InputException {
        return inner.bareSize(model, header);
      }

      @Override
      public Emitted<F> emit(Classifier model, HeaderInfo header) throws InputException {
        Emitted<E> e = inner.emit(model, header);
        return new Emitted<>(wrap.apply(e.emitted()), e.sizes(), e.layout());
      }

      @Override
      public VerificationResult verify(Classifier model, F emitted, List<Dataset> rows,
          long seed) throws InputException {
        return inner.verify(model, unwrap.apply(emitted), rows, seed);
      }

      @Override
      public ChosenBytes chosenBytes(Emitted<F> emitted) {
        return inner.chosenBytes(new Emitted<>(unwrap.apply(emitted.emitted()), emitted.sizes(),
            emitted.layout()));
      }

      @Override
      public String compilerName() {
        return inner.compilerName();
      }

      @Override
      public int compilerRuns() {
        return inner.compilerRuns();
      }

      @Override
      public int sourcesCompiled() {
        return inner.sourcesCompiled();
      }

      @Override
      public int d8Runs() {
        return inner.d8Runs();
      }
    };
  }
}
