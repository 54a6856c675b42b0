package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Schema;
import java.util.Arrays;
import java.util.Collections;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * How much one training row of each class counts in impurity, leaf predictions and pruning
 * costs: all rows alike ({@link #none()}), inversely to class frequency ({@link #balanced()}), or
 * given per class label ({@link #of(Map)}). Immutable.
 */
public final class ClassWeights {
  private enum Kind {
    NONE,
    BALANCED,
    EXPLICIT
  }

  private static final ClassWeights NONE = new ClassWeights(Kind.NONE, new TreeMap<>());
  private static final ClassWeights BALANCED = new ClassWeights(Kind.BALANCED, new TreeMap<>());

  private final Kind kind;
  private final SortedMap<String, Double> byLabel;

  private ClassWeights(Kind kind, SortedMap<String, Double> byLabel) {
    this.kind = kind;
    this.byLabel = Collections.unmodifiableSortedMap(byLabel);
  }

  /** Weighs every row 1. */
  public static ClassWeights none() {
    return NONE;
  }

  /**
   * Weighs a row of class {@code c} by {@code n / (k * n_c)}, computed from the training rows: n
   * rows, k classes that occur in them, n_c rows of class c. A class absent from the training rows
   * gets weight 1 (it has no rows to weigh).
   */
  public static ClassWeights balanced() {
    return BALANCED;
  }

  /**
   * Weighs rows by class label; labels not in the map weigh 1. Labels are checked against the
   * schema when the weights are resolved.
   *
   * @throws IllegalArgumentException if a weight is not positive and finite
   */
  public static ClassWeights of(Map<String, Double> weightByLabel) {
    Objects.requireNonNull(weightByLabel, "weightByLabel");
    TreeMap<String, Double> copy = new TreeMap<>();
    for (Map.Entry<String, Double> e : weightByLabel.entrySet()) {
      copy.put(Objects.requireNonNull(e.getKey(), "class label"), e.getValue());
    }
    // Checked in label order, so the first bad weight reported does not depend on hash order.
    for (Map.Entry<String, Double> e : copy.entrySet()) {
      String label = e.getKey();
      Double w = Objects.requireNonNull(e.getValue(), "weight of class '" + label + "'");
      if (!(w > 0) || w.isInfinite()) {
        throw new IllegalArgumentException(
            "weight of class '" + label + "' must be positive and finite, but it is " + w);
      }
    }
    return new ClassWeights(Kind.EXPLICIT, copy);
  }

  /** Resolves the weight of each class of {@code train}'s schema, in class-code order. */
  public double[] resolve(Dataset train) {
    Objects.requireNonNull(train, "train");
    return resolve(train.schema(), train.classCounts());
  }

  /**
   * Resolves the weight of each class, in class-code order, given the training rows per class.
   *
   * @throws IllegalArgumentException if an explicit weight names a label the schema lacks
   */
  public double[] resolve(Schema schema, int[] classCounts) {
    Objects.requireNonNull(schema, "schema");
    Objects.requireNonNull(classCounts, "classCounts");
    int k = schema.classCount();
    if (classCounts.length != k) {
      throw new IllegalArgumentException(
          "expected " + k + " class counts but got " + classCounts.length);
    }
    double[] w = new double[k];
    Arrays.fill(w, 1.0);
    if (kind == Kind.BALANCED) {
      long n = 0;
      int present = 0;
      for (int c : classCounts) {
        n += c;
        present += c > 0 ? 1 : 0;
      }
      for (int c = 0; c < k; c++) {
        if (classCounts[c] > 0) {
          w[c] = (double) n / ((double) present * classCounts[c]);
        }
      }
    } else if (kind == Kind.EXPLICIT) {
      for (Map.Entry<String, Double> e : byLabel.entrySet()) {
        int c = schema.classes().indexOf(e.getKey());
        if (c < 0) {
          throw new IllegalArgumentException("unknown class label '" + e.getKey()
              + "' in class weights; valid labels: " + schema.classes());
        }
        w[c] = e.getValue();
      }
    }
    return w;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof ClassWeights other && kind == other.kind && byLabel.equals(other.byLabel);
  }

  @Override
  public int hashCode() {
    return Objects.hash(kind, byLabel);
  }

  /** Renders {@code none}, {@code balanced} or the labels and weights in label order. */
  @Override
  public String toString() {
    if (kind != Kind.EXPLICIT) {
      return kind.name().toLowerCase(Locale.ROOT);
    }
    StringBuilder sb = new StringBuilder("{");
    for (Map.Entry<String, Double> e : byLabel.entrySet()) {
      if (sb.length() > 1) {
        sb.append(", ");
      }
      sb.append(e.getKey()).append('=').append(e.getValue());
    }
    return sb.append('}').toString();
  }
}
