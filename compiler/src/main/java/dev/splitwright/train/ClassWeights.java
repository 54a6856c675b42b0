package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Schema;
import dev.splitwright.text.DecimalText;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.regex.Pattern;

/**
 * How much one training row of each class counts in impurity, leaf predictions and pruning
 * costs: all rows alike ({@link #none()}), inversely to class frequency ({@link
 * #inverseFrequency()}), or given per class label ({@link #of(Map)}). Immutable.
 */
public final class ClassWeights {
  private enum Kind {
    NONE,
    INVERSE_FREQUENCY,
    EXPLICIT
  }

  /** A plain decimal weight: no sign, hex, "NaN", "Infinity" or type suffix as Java would take. */
  private static final Pattern DECIMAL =
      Pattern.compile("([0-9]+(\\.[0-9]*)?|\\.[0-9]+)([eE][+-]?[0-9]+)?");

  private static final ClassWeights NONE = new ClassWeights(Kind.NONE, new TreeMap<>());
  private static final ClassWeights INVERSE_FREQUENCY =
      new ClassWeights(Kind.INVERSE_FREQUENCY, new TreeMap<>());

  /** The spelling of {@link #inverseFrequency()} on the command line and in reports. */
  public static final String INVERSE_FREQUENCY_NAME = "inverse-frequency";

  /** A word another tool uses for these weights; refused with a pointer to our own name. */
  private static final String FOREIGN_NAME = "balanced";

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
   * Gives every class that occurs in the training rows the same total weight, the mean rows per
   * class: a row of a class with {@code c} rows weighs {@code (rows / classes present) / c}, so a
   * class with half the mean count weighs 2 per row. A class absent from the training rows gets
   * weight 1 (it has no rows to weigh).
   */
  public static ClassWeights inverseFrequency() {
    return INVERSE_FREQUENCY;
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

  /**
   * Parses the command-line spelling: {@code inverse-frequency}, {@code none} (either in any
   * case), or
   * comma-separated {@code label=weight} pairs such as {@code fault=5,normal=1}. Labels and weights
   * are trimmed; a label therefore cannot contain {@code ','} or {@code '='} or start or end with
   * a space. Labels are checked against the data later, by {@link #unknownLabels}.
   *
   * @throws IllegalArgumentException if the text is none of these forms, a weight is not a positive
   *     finite decimal, or a label appears twice
   */
  public static ClassWeights parse(String text) {
    Objects.requireNonNull(text, "text");
    String trimmed = text.trim();
    String keyword = trimmed.toLowerCase(Locale.ROOT);
    if (keyword.equals(INVERSE_FREQUENCY_NAME)) {
      return INVERSE_FREQUENCY;
    }
    if (keyword.equals(FOREIGN_NAME)) {
      throw new IllegalArgumentException("'" + trimmed + "' is not a value of ours; for weights "
          + "inverse to class frequency write " + INVERSE_FREQUENCY_NAME);
    }
    if (keyword.equals("none")) {
      return NONE;
    }
    TreeMap<String, Double> weights = new TreeMap<>();
    for (String pair : trimmed.split(",", -1)) {
      int eq = pair.indexOf('=');
      if (eq < 0 || pair.indexOf('=', eq + 1) >= 0) {
        throw new IllegalArgumentException("expected " + INVERSE_FREQUENCY_NAME
            + ", none or label=weight pairs such as "
            + "fault=5,normal=1, but found '" + pair.trim() + "'");
      }
      String label = pair.substring(0, eq).trim();
      String weight = pair.substring(eq + 1).trim();
      if (label.isEmpty()) {
        throw new IllegalArgumentException("class label missing before '=" + weight + "'");
      }
      if (!DECIMAL.matcher(weight).matches()) {
        throw new IllegalArgumentException("weight of class '" + label
            + "' must be a positive decimal number, but it is '" + weight + "'");
      }
      if (weights.put(label, Double.parseDouble(weight)) != null) {
        throw new IllegalArgumentException("class '" + label + "' is given a weight twice");
      }
    }
    return of(weights);
  }

  /**
   * Returns the labels an explicit weight names that are not among {@code classes}, in label
   * order; empty for {@link #none()} and {@link #inverseFrequency()}.
   */
  public List<String> unknownLabels(List<String> classes) {
    Objects.requireNonNull(classes, "classes");
    List<String> unknown = new ArrayList<>();
    for (String label : byLabel.keySet()) {
      if (!classes.contains(label)) {
        unknown.add(label);
      }
    }
    return List.copyOf(unknown);
  }

  /**
   * Renders the spelling {@link #parse} reads: {@code none}, {@code inverse-frequency} or the
   * pairs.
   */
  public String optionText() {
    if (kind != Kind.EXPLICIT) {
      return keyword();
    }
    List<String> pairs = new ArrayList<>();
    byLabel.forEach((label, w) -> pairs.add(label + "=" + DecimalText.shortest(w)));
    return String.join(",", pairs);
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
    if (kind == Kind.INVERSE_FREQUENCY) {
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

  /** Renders {@code none}, {@code inverse-frequency} or the labels and weights in label order. */
  @Override
  public String toString() {
    if (kind != Kind.EXPLICIT) {
      return keyword();
    }
    StringBuilder sb = new StringBuilder("{");
    for (Map.Entry<String, Double> e : byLabel.entrySet()) {
      if (sb.length() > 1) {
        sb.append(", ");
      }
      sb.append(e.getKey()).append('=').append(DecimalText.shortest(e.getValue()));
    }
    return sb.append('}').toString();
  }

  private String keyword() {
    return kind == Kind.NONE ? "none" : INVERSE_FREQUENCY_NAME;
  }
}
