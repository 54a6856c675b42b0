package dev.splitwright.eval;

import java.util.List;
import java.util.Objects;

/**
 * Scores of one classifier on one part of the data. {@code confusion[actual][predicted]} counts
 * rows; precision and recall are per class, in class order (0 where undefined).
 */
public record Scores(
    int rows,
    double accuracy,
    double balancedAccuracy,
    double macroF1,
    List<List<Integer>> confusion,
    List<Double> precision,
    List<Double> recall) {

  public Scores {
    confusion = Objects.requireNonNull(confusion, "confusion").stream().map(List::copyOf).toList();
    precision = List.copyOf(precision);
    recall = List.copyOf(recall);
  }

  /**
   * Computes the scores from a confusion matrix. Balanced accuracy is the mean recall over the
   * classes present in the data; macro-F1 is the mean F1 over those same classes, so a class absent
   * from a small part neither helps nor hurts it.
   */
  public static Scores fromConfusion(int[][] confusion) {
    int k = confusion.length;
    long total = 0;
    long correct = 0;
    long[] actual = new long[k];
    long[] predicted = new long[k];
    for (int a = 0; a < k; a++) {
      for (int p = 0; p < k; p++) {
        total += confusion[a][p];
        actual[a] += confusion[a][p];
        predicted[p] += confusion[a][p];
        if (a == p) {
          correct += confusion[a][p];
        }
      }
    }
    Double[] precision = new Double[k];
    Double[] recall = new Double[k];
    double recallSum = 0;
    double f1Sum = 0;
    int present = 0;
    for (int c = 0; c < k; c++) {
      double tp = confusion[c][c];
      precision[c] = predicted[c] == 0 ? 0.0 : tp / predicted[c];
      recall[c] = actual[c] == 0 ? 0.0 : tp / actual[c];
      if (actual[c] > 0) {
        present++;
        recallSum += recall[c];
        double pr = precision[c] + recall[c];
        f1Sum += pr == 0 ? 0 : 2 * precision[c] * recall[c] / pr;
      }
    }
    List<List<Integer>> rows = new java.util.ArrayList<>();
    for (int[] row : confusion) {
      rows.add(java.util.Arrays.stream(row).boxed().toList());
    }
    return new Scores(
        (int) total,
        total == 0 ? 0 : (double) correct / total,
        present == 0 ? 0 : recallSum / present,
        present == 0 ? 0 : f1Sum / present,
        rows,
        List.of(precision),
        List.of(recall));
  }

  /** Returns the value of {@code metric} in these scores. */
  public double get(Metric metric) {
    return switch (metric) {
      case ACCURACY -> accuracy;
      case BALANCED_ACCURACY -> balancedAccuracy;
      case MACRO_F1 -> macroF1;
    };
  }
}
