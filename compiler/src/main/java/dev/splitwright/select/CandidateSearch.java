package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.HeaderInfo;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalInt;

/**
 * The search part of a budget selection: generates the candidates, scores them, measures each one
 * compiled and ranks those within the budget. Test rows are never looked at.
 */
final class CandidateSearch {
  private final SearchSettings settings;
  private final SearchProgress progress;

  CandidateSearch(SearchSettings settings, SearchProgress progress) {
    this.settings = Objects.requireNonNull(settings, "settings");
    this.progress = Objects.requireNonNull(progress, "progress");
  }

  /**
   * Every candidate measured and scored, the ones within the budget ranked, and the frontier.
   *
   * @param skipped settings not measured because a smaller candidate nested in theirs was already
   *     over the budget
   */
  record Result(int settingsTried, int skipped, List<Candidate> candidates,
      List<Candidate> ranked, List<Candidate> frontier) {

    Result {
      candidates = List.copyOf(candidates);
      ranked = List.copyOf(ranked);
      frontier = List.copyOf(frontier);
    }
  }

  /**
   * Generates, measures and scores the candidates and ranks those within the budget.
   *
   * @throws InputException if there are no rows to score on, the folds do not fit the rows, or
   *     not even the smallest candidate fits the budget
   */
  Result run(BudgetSelection.Data data, HeaderInfo candidateHeader, SearchMeter<?> meter)
      throws InputException {
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
    CandidateGenerator.Chains chains = CandidateGenerator.chains(fitRows, settings, progress);
    ChainMeasurer.Result measured =
        new ChainMeasurer(settings, meter, progress).measure(chains.chains(), candidateHeader);
    List<DistinctTree> trees = measured.measured();
    // Scored after measuring, so that cross-validation refits only what was measured.
    double[] scores = settings.folds() == 0
        ? CandidateScorer.onValidation(trees, data.validation(), settings)
        : CandidateScorer.crossValidated(trees, pool, settings, progress);
    List<Candidate> candidates = new ArrayList<>(trees.size());
    for (int i = 0; i < trees.size(); i++) {
      DistinctTree t = trees.get(i);
      SearchMeter.Measured m = measured.sizes().get(t.index());
      candidates.add(new Candidate(t.index(), t.recipe(), t.model(), scores[i], m.sizes(),
          m.layout()));
    }
    List<Candidate> usable = candidates.stream()
        .filter(c -> meter.usable(c.sizes()))
        .toList();
    List<Candidate> ranked = Ranking.withinBudget(usable, settings.unit(), settings.budget());
    if (ranked.isEmpty()) {
      throw tooSmall(usable.isEmpty() ? candidates : usable, candidateHeader, meter);
    }
    return new Result(chains.settingsTried(), measured.skipped(), candidates, ranked,
        Ranking.frontier(usable, settings.unit()));
  }

  private InputException tooSmall(List<Candidate> candidates, HeaderInfo header,
      SearchMeter<?> meter) throws InputException {
    Candidate smallest = candidates.stream()
        .min(Comparator.comparingInt((Candidate c) -> c.size(settings.unit()))
            .thenComparingInt(c -> c.shape().leaves())
            .thenComparingInt(Candidate::index))
        .orElseThrow();
    int least = smallest.size(settings.unit());
    int leaves = smallest.shape().leaves();
    String problem = String.format(Locale.ROOT,
        "%d bytes is too small: the smallest classifier for this data (%d %s) has a %s of %d "
            + "bytes", settings.budget(), leaves, leaves == 1 ? "leaf" : "leaves",
        settings.unit().description(), least);
    OptionalInt measuredBare = meter.bareSize(smallest.model(), header);
    if (measuredBare.isEmpty()) {
      return new InputException("budget", problem, "give --budget " + least + " or more");
    }
    int bare = measuredBare.getAsInt();
    String remedy = bare <= settings.budget()
        ? String.format(Locale.ROOT, "add --bare (no label and feature tables), which makes "
            + "this classifier %d bytes; or give --budget %d or more", bare, least)
        : String.format(Locale.ROOT, "give --budget %d or more, or %d or more with --bare (no "
            + "label and feature tables)", least, bare);
    return new InputException("budget", problem, remedy);
  }
}
