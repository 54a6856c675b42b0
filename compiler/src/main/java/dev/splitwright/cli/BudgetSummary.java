package dev.splitwright.cli;

import dev.splitwright.select.SearchStats;
import dev.splitwright.select.SelectionReport;
import java.io.PrintWriter;
import java.util.Locale;

/** Prints what the budget search chose and what it took. */
final class BudgetSummary {
  private BudgetSummary() {}

  static void print(PrintWriter out, SelectionReport selection, SearchStats stats) {
    SelectionReport.Chosen c = selection.chosen();
    out.printf(Locale.ROOT, "budget: %d bytes (%s); chosen max-depth %d, min-leaf %d, alpha %.6g "
        + "(depth %d, %d leaves): %d bytes, validation %s %.4f%n", selection.budget(),
        selection.budgetUnit(), c.maxDepth(), c.minLeaf(), c.alpha(), c.depth(), c.leaves(),
        c.size(), selection.metric(), c.validationScore());
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
