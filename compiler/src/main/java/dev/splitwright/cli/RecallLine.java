package dev.splitwright.cli;

import dev.splitwright.eval.Scores;
import dev.splitwright.job.CompileResult;
import dev.splitwright.text.DecimalText;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * The summary line of per-class recall on the last scored part (test if there is one), so a rare
 * class the tree neglects shows up even when overall accuracy looks good.
 */
final class RecallLine {
  /** Beyond this many classes the line names the worst ones only; the report has them all. */
  static final int MAX_SHOWN = 12;

  private RecallLine() {}

  static Optional<String> of(CompileResult result) {
    Map.Entry<String, Scores> last = null;
    for (Map.Entry<String, Scores> e : result.scores().entrySet()) {
      last = e;
    }
    if (last == null) {
      return Optional.empty();
    }
    return Optional.of(format(last.getKey(), result.model().schema().classes(), last.getValue()));
  }

  /** The line for one part's scores. */
  static String format(String part, List<String> classes, Scores scores) {
    // A class with no rows in the part has no recall; it sorts last and prints as "n/a".
    double[] recall = new double[classes.size()];
    for (int c = 0; c < recall.length; c++) {
      int rows = scores.confusion().get(c).stream().mapToInt(Integer::intValue).sum();
      recall[c] = rows == 0 ? Double.NaN : scores.recall().get(c);
    }
    List<Integer> shown = new ArrayList<>();
    for (int c = 0; c < classes.size(); c++) {
      shown.add(c);
    }
    String more = "";
    if (shown.size() > MAX_SHOWN) {
      // Lowest recall first, class index on ties, then back to class order for printing.
      shown.sort((a, b) -> recall[a] == recall[b]
          ? Integer.compare(a, b) : Double.compare(recall[a], recall[b]));
      shown = new ArrayList<>(shown.subList(0, MAX_SHOWN));
      shown.sort(null);
      more = String.format(Locale.ROOT, " (lowest %d of %d shown)", MAX_SHOWN, classes.size());
    }
    List<String> parts = new ArrayList<>();
    for (int c : shown) {
      parts.add(classes.get(c) + " "
          + (Double.isNaN(recall[c]) ? "n/a" : DecimalText.fixed(recall[c], 3)));
    }
    return String.format(Locale.ROOT, "%-10s recall per class: %s%s", part,
        String.join(", ", parts), more);
  }
}
