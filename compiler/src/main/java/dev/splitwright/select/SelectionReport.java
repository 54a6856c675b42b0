package dev.splitwright.select;

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
 * @param settingsTried pruning-path entries over every depth and leaf-size limit
 * @param distinctTrees candidates left after removing equal trees, each one compiled
 * @param smallestSize the smallest candidate's size, the least budget that can be met
 * @param fallbacks one line for each better candidate whose refitted tree broke the budget
 * @param frontier the Pareto-optimal candidates by size, ascending
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
@JsonPropertyOrder({"budget", "budgetUnit", "metric", "scoredOn", "refitOn", "maxDepth",
    "minLeafs", "settingsTried", "distinctTrees", "smallestSize", "chosen", "fallbacks",
    "frontier"})
public record SelectionReport(
    int budget,
    String budgetUnit,
    String metric,
    String scoredOn,
    String refitOn,
    int maxDepth,
    List<Integer> minLeafs,
    int settingsTried,
    int distinctTrees,
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
    Objects.requireNonNull(chosen, "chosen");
    fallbacks = List.copyOf(fallbacks);
    frontier = List.copyOf(frontier);
  }

  /**
   * The emitted classifier: its settings, its tree's depth and leaves, the candidate's validation
   * score and the measured sizes of the file written.
   *
   * @param size the emitted classifier's size in the budget's unit
   * @param classFileBytes javac's default debug information: source file and line numbers
   * @param classFileBytesNoDebug compiled with {@code -g:none}
   * @param classFileBytesFullDebug compiled with {@code -g}, as a default Maven build does
   */
  @JsonPropertyOrder({"maxDepth", "minLeaf", "alpha", "depth", "leaves", "validationScore",
      "size", "layout", "classFileBytes", "classFileBytesNoDebug", "classFileBytesFullDebug",
      "bytecodeBytes", "sourceBytes"})
  public record Chosen(int maxDepth, int minLeaf, double alpha, int depth, int leaves,
      double validationScore, int size, String layout, int classFileBytes,
      int classFileBytesNoDebug, int classFileBytesFullDebug, int bytecodeBytes,
      int sourceBytes) {}

  /** One frontier candidate: its measured size, score, tree shape and settings. */
  @JsonPropertyOrder({"size", "validationScore", "depth", "leaves", "maxDepth", "minLeaf",
      "alpha", "chosen"})
  public record Point(int size, double validationScore, int depth, int leaves, int maxDepth,
      int minLeaf, double alpha, boolean chosen) {}
}
