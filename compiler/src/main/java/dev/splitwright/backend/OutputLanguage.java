package dev.splitwright.backend;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.Classifier;
import dev.splitwright.report.CompileReport;
import dev.splitwright.select.BudgetUnit;
import dev.splitwright.select.SearchMeter;
import dev.splitwright.verify.VerificationResult;
import java.util.List;
import java.util.Optional;

/**
 * An output language: emits source for a tree, proves the source returns what the model returns,
 * and measures it. The compile job, the budget search and the report use this and nothing
 * language-specific; {@link JavaLanguage} and {@link CLanguage} are the implementations, and
 * {@link Languages} makes one from the command line's choice.
 *
 * @param <E> what {@link #emit} hands to {@link #verify} and {@link #measure}
 */
public interface OutputLanguage<E extends Emission> {

  /** The name on the command line and in reports: {@code java} or {@code c}. */
  String name();

  /**
   * The paths {@link Emission#files()} will have, in order, known from the options alone so that
   * an unusable output location is reported before any data is read.
   */
  List<String> plannedFiles();

  /** The name the report and pictures beside the files start with: {@code <stem>.report.json}. */
  String stem();

  /**
   * Emits {@code model}, a single tree or an ensemble, choosing the layout first when the options
   * leave it to the smaller.
   *
   * @throws InputException if the options cannot hold this model
   */
  E emit(Classifier model, HeaderInfo header) throws InputException;

  /**
   * Compares the emitted code with {@code model} on every row of {@code rows}, the boundary
   * probes of every split of every tree and random inputs seeded with {@code seed}.
   *
   * @throws InputException if the tool the check needs cannot be found
   */
  VerificationResult verify(Classifier model, E emission, List<Dataset> rows, long seed)
      throws InputException;

  /**
   * Measures {@code emission} as the report states it; never estimated.
   *
   * @throws InputException if the tool the measurement needs cannot be found
   */
  SizeFigures measure(E emission) throws InputException;

  /**
   * Starts, in the background, what makes this language's first compilation faster; called
   * before the data of a budget search is read. Nothing by default.
   *
   * @return stops the warm-up after its current step; run when the job ends
   */
  default Runnable warmUp() {
    return () -> { };
  }

  /** The units a budget for this language may count, the default first. */
  List<BudgetUnit> budgetUnits();

  /**
   * What the budget search measures candidates, emits the choice and checks it with, in {@code
   * unit}, one of {@link #budgetUnits()}.
   *
   * @throws InputException if the tool the measurement needs cannot be found
   */
  SearchMeter<E> searchMeter(BudgetUnit unit) throws InputException;

  /**
   * The compiler that built the code {@link #verify} ran, once it has run: its first line of
   * {@code --version} and its flags. Empty when the check runs inside this JVM.
   */
  default Optional<CompileReport.Compiler> verifyingCompiler() {
    return Optional.empty();
  }

  /**
   * The proofs of the same code on emulated devices that {@link #verify} ran after its own check,
   * once it has run, in order. Empty when none were asked for.
   */
  default List<CompileReport.OnChip> onChipProofs() {
    return List.of();
  }
}
