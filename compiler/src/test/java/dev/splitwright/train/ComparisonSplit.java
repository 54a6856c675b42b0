package dev.splitwright.train;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;

/**
 * The Weka comparison's 60/20/20 stratified split, kept apart from {@code eval.StratifiedSplit}
 * so that the comparison does not rest on code under test: each class's rows are shuffled with a
 * seeded {@link Random} and dealt out in those proportions, so every part keeps the class mix
 * (stratified sampling, common practice). Each part lists row indices in ascending order.
 */
final class ComparisonSplit {
  private ComparisonSplit() {}

  /** Returns {train, validation, test} row indices. */
  static int[][] of(int[] labels, long seed) {
    Random random = new Random(seed);
    int classes = Arrays.stream(labels).max().orElse(-1) + 1;
    int n = labels.length;
    List<int[]> parts = List.of(new int[n], new int[n], new int[n]);
    int[] sizes = new int[3];
    for (int c = 0; c < classes; c++) {
      List<Integer> rows = new ArrayList<>();
      for (int r = 0; r < labels.length; r++) {
        if (labels[r] == c) {
          rows.add(r);
        }
      }
      for (int i = rows.size() - 1; i > 0; i--) {
        int j = random.nextInt(i + 1);
        rows.set(i, rows.set(j, rows.get(i)));
      }
      int train = (int) Math.round(rows.size() * 0.6);
      int validation = (int) Math.round(rows.size() * 0.2);
      for (int i = 0; i < rows.size(); i++) {
        int part = i < train ? 0 : (i < train + validation ? 1 : 2);
        parts.get(part)[sizes[part]++] = rows.get(i);
      }
    }
    int[][] out = new int[3][];
    for (int p = 0; p < 3; p++) {
      out[p] = Arrays.copyOf(parts.get(p), sizes[p]);
      Arrays.sort(out[p]);
    }
    return out;
  }
}
