package dev.splitwright.data;

import java.util.Objects;

/**
 * An immutable labelled table held column by column as primitive float32 arrays, so that a million
 * rows cost four bytes a cell and no object per cell. Missing values are NaN; categorical values
 * are their codes.
 */
public final class Dataset {
  private final Schema schema;
  private final float[][] columns;
  private final int[] labels;

  private Dataset(Schema schema, float[][] columns, int[] labels) {
    this.schema = schema;
    this.columns = columns;
    this.labels = labels;
  }

  /**
   * Creates a data set from columns ({@code columns[feature][row]}) and label codes; both are
   * copied.
   *
   * @throws IllegalArgumentException if the shapes disagree or a label is out of range
   */
  public static Dataset of(Schema schema, float[][] columns, int[] labels) {
    Objects.requireNonNull(schema, "schema");
    Objects.requireNonNull(columns, "columns");
    Objects.requireNonNull(labels, "labels");
    if (columns.length != schema.featureCount()) {
      throw new IllegalArgumentException(
          "expected " + schema.featureCount() + " columns but got " + columns.length);
    }
    float[][] copy = new float[columns.length][];
    for (int f = 0; f < columns.length; f++) {
      if (columns[f].length != labels.length) {
        throw new IllegalArgumentException(
            "column " + f + " has " + columns[f].length + " rows, labels have " + labels.length);
      }
      copy[f] = columns[f].clone();
    }
    for (int label : labels) {
      if (label < 0 || label >= schema.classCount()) {
        throw new IllegalArgumentException("label code " + label + " out of range");
      }
    }
    return new Dataset(schema, copy, labels.clone());
  }

  /**
   * Takes ownership of arrays the loader just built, without the copy {@link #of} makes: for a
   * large file that copy would double the peak memory. Validates like {@link #of}.
   */
  static Dataset wrap(Schema schema, float[][] columns, int[] labels) {
    if (columns.length != schema.featureCount()) {
      throw new IllegalArgumentException(
          "expected " + schema.featureCount() + " columns but got " + columns.length);
    }
    for (int f = 0; f < columns.length; f++) {
      if (columns[f].length != labels.length) {
        throw new IllegalArgumentException(
            "column " + f + " has " + columns[f].length + " rows, labels have " + labels.length);
      }
    }
    for (int label : labels) {
      if (label < 0 || label >= schema.classCount()) {
        throw new IllegalArgumentException("label code " + label + " out of range");
      }
    }
    return new Dataset(schema, columns, labels);
  }

  /** Creates a data set from rows ({@code rows[row][feature]}); values are copied. */
  public static Dataset ofRows(Schema schema, float[][] rows, int[] labels) {
    float[][] columns = new float[schema.featureCount()][rows.length];
    for (int r = 0; r < rows.length; r++) {
      if (rows[r].length != schema.featureCount()) {
        throw new IllegalArgumentException("row " + r + " has " + rows[r].length + " values");
      }
      for (int f = 0; f < rows[r].length; f++) {
        columns[f][r] = rows[r][f];
      }
    }
    return new Dataset(schema, columns, labels.clone());
  }

  public Schema schema() {
    return schema;
  }

  public int rows() {
    return labels.length;
  }

  public int featureCount() {
    return columns.length;
  }

  public float value(int row, int feature) {
    return columns[feature][row];
  }

  public int label(int row) {
    return labels[row];
  }

  /** Returns a fresh copy of one row's feature values, in feature order. */
  public float[] row(int row) {
    float[] x = new float[columns.length];
    for (int f = 0; f < columns.length; f++) {
      x[f] = columns[f][row];
    }
    return x;
  }

  /** Returns a fresh copy of one feature column. */
  public float[] column(int feature) {
    return columns[feature].clone();
  }

  /** Returns a fresh copy of the label codes. */
  public int[] labels() {
    return labels.clone();
  }

  /** Returns the rows at {@code rowIndices}, in that order. */
  public Dataset subset(int[] rowIndices) {
    float[][] sub = new float[columns.length][rowIndices.length];
    int[] subLabels = new int[rowIndices.length];
    for (int i = 0; i < rowIndices.length; i++) {
      int r = rowIndices[i];
      subLabels[i] = labels[r];
      for (int f = 0; f < columns.length; f++) {
        sub[f][i] = columns[f][r];
      }
    }
    return new Dataset(schema, sub, subLabels);
  }

  /** Returns this data set's rows followed by {@code other}'s; both must share one schema. */
  public Dataset concat(Dataset other) {
    if (!schema.equals(other.schema)) {
      throw new IllegalArgumentException("cannot concatenate data sets with different schemas");
    }
    int n = rows() + other.rows();
    float[][] joined = new float[columns.length][n];
    for (int f = 0; f < columns.length; f++) {
      System.arraycopy(columns[f], 0, joined[f], 0, rows());
      System.arraycopy(other.columns[f], 0, joined[f], rows(), other.rows());
    }
    int[] joinedLabels = new int[n];
    System.arraycopy(labels, 0, joinedLabels, 0, rows());
    System.arraycopy(other.labels, 0, joinedLabels, rows(), other.rows());
    return new Dataset(schema, joined, joinedLabels);
  }

  /** Counts the rows of each class. */
  public int[] classCounts() {
    int[] counts = new int[schema.classCount()];
    for (int label : labels) {
      counts[label]++;
    }
    return counts;
  }
}
