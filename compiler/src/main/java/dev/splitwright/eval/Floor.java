package dev.splitwright.eval;

import java.util.Objects;

/**
 * The lowest acceptable value of one metric on field data: a check fails when the score falls
 * below it (equal passes).
 */
public record Floor(Metric metric, double value) {

  public Floor {
    Objects.requireNonNull(metric, "metric");
    if (!(value >= 0 && value <= 1)) {
      throw new IllegalArgumentException("a floor must lie between 0 and 1, but it is " + value);
    }
  }

  /**
   * Parses {@code METRIC=VALUE}, e.g. {@code balanced-accuracy=0.75}.
   *
   * @throws IllegalArgumentException with a message fit for the user if the text is malformed
   */
  public static Floor parse(String text) {
    Objects.requireNonNull(text, "text");
    int eq = text.indexOf('=');
    if (eq < 0) {
      throw new IllegalArgumentException("must be METRIC=VALUE (e.g. balanced-accuracy=0.75), but "
          + "it is '" + text + "'");
    }
    String name = text.substring(0, eq);
    Metric metric = Metric.parse(name).orElseThrow(() -> new IllegalArgumentException(
        "names no metric in '" + text + "'; use accuracy, balanced-accuracy or macro-f1"));
    String number = text.substring(eq + 1).trim();
    // Plain decimal text only: Double.parseDouble would also take "NaN", "0x1p-1" or "1f".
    double value = number.matches("[0-9]*\\.?[0-9]+([eE][+-]?[0-9]+)?|[0-9]+\\.")
        ? Double.parseDouble(number) : Double.NaN;
    if (!(value >= 0 && value <= 1)) {
      throw new IllegalArgumentException("needs a number between 0 and 1 after '=', but it is '"
          + number + "'");
    }
    return new Floor(metric, value);
  }

  /** Tells whether {@code scores} reach this floor. */
  public boolean metBy(Scores scores) {
    return scores.get(metric) >= value;
  }
}
