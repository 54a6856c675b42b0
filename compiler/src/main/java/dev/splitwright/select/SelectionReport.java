package dev.splitwright.select;

import com.fasterxml.jackson.annotation.JsonIgnore;
import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.annotation.JsonPropertyOrder;
import java.util.List;
import java.util.Objects;

/**
 * The budget search's part of the report ({@code "selection"}). Scores are of the chosen metric on
 * the validation part, or their mean over folds with cross-validation; sizes are in {@code
 * budgetUnit} bytes and measured. Holds nothing that varies between runs, such as timings.
 *
 * @param scoredOn {@code validation} or {@code 5-fold cross-validation} and the like
 * @param refitOn the rows the chosen settings were refitted on: {@code train} or {@code
 *     train+validation}
 * @param kinds the kinds of classifier searched: {@code tree}, {@code forest}, {@code boosted}
 * @param settingsTried pruning-path entries over every depth and leaf-size limit, and ensembles
 * @param distinctTrees distinct candidates measured, each one compiled
 * @param settingsSkipped settings neither built nor measured because a smaller candidate nested in
 *     theirs was already over the budget (see {@code ChainMeasurer}); 0 when all are measured
 * @param smallestSize the smallest candidate's size, the least budget that can be met
 * @param fallbacks one line for each better candidate whose refitted tree broke the budget
 * @param frontier the Pareto-optimal candidates by size, ascending
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
@JsonPropertyOrder({"budget", "budgetUnit", "metric", "scoredOn", "refitOn", "maxDepth",
    "minLeafs", "kinds", "settingsTried", "distinctTrees", "settingsSkipped", "smallestSize",
    "chosen", "fallbacks", "frontier"})
public record SelectionReport(
    int budget,
    String budgetUnit,
    String metric,
    String scoredOn,
    String refitOn,
    int maxDepth,
    List<Integer> minLeafs,
    List<String> kinds,
    int settingsTried,
    int distinctTrees,
    int settingsSkipped,
    int smallestSize,
    Chosen chosen,
    List<String> fallbacks,
    List<Point> frontier) {

  public SelectionReport {
    Objects.requireNonNull(budgetUnit, "budgetUnit");
    Objects.requireNonNull(metric, "metric");
    Objects.requireNonNull(scoredOn, "scoredOn");
    Objects.requireNonNull(refitOn, "refitOn");
    minLeafs = List.copyOf(minLeafs);
    kinds = List.copyOf(kinds);
    Objects.requireNonNull(chosen, "chosen");
    fallbacks = List.copyOf(fallbacks);
    frontier = List.copyOf(frontier);
  }

  /**
   * A candidate's score under the name of what it was scored on: {@code validationScore} on the
   * validation part, {@code crossValidatedScore} (the mean over the folds) with {@code --folds}.
   * Exactly one is present.
   */
  static void checkOneScore(Double validationScore, Double crossValidatedScore) {
    if ((validationScore == null) == (crossValidatedScore == null)) {
      throw new IllegalArgumentException(
          "exactly one of validationScore and crossValidatedScore must be given");
    }
  }

  /**
   * The emitted classifier: its settings, its tree's depth and leaves, the candidate's score (see
   * {@link #checkOneScore}) and the measured sizes of the file written.
   *
   * @param size the emitted classifier's size in the budget's unit
   * @param classFileBytes javac's default debug information: source file and line numbers; null
   *     (left out) for C, as are the other class-file figures and the bytecode
   * @param classFileBytesNoDebug compiled with {@code -g:none}
   * @param classFileBytesFullDebug compiled with {@code -g}, as a default Maven build does
   * @param flashBytes the C object file's flash bytes; null (left out) for Java
   */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  @JsonPropertyOrder({"kind", "trees", "maxDepth", "minLeaf", "alpha", "depth", "leaves",
      "validationScore", "crossValidatedScore", "size", "layout", "classFileBytes",
      "classFileBytesNoDebug", "classFileBytesFullDebug", "bytecodeBytes", "flashBytes",
      "sourceBytes"})
  public record Chosen(String kind, int trees, int maxDepth, int minLeaf, double alpha,
      int depth, int leaves,
      Double validationScore, Double crossValidatedScore, int size, String layout,
      Integer classFileBytes, Integer classFileBytesNoDebug, Integer classFileBytesFullDebug,
      Integer bytecodeBytes, Integer flashBytes, int sourceBytes) {

    public Chosen {
      checkOneScore(validationScore, crossValidatedScore);
    }

    /** The score, whichever it was scored on. */
    @JsonIgnore
    public double score() {
      return validationScore != null ? validationScore : crossValidatedScore;
    }
  }

  /**
   * One frontier candidate: its measured size, score (see {@link #checkOneScore}), shape and
   * settings.
   */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  @JsonPropertyOrder({"size", "validationScore", "crossValidatedScore", "kind", "trees", "depth",
      "leaves", "maxDepth", "minLeaf", "alpha", "chosen"})
  public record Point(int size, Double validationScore, Double crossValidatedScore, String kind,
      int trees, int depth, int leaves, int maxDepth, int minLeaf, double alpha,
      boolean chosen) {

    public Point {
      checkOneScore(validationScore, crossValidatedScore);
    }

    /** The score, whichever it was scored on. */
    @JsonIgnore
    public double score() {
      return validationScore != null ? validationScore : crossValidatedScore;
    }
  }
}
