package dev.splitwright.select;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.report.FrontierSvg;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.function.Function;

/**
 * Finds the best validated classifier that fits a byte budget.
 *
 * <ol>
 *   <li>Candidates: one tree per depth limit 1..D and leaf size, each with its whole
 *       cost-complexity pruning path; equal trees are kept once ({@link CandidateGenerator}).
 *   <li>Scores: the metric on the validation part, or the mean over stratified folds of train and
 *       validation together ({@link CandidateScorer}). Test rows are never looked at.
 *   <li>Sizes: every distinct candidate is emitted and compiled, in batches ({@link SizeMeter}).
 *       Nothing is estimated, so the frontier also shows what larger budgets would buy.
 *   <li>Choice: among candidates within the budget the best score, ties to the smaller size, then
 *       fewer leaves, then generation order ({@link Ranking}).
 *   <li>Refit and check: the chosen settings are refitted if the rows differ, emitted with the
 *       real header, compiled, measured and verified; if the refitted file breaks the budget the
 *       next candidate is taken, and the report says so.
 * </ol>
 *
 * <p>Candidates are fitted on the rows the final tree is refitted on where the scoring allows: the
 * train part, or train and validation with cross-validation and {@code refitAll}. Only with a
 * single validation split and {@code refitAll} does the emitted tree differ from the candidate.
 */
public final class BudgetSelection {
  private final SearchSettings settings;
  private final EmitOptions emit;
  private final Verifier verifier;
  private final SearchProgress progress;
  private final CandidateEmitter emitter;

  /** Searches with {@code settings}, emits with {@code emit}, checks with {@code verifier}. */
  public BudgetSelection(SearchSettings settings, EmitOptions emit, Verifier verifier,
      SearchProgress progress) {
    this.settings = Objects.requireNonNull(settings, "settings");
    this.emit = Objects.requireNonNull(emit, "emit");
    this.verifier = Objects.requireNonNull(verifier, "verifier");
    this.progress = Objects.requireNonNull(progress, "progress");
    this.emitter = CandidateEmitter.of(emit);
  }

  /**
   * The rows the search may use. Test rows are not among them.
   *
   * @param name the data file's name, for the chart's title
   * @param verifyRows rows the final classifier is verified on (any parts, test included: the
   *     verifier compares code with model, it does not score)
   * @param seed seed of the folds and of the verifier's random probes
   */
  public record Data(String name, Dataset train, Dataset validation, List<Dataset> verifyRows,
      long seed) {

    public Data {
      Objects.requireNonNull(name, "name");
      Objects.requireNonNull(train, "train");
      Objects.requireNonNull(validation, "validation");
      verifyRows = List.copyOf(verifyRows);
    }
  }

  /**
   * The emitted classifier, its verification, the report section, the chart and the statistics.
   * The classifier may have failed verification; the caller decides what to write.
   */
  public record Outcome(DecisionTree tree, EmittedSource source, VerificationResult verification,
      SelectionReport report, String frontierSvg, SearchStats stats) {}

  /** Every candidate scored and measured, the ones within the budget ranked, and the frontier. */
  record Search(int settingsTried, List<Candidate> candidates, List<Candidate> ranked,
      List<Candidate> frontier) {

    Search {
      candidates = List.copyOf(candidates);
      ranked = List.copyOf(ranked);
      frontier = List.copyOf(frontier);
    }
  }

  /**
   * Runs the search and emits the chosen classifier.
   *
   * @param candidateHeader the header candidates are emitted with; its lines should be as long as
   *     the final header's, so that source sizes match (class files do not depend on comments)
   * @param finalHeader the header of the emitted classifier, given its tree
   * @throws InputException if there are no rows to score on, the folds do not fit the rows, or
   *     not even the smallest candidate fits the budget
   */
  public Outcome run(Data data, HeaderInfo candidateHeader,
      Function<DecisionTree, HeaderInfo> finalHeader) throws InputException {
    long start = System.nanoTime();
    SizeMeter meter = new SizeMeter(verifier.compiler());
    Search search = null;
    try {
      search = search(data, candidateHeader, meter);
      return emitChoice(data, search, finalHeader, meter, start);
    } finally {
      // Also on failure, so that a progress bar is cleared before the error is printed.
      progress.finished(stats(search, meter, start));
    }
  }

  private static SearchStats stats(Search search, SizeMeter meter, long start) {
    return new SearchStats(search == null ? 0 : search.settingsTried(),
        search == null ? 0 : search.candidates().size(), meter.sourcesCompiled(),
        meter.javacRuns(), System.nanoTime() - start);
  }

  /** Refits, emits and measures candidates best first until one fits; verifies it. */
  private Outcome emitChoice(Data data, Search search,
      Function<DecisionTree, HeaderInfo> finalHeader, SizeMeter meter, long start)
      throws InputException {
    Dataset refitRows = settings.refitAll() ? data.train().concat(data.validation()) : data.train();
    boolean refit = settings.refitAll() && settings.folds() == 0;
    List<String> fallbacks = new ArrayList<>();
    for (int rank = 0; rank < search.ranked().size(); rank++) {
      Candidate candidate = search.ranked().get(rank);
      DecisionTree tree = refit
          ? CandidateGenerator.refit(refitRows, settings, candidate.setting())
          : candidate.tree();
      Emitted best = emitSmallest(tree, finalHeader.apply(tree), meter);
      int size = best.sizes().in(settings.unit());
      if (size <= settings.budget() && best.sizes().maxMethodBytes() <= emit.maxMethodBytes()) {
        VerificationResult verification = verifier.check(tree, best.classes(), best.source(),
            emit.toBuilder().layout(best.source().layout()).build(), data.verifyRows(),
            data.seed());
        SelectionReport report = report(search, candidate, tree, best, fallbacks);
        return new Outcome(tree, best.source(), verification, report,
            FrontierSvg.render(chart(data, search, candidate, size)),
            stats(search, meter, start));
      }
      fallbacks.add(String.format(Locale.ROOT, "candidate ranked %d (max-depth %d, min-leaf %d, "
          + "alpha %s) weighs %d bytes as emitted%s, over the budget; took the next", rank + 1,
          candidate.setting().maxDepth(), candidate.setting().minLeaf(),
          Setting.formatAlpha(candidate.setting().alpha()), size,
          refit ? " after refitting on train+validation" : ""));
    }
    throw new InputException("budget", "no candidate fits the budget of " + settings.budget()
        + " bytes as emitted" + (refit ? " after refitting on train+validation" : ""),
        refit ? "raise --budget or leave out --refit-all" : "raise --budget");
  }

  /** Generates, scores and measures the candidates and ranks those within the budget. */
  Search search(Data data, HeaderInfo candidateHeader, SizeMeter meter) throws InputException {
    Dataset pool = data.train().concat(data.validation());
    if (settings.folds() == 0 && data.validation().rows() == 0) {
      throw new InputException("budget", "the split leaves no validation rows to choose a "
          + "candidate by", "give --split a validation fraction, e.g. 0.6,0.2,0.2, or use --folds");
    }
    if (settings.folds() > pool.rows()) {
      throw new InputException("folds", settings.folds() + " folds need at least as many rows, "
          + "but train and validation hold " + pool.rows(), "use fewer folds");
    }
    Dataset fitRows = settings.folds() > 0 && settings.refitAll() ? pool : data.train();
    CandidateGenerator.Result generated =
        CandidateGenerator.generate(fitRows, settings, progress);
    List<Generated> trees = generated.trees();
    double[] scores = settings.folds() == 0
        ? CandidateScorer.onValidation(trees, data.validation(), settings)
        : CandidateScorer.crossValidated(trees, pool, settings, progress);
    List<Candidate> candidates = measure(trees, scores, candidateHeader, meter);
    List<Candidate> usable = candidates.stream()
        .filter(c -> c.sizes().maxMethodBytes() <= emit.maxMethodBytes())
        .toList();
    List<Candidate> ranked = Ranking.withinBudget(usable, settings.unit(), settings.budget());
    if (ranked.isEmpty()) {
      throw tooSmall(usable.isEmpty() ? candidates : usable);
    }
    return new Search(generated.settingsTried(), candidates, ranked,
        Ranking.frontier(usable, settings.unit()));
  }

  private List<Candidate> measure(List<Generated> trees, double[] scores,
      HeaderInfo candidateHeader, SizeMeter meter) {
    List<Candidate> candidates = new ArrayList<>(trees.size());
    progress.update("measuring", 0, trees.size());
    for (int start = 0; start < trees.size(); start += SizeMeter.BATCH_SOURCES) {
      List<Generated> chunk = trees.subList(start, Math.min(trees.size(),
          start + SizeMeter.BATCH_SOURCES));
      List<EmittedSource> sources = new ArrayList<>();
      List<Integer> variants = new ArrayList<>();
      for (Generated g : chunk) {
        List<EmittedSource> emitted = emitter.emit(g.tree(), candidateHeader);
        sources.addAll(emitted);
        variants.add(emitted.size());
      }
      List<Sizes> sizes = meter.measure(sources);
      int at = 0;
      for (int i = 0; i < chunk.size(); i++) {
        int pick = at;
        for (int v = at + 1; v < at + variants.get(i); v++) {
          if (sizes.get(v).in(settings.unit()) < sizes.get(pick).in(settings.unit())) {
            pick = v;
          }
        }
        Generated g = chunk.get(i);
        candidates.add(new Candidate(g.index(), g.setting(), g.tree(), scores[g.index()],
            sizes.get(pick), sources.get(pick).layout()));
        at += variants.get(i);
      }
      progress.update("measuring", start + chunk.size(), trees.size());
    }
    return candidates;
  }

  private InputException tooSmall(List<Candidate> candidates) {
    Candidate smallest = candidates.stream()
        .min(Comparator.comparingInt((Candidate c) -> c.size(settings.unit()))
            .thenComparingInt(c -> c.tree().leafCount())
            .thenComparingInt(Candidate::index))
        .orElseThrow();
    int least = smallest.size(settings.unit());
    int leaves = smallest.tree().leafCount();
    return new InputException("budget", String.format(Locale.ROOT,
        "%d bytes is too small: the smallest classifier for this data (%d %s) has a %s of %d "
            + "bytes", settings.budget(), leaves, leaves == 1 ? "leaf" : "leaves",
        settings.unit().description(), least), "give --budget " + least + " or more");
  }

  /** A source compiled under its real name, with its sizes. */
  private record Emitted(EmittedSource source, CompiledClasses classes, Sizes sizes) {}

  private Emitted emitSmallest(DecisionTree tree, HeaderInfo header, SizeMeter meter) {
    Emitted best = null;
    for (EmittedSource source : emitter.emit(tree, header)) {
      CompiledClasses classes = meter.compileAlone(source);
      Sizes sizes = SizeMeter.sizesOf(classes, source.qualifiedName(), source.sourceBytes());
      if (best == null || sizes.in(settings.unit()) < best.sizes().in(settings.unit())) {
        best = new Emitted(source, classes, sizes);
      }
    }
    return best;
  }

  private SelectionReport report(Search search, Candidate chosen, DecisionTree tree,
      Emitted emitted, List<String> fallbacks) {
    Sizes s = emitted.sizes();
    int[] debug = DebugVariants.measure(emitted.source());
    SelectionReport.Chosen picked = new SelectionReport.Chosen(chosen.setting().maxDepth(),
        chosen.setting().minLeaf(), chosen.setting().alpha(), tree.depth(), tree.leafCount(),
        chosen.score(), s.in(settings.unit()), emitted.source().layout().optionName(),
        s.classFileBytes(), debug[0], debug[1], s.bytecodeBytes(), s.sourceBytes());
    List<SelectionReport.Point> frontier = new ArrayList<>();
    for (Candidate c : search.frontier()) {
      frontier.add(new SelectionReport.Point(c.size(settings.unit()), c.score(),
          c.tree().depth(), c.tree().leafCount(), c.setting().maxDepth(), c.setting().minLeaf(),
          c.setting().alpha(), c.index() == chosen.index()));
    }
    // Sorted by size, the frontier starts with the smallest usable candidate.
    int smallest = search.frontier().get(0).size(settings.unit());
    return new SelectionReport(settings.budget(), settings.unit().optionName(),
        settings.metric().optionName(), scoredOn(),
        settings.refitAll() ? "train+validation" : "train", settings.maxDepth(),
        settings.minLeafs(), search.settingsTried(), search.candidates().size(), smallest,
        picked, fallbacks, frontier);
  }

  private String scoredOn() {
    return settings.folds() == 0 ? "validation"
        : settings.folds() + "-fold cross-validation of train+validation";
  }

  private FrontierSvg.Chart chart(Data data, Search search, Candidate chosen, int chosenSize) {
    String metric = settings.metric().optionName().replace('-', ' ');
    String scored = settings.folds() == 0 ? "validation " + metric
        : metric + ", mean of " + settings.folds() + " folds";
    String xLabel = switch (settings.unit()) {
      case CLASS -> "class file size (bytes; javac --release 17, default debug info)";
      case BYTECODE -> "bytecode size (bytes, sum of method code lengths)";
      case SOURCE -> "source size (bytes, UTF-8)";
    };
    List<FrontierSvg.Dot> all = search.candidates().stream()
        .map(c -> new FrontierSvg.Dot(c.size(settings.unit()), c.score())).toList();
    List<FrontierSvg.Dot> frontier = search.frontier().stream()
        .map(c -> new FrontierSvg.Dot(c.size(settings.unit()), c.score())).toList();
    return new FrontierSvg.Chart(data.name(), scored + " vs " + settings.unit().description(),
        xLabel, scored, settings.budget(), all, frontier,
        new FrontierSvg.Dot(chosenSize, chosen.score()));
  }
}
