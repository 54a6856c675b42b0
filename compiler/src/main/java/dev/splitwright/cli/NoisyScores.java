package dev.splitwright.cli;

import dev.splitwright.eval.Scores;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/** Warns when a validation part has too few rows of some class for its scores to mean much. */
final class NoisyScores {
  /**
   * Fewest rows of a class for a score to be taken at face value: about 30 is common practice
   * (the usual small-sample rule of thumb); one row of 30 moves that class's recall by 0.033.
   */
  static final int FEWEST_ROWS = 30;

  private NoisyScores() {}

  /** One line naming the classes with fewer than {@link #FEWEST_ROWS} rows, if there are any. */
  static Optional<String> warning(String part, List<String> classes, Scores scores) {
    List<String> few = new ArrayList<>();
    for (int c = 0; c < classes.size(); c++) {
      int rows = scores.confusion().get(c).stream().mapToInt(Integer::intValue).sum();
      if (rows < FEWEST_ROWS) {
        few.add(classes.get(c) + " " + rows);
      }
    }
    if (few.isEmpty()) {
      return Optional.empty();
    }
    return Optional.of(String.format(Locale.ROOT, "warning: the %s part has fewer than %d rows "
        + "of %d %s (%s), so its scores are noisy; give it a larger share with --split, or use "
        + "--folds with --budget", part, FEWEST_ROWS, few.size(),
        few.size() == 1 ? "class" : "classes", String.join(", ", few)));
  }
}
