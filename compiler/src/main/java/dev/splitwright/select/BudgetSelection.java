package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.Classifier;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.function.Function;

/**
 * Finds the best validated classifier that fits a byte budget.
 *
 * <ol>
 *   <li>Candidates: one tree per depth limit 1..D and leaf size, each with its whole
 *       cost-complexity pruning path, and for each ensemble kind searched one voting forest or
 *       boosted ensemble per member depth and tree count; equal candidates are kept once ({@link
 *       CandidateGenerator}).
 *   <li>Scores: the metric on the validation part, or the mean over stratified folds of train and
 *       validation together ({@link CandidateScorer}). Test rows are never looked at.
 *   <li>Sizes: every distinct candidate is emitted and compiled, in batches, by the output
 *       language's {@link SearchMeter}: javac class files ({@link JavaSearchMeter}, for a DEX
 *       budget dexed, one D8 run per batch) or a C compiler's object files. Nothing is
 *       estimated, so the frontier also shows what larger budgets would buy.
 *   <li>Choice: among candidates within the budget the best score, ties to the smaller size, then
 *       fewer leaves, then generation order ({@link Ranking}); steps 1 to 4 are {@link
 *       CandidateSearch}.
 *   <li>Refit and check: the chosen settings are refitted if the rows differ, emitted with the
 *       real header, compiled and measured ({@link ChoiceEmitter}); if the refitted file breaks
 *       the budget the next candidate is taken, and the report says so. The file kept is verified
 *       and the report section assembled ({@link SelectionReportBuilder}).
 * </ol>
 *
 * <p>Candidates are fitted on the rows the final tree is refitted on where the scoring allows: the
 * train part, or train and validation with cross-validation and {@code refitAll}. Only with a
 * single validation split and {@code refitAll} does the emitted tree differ from the candidate.
 */
public final class BudgetSelection<E> {
  private final SearchSettings settings;
  private final SearchMeter<E> meter;
  private final SearchProgress progress;

  /**
   * Searches with {@code settings}, measuring, emitting and checking with {@code meter}.
   *
   * @throws IllegalArgumentException if {@code meter} measures another unit than the budget's
   */
  public BudgetSelection(SearchSettings settings, SearchMeter<E> meter, SearchProgress progress) {
    this.settings = Objects.requireNonNull(settings, "settings");
    this.meter = Objects.requireNonNull(meter, "meter");
    this.progress = Objects.requireNonNull(progress, "progress");
    if (meter.unit() != settings.unit()) {
      throw new IllegalArgumentException("the meter measures " + meter.unit().optionName()
          + " bytes but the budget counts " + settings.unit().optionName() + " bytes");
    }
  }

  /** A search emitting Java with {@code emit}, compiled and checked by {@code verifier}. */
  public static BudgetSelection<LayoutChoice> java(SearchSettings settings, EmitOptions emit,
      Verifier verifier, SearchProgress progress) {
    return java(settings, emit, verifier, progress, Optional.empty());
  }

  /**
   * As above, a DEX budget measuring every candidate with {@code dex}.
   *
   * @throws IllegalArgumentException if the budget counts DEX bytes but {@code dex} is empty
   */
  public static BudgetSelection<LayoutChoice> java(SearchSettings settings, EmitOptions emit,
      Verifier verifier, SearchProgress progress, Optional<DexMeter> dex) {
    return new BudgetSelection<>(settings,
        new JavaSearchMeter(settings.unit(), emit, verifier, dex), progress);
  }

  /**
   * The rows the search may use. Test rows are not among them.
   *
   * @param verifyRows rows the final classifier is verified on (any parts, test included: the
   *     verifier compares code with model, it does not score)
   * @param seed seed of the folds and of the verifier's random probes
   */
  public record Data(Dataset train, Dataset validation, List<Dataset> verifyRows, long seed) {

    public Data {
      Objects.requireNonNull(train, "train");
      Objects.requireNonNull(validation, "validation");
      verifyRows = List.copyOf(verifyRows);
    }
  }

  /**
   * The emitted classifier, its verification, the report section, what a chart needs and the
   * statistics. The classifier may have failed verification; the caller decides what to write.
   *
   * @param model the chosen tree or ensemble, as emitted (refitted if the rows differ)
   * @param emitted what the language emitted for it
   * @param candidates every candidate scored and measured, in generation order
   * @param frontier the Pareto-optimal candidates by size, ascending
   * @param chosen the candidate the emitted classifier comes from
   * @param chosenSize the emitted classifier's size in the budget's unit (a refit may differ from
   *     the candidate's)
   */
  public record Outcome<E>(Classifier model, E emitted, VerificationResult verification,
      SelectionReport report, List<Candidate> candidates, List<Candidate> frontier,
      Candidate chosen, int chosenSize, SearchStats stats) {

    public Outcome {
      Objects.requireNonNull(emitted, "emitted");
      candidates = List.copyOf(candidates);
      frontier = List.copyOf(frontier);
    }
  }

  /**
   * Runs the search and emits the chosen classifier.
   *
   * @param candidateHeader the header candidates are emitted with; its lines should be as long as
   *     the final header's, so that source sizes match (compiled sizes do not depend on comments)
   * @param finalHeader the header of the emitted classifier, given its tree
   * @throws InputException if there are no rows to score on, the folds do not fit the rows, not
   *     even the smallest candidate fits the budget, or the language's tools cannot be run
   */
  public Outcome<E> run(Data data, HeaderInfo candidateHeader,
      Function<Classifier, HeaderInfo> finalHeader) throws InputException {
    long start = System.nanoTime();
    CandidateSearch.Result search = null;
    try {
      search = new CandidateSearch(settings, progress).run(data, candidateHeader, meter);
      ChoiceEmitter.Choice<E> choice = new ChoiceEmitter<>(settings, meter).choose(
          search.ranked(), data.train(), data.validation(), finalHeader);
      E emitted = choice.emitted().emitted();
      VerificationResult verification = meter.verify(choice.model(), emitted, data.verifyRows(),
          data.seed());
      SelectionReport report = SelectionReportBuilder.build(settings, search, choice,
          meter.chosenBytes(choice.emitted()));
      return new Outcome<>(choice.model(), emitted, verification, report,
          search.candidates(), search.frontier(), choice.candidate(),
          choice.sizes().in(settings.unit()), stats(search, start));
    } finally {
      // Also on failure, so that a progress bar is cleared before the error is printed.
      progress.finished(stats(search, start));
    }
  }

  private SearchStats stats(CandidateSearch.Result search, long start) {
    return new SearchStats(search == null ? 0 : search.settingsTried(),
        search == null ? 0 : search.candidates().size(), search == null ? 0 : search.skipped(),
        meter.sourcesCompiled(),
        meter.compilerName(), meter.compilerRuns(), meter.d8Runs(), System.nanoTime() - start);
  }
}
