package dev.splitwright.cli;

import dev.splitwright.select.CandidateRecipe;
import dev.splitwright.select.SearchStats;
import dev.splitwright.select.SelectionReport;
import java.io.PrintWriter;
import java.util.Locale;

/** Prints what the budget search chose and what it took. */
final class BudgetSummary {
  private BudgetSummary() {}

  static void print(PrintWriter out, SelectionReport selection, SearchStats stats) {
    SelectionReport.Chosen c = selection.chosen();
    out.printf(Locale.ROOT, "budget: %d bytes (%s); chosen max-depth %d, min-leaf %d, alpha %s "
        + "(depth %d, %d leaves): %d bytes, %s %.4f (%s)%n", selection.budget(),
        selection.budgetUnit(), c.maxDepth(), c.minLeaf(), CandidateRecipe.formatAlpha(c.alpha()),
        c.depth(), c.leaves(), c.size(), selection.metric(), c.score(),
        selection.scoredOn());
    if (selection.budgetUnit().equals("class")) {
      out.printf(Locale.ROOT, "budget: the class file weighs %d bytes with javac -g:none and %d "
          + "with -g (a default Maven build)%n", c.classFileBytesNoDebug(),
          c.classFileBytesFullDebug());
    }
    for (String fallback : selection.fallbacks()) {
      out.println("budget: " + fallback);
    }
    if (stats != null) {
      out.printf(Locale.ROOT, "search: %d settings, %d distinct trees measured in %d javac runs, "
          + "frontier of %d; %.1f s%n", stats.settingsTried(), stats.distinctTrees(),
          stats.javacRuns(), selection.frontier().size(), stats.seconds());
    }
  }
}
