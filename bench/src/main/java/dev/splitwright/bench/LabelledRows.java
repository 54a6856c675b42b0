package dev.splitwright.bench;

import java.util.Objects;

/**
 * Input rows with their true labels, in one order: {@code rows[i]} in feature order, NaN for a
 * missing value. Arrays are shared, not copied: benchmark state owns them.
 */
record LabelledRows(float[][] rows, int[] labels) {

  LabelledRows {
    Objects.requireNonNull(rows, "rows");
    Objects.requireNonNull(labels, "labels");
    if (rows.length != labels.length) {
      throw new IllegalArgumentException(
          rows.length + " rows but " + labels.length + " labels");
    }
  }

  int size() {
    return rows.length;
  }
}
