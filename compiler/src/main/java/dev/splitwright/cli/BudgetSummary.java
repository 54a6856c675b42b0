package dev.splitwright.cli;

import dev.splitwright.select.CandidateRecipe;
import dev.splitwright.select.SearchStats;
import dev.splitwright.select.SelectionReport;
import dev.splitwright.text.DecimalText;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Prints what the budget search chose, the frontier around it and what the search took. */
final class BudgetSummary {
  /** Frontier points shown below the chosen one, and above it (what a larger budget buys). */
  static final int BELOW = 3;
  static final int ABOVE = 4;

  private BudgetSummary() {}

  static void print(PrintWriter out, SelectionReport selection, SearchStats stats) {
    SelectionReport.Chosen c = selection.chosen();
    String what = c.trees() == 1
        ? String.format(Locale.ROOT, "max-depth %d, min-leaf %d, alpha %s", c.maxDepth(),
            c.minLeaf(), CandidateRecipe.formatAlpha(c.alpha()))
        : String.format(Locale.ROOT, "%s of %d trees, max-depth %d, min-leaf %d", c.kind(),
            c.trees(), c.maxDepth(), c.minLeaf());
    out.printf(Locale.ROOT, "budget: %d bytes (%s); chosen %s (depth %d, %d leaves): %d bytes, "
        + "%s %s (%s)%n", selection.budget(), selection.budgetUnit(), what, c.depth(), c.leaves(),
        c.size(), selection.metric(), DecimalText.fixed(c.score(), 4), selection.scoredOn());
    if (selection.budgetUnit().equals("class")) {
      out.printf(Locale.ROOT, "budget: the class file weighs %d bytes with javac -g:none and %d "
          + "with -g (a default Maven build)%n", c.classFileBytesNoDebug(),
          c.classFileBytesFullDebug());
    }
    for (String fallback : selection.fallbacks()) {
      out.println("budget: " + fallback);
    }
    frontier(selection).forEach(out::println);
    if (stats != null) {
      String d8 = stats.d8Runs() == 0 ? "" : " and " + stats.d8Runs() + " D8 runs";
      String skipped = stats.settingsSkipped() == 0 ? "" : String.format(Locale.ROOT,
          " (%d larger than one already over budget, not measured)", stats.settingsSkipped());
      out.printf(Locale.ROOT, "search: %d settings%s, %d distinct candidates measured in %d %s "
          + "runs%s, frontier of %d; %.1f s%n", stats.settingsTried(), skipped,
          stats.distinctTrees(), stats.compilerRuns(), stats.compiler(), d8,
          selection.frontier().size(), stats.seconds());
    }
  }

  /**
   * A short table of the frontier next to the chosen point: size, score and leaves, a few points
   * smaller and a few larger, the larger ones marked when they break the budget.
   */
  static List<String> frontier(SelectionReport selection) {
    List<SelectionReport.Point> points = selection.frontier();
    if (points.isEmpty()) {
      return List.of();
    }
    // The chosen point, or, if a refit moved it off the frontier, the largest within budget.
    int chosen = 0;
    for (int i = 0; i < points.size(); i++) {
      if (points.get(i).chosen()) {
        chosen = i;
        break;
      }
      if (points.get(i).size() <= selection.budget()) {
        chosen = i;
      }
    }
    int from = Math.max(0, chosen - BELOW);
    int to = Math.min(points.size(), chosen + ABOVE + 1);
    List<String> lines = new ArrayList<>();
    String hidden = from == 0 && to == points.size() ? ""
        : String.format(Locale.ROOT, "; %d of %d points", to - from, points.size());
    lines.add(String.format(Locale.ROOT, "frontier (size -> %s %s -> leaves%s):",
        selection.scoredOn(), selection.metric(), hidden));
    int width = String.valueOf(points.get(to - 1).size()).length();
    for (int i = from; i < to; i++) {
      SelectionReport.Point p = points.get(i);
      String note = p.chosen() ? "  chosen" : p.size() > selection.budget() ? "  over budget" : "";
      String kind = p.trees() == 1 ? "" : "  " + p.kind() + " of " + p.trees();
      lines.add(String.format(Locale.ROOT, "  %s %" + width + "d B  %.4f  %4d %s%s%s",
          p.chosen() ? ">" : " ", p.size(), p.score(), p.leaves(),
          p.leaves() == 1 ? "leaf  " : "leaves", kind, note).stripTrailing());
    }
    if (to == points.size() && points.get(to - 1).chosen()) {
      lines.add("  (no larger candidate scores higher: a larger budget would buy nothing)");
    }
    return lines;
  }
}
