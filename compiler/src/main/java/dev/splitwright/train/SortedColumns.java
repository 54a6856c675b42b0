package dev.splitwright.train;

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
  /** Digits of a 32-bit key; the last has 10 bits. */
  private static final int PASSES = 3;

  /** {@code rows[f][i]}: the row at sorted position i of feature f. */
  final int[][] rows;
  /** {@code values[f][i]}: that row's value; missing is NaN and {@code -0.0f} is {@code 0.0f}. */
  final float[][] values;
  /**
   * {@code labels[f][i]}: that row's class, kept alongside so scans read memory in order; 16
   * unsigned bits hold every class index the loader allows, at half the memory of an int.
   */
  final char[][] labels;

  /** Where a partition puts the right side for a moment: one per share (see {@link TwoShares}). */
  private final Scratch[] scratch = new Scratch[2];

  private SortedColumns(int[][] rows, float[][] values, char[][] labels, int n) {
    this.rows = rows;
    this.values = values;
    this.labels = labels;
    this.scratch[0] = new Scratch(n);
  }

  private record Scratch(int[] rows, float[] values, char[] labels) {
    Scratch(int n) {
      this(new int[n], new float[n], new char[n]);
    }
  }

  static SortedColumns of(Dataset data) {
    int n = data.rows();
    int features = data.featureCount();
    int[][] rows = new int[features][];
    float[][] values = new float[features][];
    char[][] labels = new char[features][];
    char[] rowLabels = new char[n];
    int[] dataLabels = data.labels();
    for (int r = 0; r < n; r++) {
      rowLabels[r] = (char) dataLabels[r];
    }
    // Each feature is sorted on its own: two shares of the features at once on two cores.
    TwoShares.run(features, (long) n * features,
        (from, to, share) -> sortFeatures(data, from, to, rowLabels, rows, values, labels));
    return new SortedColumns(rows, values, labels, n);
  }

  /** Sorts features {@code [from, to)} into {@code rows}, {@code values} and {@code labels}. */
  private static void sortFeatures(Dataset data, int from, int to, char[] rowLabels,
      int[][] rows, float[][] values, char[][] labels) {
    int n = data.rows();
    int[] keys = new int[n];
    int[] keyBuffer = new int[n];
    int[] rowBuffer = new int[n];
    int[][] starts = new int[PASSES][BUCKETS];
    for (int f = from; f < to; f++) {
      Feature feature = data.schema().feature(f);
      // Read in place: a copy of the column per feature would only add garbage to the peak heap.
      if (feature.isCategorical()) {
        for (int r = 0; r < n; r++) {
          float v = data.value(r, f);
          keys[r] = unsignedOrderKey(feature.isMissing(v) ? Float.NaN : v + 0f);
        }
      } else {
        numericKeys(data, f, keys);
      }
      int[] order = new int[n];
      identity(order);
      if (radixSort(keys, order, keyBuffer, rowBuffer, starts)) {
        // The sorted keys and rows are in the buffers: keep them there instead of copying back.
        int[] t = keys;
        keys = keyBuffer;
        keyBuffer = t;
        t = order;
        order = rowBuffer;
        rowBuffer = t;
      }
      // The keys map back to the (canonical) values, so the values need no gather by row.
      float[] sorted = new float[n];
      char[] sortedLabels = new char[n];
      valuesAndLabels(keys, order, rowLabels, sorted, sortedLabels);
      rows[f] = order;
      values[f] = sorted;
      labels[f] = sortedLabels;
    }
  }

  // The loops below are small methods of their own, called once per feature (or per pass): the
  // JIT compiles each on its own and early, and the first features of a training run, which run
  // before any of it is compiled, cost less. (One method holding every loop ran a cold 200,000
  // x 16 sort about eight times slower than a warm one.)

  /** Order keys of a numeric column: NaN is canonical and -0.0 is 0.0 (Feature.isMissing). */
  private static void numericKeys(Dataset data, int f, int[] keys) {
    for (int r = 0; r < keys.length; r++) {
      float v = data.value(r, f);
      // v + 0f turns -0.0 into 0.0 and keeps every other value (IEEE 754, 6.3).
      keys[r] = unsignedOrderKey(v != v ? Float.NaN : v + 0f);
    }
  }

  private static void identity(int[] order) {
    for (int r = 0; r < order.length; r++) {
      order[r] = r;
    }
  }

  private static void valuesAndLabels(int[] keys, int[] order, char[] rowLabels, float[] sorted,
      char[] sortedLabels) {
    for (int i = 0; i < keys.length; i++) {
      sorted[i] = valueOfKey(keys[i]);
      sortedLabels[i] = rowLabels[order[i]];
    }
  }

  /**
   * Builds the columns of a sample drawn with replacement: row {@code r} appears {@code
   * copies[r]} times, next to its own copies. The rows stay sorted without sorting again, and
   * this object is left as it is, so one pre-sorted copy of the training data serves every tree
   * of an ensemble. Copies of one row keep its index, so a split sends them all the same way.
   *
   * @param size the sum of {@code copies}
   */
  SortedColumns resample(int[] copies, int size) {
    int features = rows.length;
    int[][] sampleRows = new int[features][size];
    float[][] sampleValues = new float[features][size];
    char[][] sampleLabels = new char[features][size];
    for (int f = 0; f < features; f++) {
      int[] fromRows = rows[f];
      float[] fromValues = values[f];
      char[] fromLabels = labels[f];
      int[] toRows = sampleRows[f];
      float[] toValues = sampleValues[f];
      char[] toLabels = sampleLabels[f];
      int w = 0;
      for (int i = 0; i < fromRows.length; i++) {
        int row = fromRows[i];
        for (int k = copies[row]; k > 0; k--) {
          toRows[w] = row;
          toValues[w] = fromValues[i];
          toLabels[w] = fromLabels[i];
          w++;
        }
      }
      if (w != size) {
        throw new IllegalArgumentException("copies sum to " + w + ", not " + size);
      }
    }
    return new SortedColumns(sampleRows, sampleValues, sampleLabels, size);
  }

  /**
   * Maps a float to an int whose unsigned order is the float's numeric order, with the canonical
   * NaN above +Infinity.
   */
  static int unsignedOrderKey(float v) {
    int bits = Float.floatToIntBits(v);
    return (bits ^ ((bits >> 31) & 0x7fffffff)) ^ 0x80000000;
  }

  /** The inverse of {@link #unsignedOrderKey}. */
  static float valueOfKey(int key) {
    int flipped = key ^ 0x80000000;
    return Float.intBitsToFloat(flipped ^ ((flipped >> 31) & 0x7fffffff));
  }

  /**
   * Sorts keys ascending (unsigned), carrying rows along; stable, so equal keys keep row order.
   * Returns whether the result is in the buffers ({@code keyBuffer}, {@code rowBuffer}) rather
   * than in {@code keys} and {@code rows}.
   */
  private static boolean radixSort(int[] keys, int[] rows, int[] keyBuffer, int[] rowBuffer,
      int[][] starts) {
    int n = keys.length;
    if (n == 0) {
      return false;
    }
    for (int[] start : starts) {
      Arrays.fill(start, 0);
    }
    countDigits(keys, starts[0], starts[1], starts[2]);
    int[] srcKeys = keys;
    int[] srcRows = rows;
    int[] dstKeys = keyBuffer;
    int[] dstRows = rowBuffer;
    for (int d = 0; d < PASSES; d++) {
      int shift = d * DIGIT_BITS;
      int[] start = starts[d];
      if (start[(srcKeys[0] >>> shift) & (BUCKETS - 1)] == n) {
        continue; // every key has this digit: the pass would not move anything
      }
      int sum = 0;
      for (int b = 0; b < BUCKETS; b++) {
        int c = start[b];
        start[b] = sum;
        sum += c;
      }
      scatter(srcKeys, srcRows, dstKeys, dstRows, start, shift);
      int[] t = srcKeys;
      srcKeys = dstKeys;
      dstKeys = t;
      t = srcRows;
      srcRows = dstRows;
      dstRows = t;
    }
    return srcRows != rows;
  }

  /** One counting pass for all three digits (11 + 11 + 10 bits). */
  private static void countDigits(int[] keys, int[] low, int[] middle, int[] high) {
    for (int i = 0; i < keys.length; i++) {
      int key = keys[i];
      low[key & (BUCKETS - 1)]++;
      middle[(key >>> DIGIT_BITS) & (BUCKETS - 1)]++;
      high[key >>> (2 * DIGIT_BITS)]++;
    }
  }

  private static void scatter(int[] srcKeys, int[] srcRows, int[] dstKeys, int[] dstRows,
      int[] start, int shift) {
    for (int i = 0; i < srcKeys.length; i++) {
      int pos = start[(srcKeys[i] >>> shift) & (BUCKETS - 1)]++;
      dstKeys[pos] = srcKeys[i];
      dstRows[pos] = srcRows[i];
    }
  }

  /**
   * Moves the rows of {@code [lo, hi)} whose bit is set in {@code goesLeft} (bit {@code row & 63}
   * of word {@code row >>> 6}) to the front of the segment
   * in every feature, keeping order on both sides. A side whose child will not be searched is not
   * written at all ({@code keepLeft} or {@code keepRight} false): a node that is not searched is
   * never split, so nothing reads its segment again. Feature {@code inPlace} (or -1) is left as it
   * is: its segment already has the left rows first.
   */
  void partition(
      int lo, int hi, long[] goesLeft, boolean keepLeft, boolean keepRight, int inPlace) {
    long cells = (long) (hi - lo) * rows.length;
    if (TwoShares.splits(cells) && scratch[1] == null) {
      // Made here, before the shares start, and kept for the next large node.
      scratch[1] = new Scratch(scratch[0].rows().length);
    }
    TwoShares.run(rows.length, cells, (from, to, share) -> {
      for (int f = from; f < to; f++) {
        if (f == inPlace) {
          continue;
        }
        if (keepLeft && keepRight) {
          partition(f, lo, hi, goesLeft, scratch[share]);
        } else if (keepLeft) {
          keepOneSide(f, lo, hi, goesLeft, 1);
        } else if (keepRight) {
          keepOneSide(f, lo, hi, goesLeft, 0);
        }
      }
    });
  }

  private void partition(int f, int lo, int hi, long[] goesLeft, Scratch aside) {
    int[] r = rows[f];
    float[] v = values[f];
    char[] y = labels[f];
    int[] scratchRows = aside.rows();
    float[] scratchValues = aside.values();
    char[] scratchLabels = aside.labels();
    int left = lo;
    int right = 0;
    for (int i = lo; i < hi; i++) {
      int row = r[i];
      float value = v[i];
      char label = y[i];
      int g = side(goesLeft, row);
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

  /**
   * Keeps, in order, only the rows whose bit in {@code goesLeft} is {@code side}: packed from
   * {@code lo} for the left side, into the end of the segment for the right side (scanning down, so
   * the write position never falls below the read position).
   */
  private void keepOneSide(int f, int lo, int hi, long[] goesLeft, int side) {
    int[] r = rows[f];
    float[] v = values[f];
    char[] y = labels[f];
    if (side == 1) {
      int w = lo;
      for (int i = lo; i < hi; i++) {
        int row = r[i];
        r[w] = row;
        v[w] = v[i];
        y[w] = y[i];
        w += side(goesLeft, row);
      }
    } else {
      int w = hi - 1;
      for (int i = hi - 1; i >= lo; i--) {
        int row = r[i];
        r[w] = row;
        v[w] = v[i];
        y[w] = y[i];
        w -= 1 - side(goesLeft, row);
      }
    }
  }

  /**
   * The row's bit: 1 for left. One bit a row keeps the map of a million rows at 125 KiB, in the
   * core's cache, where the partition's lookups in row order jump about at random.
   */
  private static int side(long[] goesLeft, int row) {
    return (int) (goesLeft[row >>> 6] >>> row) & 1;
  }
}
