package dev.splitwright.eval;

import dev.splitwright.data.Dataset;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * Seeded stratified splitting: every class is divided in the requested proportions, so that rare
 * classes are represented in every part. The same data and seed always give the same parts.
 *
 * <p>Rows of each class are shuffled with their own {@link SplittableRandom} stream, split off a
 * generator seeded with {@code seed} once per class in class-code order; a class's shuffle thus
 * does not depend on the other classes' sizes.
 */
public final class StratifiedSplit {

  /** How far the fractions' sum may be from 1. */
  public static final double FRACTION_TOLERANCE = 1e-9;

  private StratifiedSplit() {}

  /**
   * Splits {@code data} into train, validation and test parts. Each class of {@code n} rows gives
   * each part about {@code fraction × n} rows (largest-remainder rounding); if a class has at least
   * as many rows as there are parts with a non-zero fraction, each of those parts gets at least one
   * of its rows.
   *
   * @throws IllegalArgumentException if a fraction is negative or not finite, or they do not sum to
   *     1 within {@link #FRACTION_TOLERANCE}
   */
  public static SplitParts split(
      Dataset data, double train, double validation, double test, long seed) {
    Objects.requireNonNull(data, "data");
    double[] fractions = checkFractions(train, validation, test);
    byte[] partOf = new byte[data.rows()];
    int[] partSizes = new int[3];
    SplittableRandom root = new SplittableRandom(seed);
    for (int[] classRows : rowsByClass(data)) {
      shuffle(classRows, root.split());
      int[] counts = allocate(classRows.length, fractions);
      int next = 0;
      for (int part = 0; part < counts.length; part++) {
        for (int i = 0; i < counts[part]; i++) {
          partOf[classRows[next++]] = (byte) part;
        }
        partSizes[part] += counts[part];
      }
    }
    int[][] rows = {new int[partSizes[0]], new int[partSizes[1]], new int[partSizes[2]]};
    int[] filled = new int[3];
    for (int row = 0; row < partOf.length; row++) {
      rows[partOf[row]][filled[partOf[row]]++] = row;
    }
    int[] trainRows = rows[0];
    int[] validationRows = rows[1];
    int[] testRows = rows[2];
    return new SplitParts(
        data.subset(trainRows),
        data.subset(validationRows),
        data.subset(testRows),
        trainRows,
        validationRows,
        testRows);
  }

  /**
   * Deals each class's shuffled rows round-robin into {@code k} folds, continuing the count from
   * one class to the next, so that fold sizes differ by at most one row overall and per class.
   *
   * @throws IllegalArgumentException if {@code k < 2} or {@code k} exceeds the number of rows
   */
  public static List<Fold> kFold(Dataset data, int k, long seed) {
    Objects.requireNonNull(data, "data");
    if (k < 2) {
      throw new IllegalArgumentException("k must be at least 2, but it is " + k);
    }
    if (k > data.rows()) {
      throw new IllegalArgumentException(
          "k must not exceed the " + data.rows() + " rows, but it is " + k);
    }
    int[] foldOf = new int[data.rows()];
    SplittableRandom root = new SplittableRandom(seed);
    int next = 0;
    for (int[] classRows : rowsByClass(data)) {
      shuffle(classRows, root.split());
      for (int row : classRows) {
        foldOf[row] = next;
        next = (next + 1) % k;
      }
    }
    List<Fold> folds = new ArrayList<>(k);
    for (int fold = 0; fold < k; fold++) {
      int held = 0;
      for (int f : foldOf) {
        if (f == fold) {
          held++;
        }
      }
      int[] validationRows = new int[held];
      int[] trainRows = new int[data.rows() - held];
      int v = 0;
      int t = 0;
      for (int row = 0; row < foldOf.length; row++) {
        if (foldOf[row] == fold) {
          validationRows[v++] = row;
        } else {
          trainRows[t++] = row;
        }
      }
      folds.add(new Fold(data, fold, trainRows, validationRows));
    }
    return List.copyOf(folds);
  }

  private static double[] checkFractions(double... fractions) {
    double sum = 0;
    for (double f : fractions) {
      if (!(f >= 0) || Double.isInfinite(f)) {
        throw fractionError(fractions, sum);
      }
      sum += f;
    }
    if (Math.abs(sum - 1) > FRACTION_TOLERANCE) {
      throw fractionError(fractions, sum);
    }
    double[] normalized = new double[fractions.length];
    for (int i = 0; i < fractions.length; i++) {
      normalized[i] = fractions[i] / sum;
    }
    return normalized;
  }

  private static IllegalArgumentException fractionError(double[] fractions, double sum) {
    return new IllegalArgumentException(
        String.format(
            Locale.ROOT,
            "train, validation and test fractions must be >= 0 and sum to 1, but they are %s, %s,"
                + " %s",
            fractions[0],
            fractions[1],
            fractions[2]));
  }

  /**
   * Divides {@code n} rows among parts by largest remainder: each part first gets {@code
   * floor(fraction × n)}, then the leftover rows go to the parts with the largest fractional parts,
   * ties to the earlier part. Then, if {@code n} allows, a part with a non-zero fraction but no row
   * takes one from the currently largest part. Finally, a class too small to reach every part still
   * gives the train part (if its fraction is non-zero) one row: a class the tree never sees in
   * training can never be predicted, and a train part without rows cannot be trained on.
   */
  static int[] allocate(int n, double[] fractions) {
    int parts = fractions.length;
    int[] counts = new int[parts];
    double[] remainders = new double[parts];
    int assigned = 0;
    int nonZeroParts = 0;
    for (int p = 0; p < parts; p++) {
      double quota = fractions[p] * n;
      counts[p] = (int) Math.floor(quota);
      remainders[p] = quota - counts[p];
      assigned += counts[p];
      if (fractions[p] > 0) {
        nonZeroParts++;
      }
    }
    while (assigned < n) {
      int best = -1;
      for (int p = 0; p < parts; p++) {
        if (fractions[p] > 0 && (best < 0 || remainders[p] > remainders[best])) {
          best = p;
        }
      }
      counts[best]++;
      remainders[best] = -1;
      assigned++;
    }
    if (n >= nonZeroParts) {
      for (int p = 0; p < parts; p++) {
        if (fractions[p] > 0 && counts[p] == 0) {
          int donor = 0;
          for (int q = 1; q < parts; q++) {
            if (counts[q] > counts[donor]) {
              donor = q;
            }
          }
          counts[donor]--;
          counts[p]++;
        }
      }
    }
    if (n > 0 && fractions[0] > 0 && counts[0] == 0) {
      int donor = 1;
      for (int q = 2; q < parts; q++) {
        if (counts[q] > counts[donor]) {
          donor = q;
        }
      }
      counts[donor]--;
      counts[0]++;
    }
    return counts;
  }

  /** Row indices of each class, ascending, indexed by class code. */
  private static int[][] rowsByClass(Dataset data) {
    int[] counts = data.classCounts();
    int[][] rows = new int[counts.length][];
    for (int c = 0; c < counts.length; c++) {
      rows[c] = new int[counts[c]];
    }
    int[] filled = new int[counts.length];
    for (int row = 0; row < data.rows(); row++) {
      int c = data.label(row);
      rows[c][filled[c]++] = row;
    }
    return rows;
  }

  /** Fisher–Yates shuffle (Knuth, TAOCP vol. 2, Algorithm P). */
  private static void shuffle(int[] rows, SplittableRandom random) {
    for (int i = rows.length - 1; i > 0; i--) {
      int j = random.nextInt(i + 1);
      int swap = rows[i];
      rows[i] = rows[j];
      rows[j] = swap;
    }
  }
}
