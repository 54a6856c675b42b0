package dev.splitwright.select;

import java.util.ArrayList;
import java.util.List;

/** Assembles the report's {@code "selection"} section from the search and the choice. */
final class SelectionReportBuilder {
  private SelectionReportBuilder() {}

  /**
   * The section for {@code choice}, taken from {@code search}.
   *
   * @param noDebugBytes the emitted classifier compiled with {@code -g:none}
   * @param fullDebugBytes the same compiled with {@code -g}
   */
  static SelectionReport build(SearchSettings settings, CandidateSearch.Result search,
      ChoiceEmitter.Choice choice, int noDebugBytes, int fullDebugBytes) {
    Sizes s = choice.sizes();
    CandidateRecipe recipe = choice.candidate().recipe();
    SelectionReport.Chosen picked = new SelectionReport.Chosen(recipe.maxDepth(),
        recipe.minLeaf(), recipe.alpha(), choice.tree().depth(), choice.tree().leafCount(),
        choice.candidate().score(), s.in(settings.unit()), choice.source().layout().optionName(),
        s.classFileBytes(), noDebugBytes, fullDebugBytes, s.bytecodeBytes(), s.sourceBytes());
    List<SelectionReport.Point> frontier = new ArrayList<>();
    for (Candidate c : search.frontier()) {
      frontier.add(new SelectionReport.Point(c.size(settings.unit()), c.score(),
          c.tree().depth(), c.tree().leafCount(), c.recipe().maxDepth(), c.recipe().minLeaf(),
          c.recipe().alpha(), c.index() == choice.candidate().index()));
    }
    // Sorted by size, the frontier starts with the smallest usable candidate.
    int smallest = search.frontier().get(0).size(settings.unit());
    return new SelectionReport(settings.budget(), settings.unit().optionName(),
        settings.metric().optionName(), scoredOn(settings),
        settings.refitAll() ? "train+validation" : "train", settings.maxDepth(),
        settings.minLeafs(), search.settingsTried(), search.candidates().size(), smallest,
        picked, choice.fallbacks(), frontier);
  }

  private static String scoredOn(SearchSettings settings) {
    return settings.folds() == 0 ? "validation"
        : settings.folds() + "-fold cross-validation of train+validation";
  }
}
