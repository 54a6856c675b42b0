package dev.splitwright.report;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.annotation.JsonPropertyOrder;
import java.util.List;
import java.util.Map;

/**
 * The report written beside each emitted classifier ({@code <Class>.report.json}). Field order is
 * fixed so two runs on the same input give byte-identical files.
 *
 * @param scores "train", "validation" and "test" as present, in that order
 * @param classFileBytes the class file javac writes with its default debug information
 * @param classFileBytesNoDebug the same source compiled with {@code -g:none}
 * @param dexBytes the DEX file D8 writes for the class alone in release mode at {@code
 *     dexMinApi}; absent, like the three fields after it, unless DEX sizes were asked for
 * @param dexBytesEmptyClass the DEX file of an empty class of the same name, dexed the same way
 * @param dexBytesOverEmptyClass what the classifier adds to the empty class
 * @param dexMinApi the minimum Android API level D8 compiled for
 * @param selection the budget search's record, absent when no budget was given
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
@JsonPropertyOrder({"tool", "data", "dataSha256", "target", "classes", "features", "options",
    "layout", "input", "depth", "leaves", "internalNodes", "root", "sourceBytes", "classFileBytes",
    "classFileBytesNoDebug", "dexBytes", "dexBytesEmptyClass", "dexBytesOverEmptyClass",
    "dexMinApi", "maxMethodBytecodeBytes", "methodByteCap", "constantPoolCount",
    "methods", "scores", "verification", "selection"})
public record CompileReport(
    String tool,
    String data,
    String dataSha256,
    String target,
    List<String> classes,
    List<String> features,
    Map<String, Object> options,
    String layout,
    String input,
    int depth,
    int leaves,
    int internalNodes,
    RootSplit root,
    int sourceBytes,
    int classFileBytes,
    int classFileBytesNoDebug,
    Integer dexBytes,
    Integer dexBytesEmptyClass,
    Integer dexBytesOverEmptyClass,
    Integer dexMinApi,
    int maxMethodBytecodeBytes,
    int methodByteCap,
    int constantPoolCount,
    List<MethodBytes> methods,
    Map<String, PartScores> scores,
    Verification verification,
    Object selection) {

  public CompileReport {
    classes = List.copyOf(classes);
    features = List.copyOf(features);
    methods = List.copyOf(methods);
  }

  /** The root split, or the leaf's class when the tree is a single leaf. */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  public record RootSplit(String feature, Float threshold, List<String> leftCategories,
      String missing, String leafClass) {}

  /** One method of the compiled class and its bytecode length (JVM Specification §4.7.3). */
  public record MethodBytes(String name, int bytecodeBytes) {}

  /** Scores of one part of the data. {@code confusion[actual][predicted]}. */
  @JsonPropertyOrder({"rows", "accuracy", "balancedAccuracy", "macroF1", "confusion",
      "precision", "recall"})
  public record PartScores(int rows, double accuracy, double balancedAccuracy, double macroF1,
      List<List<Integer>> confusion, Map<String, Double> precision, Map<String, Double> recall) {}

  /** What the in-process check of the emitted code found. */
  @JsonPropertyOrder({"passed", "inputsChecked", "mismatches", "branchCoverage", "splitsCovered",
      "splits", "firstMismatches"})
  public record Verification(boolean passed, long inputsChecked, long mismatches,
      double branchCoverage, int splitsCovered, int splits, List<String> firstMismatches) {}
}
