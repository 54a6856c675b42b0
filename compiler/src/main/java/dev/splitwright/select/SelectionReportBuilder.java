package dev.splitwright.select;

import java.util.ArrayList;
import java.util.List;

/** Assembles the report's {@code "selection"} section from the search and the choice. */
final class SelectionReportBuilder {
  private SelectionReportBuilder() {}

  /**
   * The section for {@code choice}, taken from {@code search}.
   *
   * @param bytes the emitted classifier's figures beside its size
   */
  static SelectionReport build(SearchSettings settings, CandidateSearch.Result search,
      ChoiceEmitter.Choice<?> choice, SearchMeter.ChosenBytes bytes) {
    Sizes s = choice.sizes();
    CandidateRecipe recipe = choice.candidate().recipe();
    Shape shape = Shape.of(choice.model());
    SelectionReport.Chosen picked = new SelectionReport.Chosen(shape.kind().optionName(),
        shape.trees(), recipe.maxDepth(), recipe.minLeaf(), recipe.alpha(), shape.depth(),
        shape.leaves(),
        validation(settings, choice.candidate()), crossValidated(settings, choice.candidate()),
        s.in(settings.unit()), choice.emitted().layout().optionName(), bytes.classFile(),
        bytes.classFileNoDebug(), bytes.classFileFullDebug(), bytes.bytecode(), bytes.flash(),
        s.sourceBytes());
    List<SelectionReport.Point> frontier = new ArrayList<>();
    for (Candidate c : search.frontier()) {
      frontier.add(new SelectionReport.Point(c.size(settings.unit()), validation(settings, c),
          crossValidated(settings, c), c.shape().kind().optionName(), c.shape().trees(),
          c.shape().depth(), c.shape().leaves(),
          c.recipe().maxDepth(), c.recipe().minLeaf(), c.recipe().alpha(),
          c.index() == choice.candidate().index()));
    }
    // Sorted by size, the frontier starts with the smallest usable candidate.
    int smallest = search.frontier().get(0).size(settings.unit());
    return new SelectionReport(settings.budget(), settings.unit().optionName(),
        settings.metric().optionName(), scoredOn(settings),
        settings.refitAll() ? "train+validation" : "train", settings.maxDepth(),
        settings.minLeafs(), settings.kinds().stream().map(ModelKind::optionName).toList(),
        search.settingsTried(), search.candidates().size(), search.skipped(), smallest,
        picked, choice.fallbacks(), frontier);
  }

  /** The score if it was taken on the validation part, else null (left out of the JSON). */
  private static Double validation(SearchSettings settings, Candidate c) {
    return settings.folds() == 0 ? c.score() : null;
  }

  /** The mean score over the folds with cross-validation, else null (left out of the JSON). */
  private static Double crossValidated(SearchSettings settings, Candidate c) {
    return settings.folds() == 0 ? null : c.score();
  }

  private static String scoredOn(SearchSettings settings) {
    return settings.folds() == 0 ? "validation"
        : settings.folds() + "-fold cross-validation of train+validation";
  }
}
