package dev.splitwright.train.reference;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import java.util.Arrays;

/**
 * Each feature's row indices sorted once by value, with the values alongside. A tree node owns the
 * same segment {@code [lo, hi)} of every feature's arrays; within a segment rows are in ascending
 * value order with missing rows (NaN) last. Splitting a node partitions every segment stably, so
 * the children's segments stay sorted and nothing is ever sorted again.
 */
final class SortedColumns {
  private static final int DIGIT_BITS = 11;
  private static final int BUCKETS = 1 << DIGIT_BITS;

  /** {@code rows[f][i]}: the row at sorted position i of feature f. */
  final int[][] rows;
  /** {@code values[f][i]}: that row's value; missing is NaN and {@code -0.0f} is {@code 0.0f}. */
  final float[][] values;
  /** {@code labels[f][i]}: that row's class; kept alongside so scans read memory in order. */
  final int[][] labels;

  private final int[] scratchRows;
  private final float[] scratchValues;
  private final int[] scratchLabels;

  private SortedColumns(int[][] rows, float[][] values, int[][] labels, int n) {
    this.rows = rows;
    this.values = values;
    this.labels = labels;
    this.scratchRows = new int[n];
    this.scratchValues = new float[n];
    this.scratchLabels = new int[n];
  }

  static SortedColumns of(Dataset data) {
    int n = data.rows();
    int features = data.featureCount();
    int[][] rows = new int[features][];
    float[][] values = new float[features][];
    int[][] labels = new int[features][];
    int[] rowLabels = data.labels();
    int[] keys = new int[n];
    int[] keyBuffer = new int[n];
    int[] rowBuffer = new int[n];
    for (int f = 0; f < features; f++) {
      Feature feature = data.schema().feature(f);
      float[] column = data.column(f);
      for (int r = 0; r < n; r++) {
        float v = column[r];
        if (feature.isMissing(v)) {
          v = Float.NaN;
        } else if (v == 0f) {
          v = 0f;
        }
        column[r] = v;
        keys[r] = unsignedOrderKey(v);
      }
      int[] order = new int[n];
      for (int r = 0; r < n; r++) {
        order[r] = r;
      }
      radixSort(keys, order, keyBuffer, rowBuffer);
      float[] sorted = new float[n];
      int[] sortedLabels = new int[n];
      for (int i = 0; i < n; i++) {
        sorted[i] = column[order[i]];
        sortedLabels[i] = rowLabels[order[i]];
      }
      rows[f] = order;
      values[f] = sorted;
      labels[f] = sortedLabels;
    }
    return new SortedColumns(rows, values, labels, n);
  }

  /**
   * Maps a float to an int whose unsigned order is the float's numeric order, with the canonical
   * NaN above +Infinity.
   */
  static int unsignedOrderKey(float v) {
    int bits = Float.floatToIntBits(v);
    return (bits ^ ((bits >> 31) & 0x7fffffff)) ^ 0x80000000;
  }

  /** Sorts keys ascending (unsigned), carrying rows along; stable, so equal keys keep row order. */
  private static void radixSort(int[] keys, int[] rows, int[] keyBuffer, int[] rowBuffer) {
    int n = keys.length;
    if (n == 0) {
      return;
    }
    int[] srcKeys = keys;
    int[] srcRows = rows;
    int[] dstKeys = keyBuffer;
    int[] dstRows = rowBuffer;
    int[] start = new int[BUCKETS];
    for (int shift = 0; shift < 32; shift += DIGIT_BITS) {
      Arrays.fill(start, 0);
      for (int i = 0; i < n; i++) {
        start[(srcKeys[i] >>> shift) & (BUCKETS - 1)]++;
      }
      if (start[(srcKeys[0] >>> shift) & (BUCKETS - 1)] == n) {
        continue; // every key has this digit: the pass would not move anything
      }
      int sum = 0;
      for (int b = 0; b < BUCKETS; b++) {
        int c = start[b];
        start[b] = sum;
        sum += c;
      }
      for (int i = 0; i < n; i++) {
        int pos = start[(srcKeys[i] >>> shift) & (BUCKETS - 1)]++;
        dstKeys[pos] = srcKeys[i];
        dstRows[pos] = srcRows[i];
      }
      int[] t = srcKeys;
      srcKeys = dstKeys;
      dstKeys = t;
      t = srcRows;
      srcRows = dstRows;
      dstRows = t;
    }
    if (srcRows != rows) {
      System.arraycopy(srcRows, 0, rows, 0, n);
      System.arraycopy(srcKeys, 0, keys, 0, n);
    }
  }

  /**
   * Moves the rows of {@code [lo, hi)} with {@code goesLeft[row] == 1} to the front of the segment
   * in every feature, keeping order on both sides.
   */
  void partition(int lo, int hi, byte[] goesLeft) {
    for (int f = 0; f < rows.length; f++) {
      int[] r = rows[f];
      float[] v = values[f];
      int[] y = labels[f];
      int left = lo;
      int right = 0;
      for (int i = lo; i < hi; i++) {
        int row = r[i];
        float value = v[i];
        int label = y[i];
        int g = goesLeft[row];
        // Branch-free: write both sides, advance one. left <= i: nothing unread is overwritten.
        r[left] = row;
        v[left] = value;
        y[left] = label;
        scratchRows[right] = row;
        scratchValues[right] = value;
        scratchLabels[right] = label;
        left += g;
        right += 1 - g;
      }
      System.arraycopy(scratchRows, 0, r, left, right);
      System.arraycopy(scratchValues, 0, v, left, right);
      System.arraycopy(scratchLabels, 0, y, left, right);
    }
  }
}
