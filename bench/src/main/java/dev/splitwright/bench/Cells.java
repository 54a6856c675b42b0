package dev.splitwright.bench;

import java.util.Locale;

/** Number formatting for the Markdown tables: {@link Locale#ROOT}, no grouping, fixed digits. */
final class Cells {
  static final String NONE = "—";

  private Cells() {}

  /**
   * A time with three significant digits or at least one decimal, e.g. {@code 38.5}, {@code 1.23}.
   */
  static String number(double value) {
    if (Double.isNaN(value)) {
      return NONE;
    }
    double magnitude = Math.abs(value);
    String pattern = magnitude >= 100 ? "%.0f" : magnitude >= 10 ? "%.1f" : "%.2f";
    return String.format(Locale.ROOT, pattern, value);
  }

  /** A score with the range of its samples, e.g. {@code 38.5 (36.1–41.0)}. */
  static String withRange(double score, double min, double max) {
    return min == max || Double.isNaN(min) ? number(score)
        : number(score) + " (" + number(min) + "–" + number(max) + ")";
  }

  /** A ratio such as {@code 12.3×}. */
  static String ratio(double value) {
    return Double.isNaN(value) || Double.isInfinite(value) ? NONE : number(value) + "×";
  }

  /**
   * Whether {@code measured} meets {@code target} ({@code atLeast}: measured must be at least the
   * target; otherwise at most), and if not by how much, relative to the target.
   */
  static String verdict(double measured, double target, boolean atLeast) {
    if (Double.isNaN(measured)) {
      return "not measured";
    }
    boolean met = atLeast ? measured >= target : measured <= target;
    if (met) {
      return "met";
    }
    double off = Math.abs(measured - target) / target * 100;
    return String.format(Locale.ROOT, "**missed by %.0f%%**", off);
  }
}
