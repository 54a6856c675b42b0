package dev.splitwright.job;

import dev.splitwright.report.FrontierSvg;
import dev.splitwright.select.BudgetSelection;
import dev.splitwright.select.Candidate;
import dev.splitwright.select.SearchSettings;
import dev.splitwright.select.SelectionReport;
import java.util.List;

/** Labels and points of the frontier chart of a budget search. */
final class FrontierChartBuilder {
  private FrontierChartBuilder() {}

  /** The chart of {@code outcome}, searched with {@code settings} on data {@code name}. */
  static FrontierSvg.Chart build(String name, SearchSettings settings,
      BudgetSelection.Outcome<?> outcome) {
    String metric = settings.metric().optionName().replace('-', ' ');
    String scored = settings.folds() == 0 ? "validation " + metric
        : metric + ", mean of " + settings.folds() + " folds";
    String xLabel = switch (settings.unit()) {
      case CLASS -> "class file size (bytes; javac --release 17, default debug info)";
      case BYTECODE -> "bytecode size (bytes, sum of method code lengths)";
      case SOURCE -> "source size (bytes, UTF-8)";
      case DEX -> "DEX size (bytes; D8 release mode, the class alone)";
      case FLASH -> "flash size (bytes; .text, .rodata and .data of the object file)";
    };
    List<FrontierSvg.Dot> all = outcome.candidates().stream()
        .map(c -> dot(c, c.size(settings.unit()))).toList();
    List<FrontierSvg.Dot> frontier = outcome.frontier().stream()
        .map(c -> dot(c, c.size(settings.unit()))).toList();
    SelectionReport.Chosen chosen = outcome.report().chosen();
    return new FrontierSvg.Chart(name, scored + " vs " + settings.unit().description(),
        xLabel, scored, settings.budget(), all, frontier,
        dot(outcome.chosen(), outcome.chosenSize()), chosen.leaves(), chosen.trees());
  }

  private static FrontierSvg.Dot dot(Candidate c, int size) {
    return new FrontierSvg.Dot(size, c.score(), c.shape().kind().optionName());
  }
}
