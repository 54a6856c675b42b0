package dev.splitwright.select;

import java.util.EnumMap;
import java.util.Map;

/**
 * Guesses a candidate's compiled size from its node count, per kind, by a least-squares line
 * through the sizes measured so far. It only decides how far ahead along a chain one compiler run
 * looks; nothing is kept or dropped on a guess.
 */
final class SizeGuess {
  private final Map<ModelKind, double[]> sums = new EnumMap<>(ModelKind.class);

  /** Adds a measured candidate: its nodes and its size in the budget's unit. */
  void add(ModelKind kind, double nodes, int size) {
    double[] s = sums.computeIfAbsent(kind, k -> new double[5]);
    s[0]++;
    s[1] += nodes;
    s[2] += size;
    s[3] += nodes * nodes;
    s[4] += nodes * size;
  }

  /** The guessed size of a candidate of {@code kind} with {@code nodes} nodes; NaN if unknown. */
  double of(ModelKind kind, double nodes) {
    double[] s = sums.get(kind);
    if (s == null || Double.isNaN(nodes)) {
      return Double.NaN;
    }
    double spread = s[0] * s[3] - s[1] * s[1];
    double slope = (s[0] * s[4] - s[1] * s[2]) / spread;
    // One node count seen (or sizes falling): no line to go by yet.
    if (!(spread > 0) || !(slope > 0)) {
      return Double.NaN;
    }
    double intercept = (s[2] - slope * s[1]) / s[0];
    return intercept + slope * nodes;
  }
}
