package dev.splitwright.bench;

import java.util.Arrays;
import java.util.Locale;

/**
 * The order in which a benchmark feeds its input rows to a classifier. This decides how well the
 * CPU's branch predictor can guess the tree's comparisons, so it changes the cost per prediction
 * several-fold.
 */
enum InputOrder {
  /**
   * Independent rows in random order. A branch predictor learns a short repeating cycle of inputs
   * (about 4,096 rows on current CPUs), so the benchmarks use at least 65,536 distinct rows.
   */
  SHUFFLED("shuffled"),
  /**
   * Consecutive readings alike, as a device sees them: the rows sweep slowly from one logged
   * reading to the next, {@link #STEPS_PER_READING} inputs per transition, so the path through the
   * tree changes only now and then. A value missing at either end stays missing for the sweep, as
   * a sensor dropout would.
   */
  TIME_ORDERED("timeOrdered");

  /** Inputs on the way from one logged reading to the next. */
  static final int STEPS_PER_READING = 64;

  private final String paramName;

  InputOrder(String paramName) {
    this.paramName = paramName;
  }

  /** The spelling in JMH's {@code @Param}. */
  String paramName() {
    return paramName;
  }

  static InputOrder ofParam(String name) {
    for (InputOrder order : values()) {
      if (order.paramName.equals(name)) {
        return order;
      }
    }
    throw new IllegalArgumentException(String.format(Locale.ROOT,
        "unknown order '%s'; use one of %s", name,
        Arrays.stream(values()).map(InputOrder::paramName).toList()));
  }

  /**
   * Arranges {@code count} input rows from {@code readings} (independent rows in logged order; at
   * least {@code count}, or {@code count / STEPS_PER_READING + 1} for {@link #TIME_ORDERED}).
   * Labels of swept rows are those of the reading the sweep starts from.
   */
  LabelledRows arrange(LabelledRows readings, int count, long seed) {
    return switch (this) {
      case SHUFFLED -> shuffled(readings, count, seed);
      case TIME_ORDERED -> swept(readings, count);
    };
  }

  private static LabelledRows shuffled(LabelledRows readings, int count, long seed) {
    if (readings.size() < count) {
      throw new IllegalArgumentException(
          "need " + count + " readings to shuffle, but there are " + readings.size());
    }
    Integer[] order = new Integer[count];
    for (int i = 0; i < count; i++) {
      order[i] = i;
    }
    new BenchRandom(seed).shuffle(order);
    float[][] rows = new float[count][];
    int[] labels = new int[count];
    for (int i = 0; i < count; i++) {
      rows[i] = readings.rows()[order[i]].clone();
      labels[i] = readings.labels()[order[i]];
    }
    return new LabelledRows(rows, labels);
  }

  private static LabelledRows swept(LabelledRows readings, int count) {
    int needed = count / STEPS_PER_READING + 1;
    if (readings.size() < needed) {
      throw new IllegalArgumentException(
          "need " + needed + " readings to sweep, but there are " + readings.size());
    }
    float[][] rows = new float[count][];
    int[] labels = new int[count];
    for (int i = 0; i < count; i++) {
      int from = i / STEPS_PER_READING;
      float w = (float) (i % STEPS_PER_READING) / STEPS_PER_READING;
      float[] a = readings.rows()[from];
      float[] b = readings.rows()[from + 1];
      float[] x = new float[a.length];
      for (int f = 0; f < x.length; f++) {
        // NaN at either end propagates: the reading stays missing for the whole sweep.
        x[f] = a[f] + w * (b[f] - a[f]);
      }
      rows[i] = x;
      labels[i] = readings.labels()[from];
    }
    return new LabelledRows(rows, labels);
  }
}
