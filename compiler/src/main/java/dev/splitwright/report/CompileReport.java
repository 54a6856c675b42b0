package dev.splitwright.report;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.annotation.JsonPropertyOrder;
import java.util.List;
import java.util.Map;

/**
 * The report written beside each emitted classifier ({@code <Class>.report.json}). Field order is
 * fixed so two runs on the same input give byte-identical files.
 *
 * @param language the language emitted, {@code java} or {@code c}
 * @param trainedOn for a saved model ({@code --model}), the data it was trained on; {@code data}
 *     is then only scored, and its scores are "scored" rather than "train"
 * @param testData the separate test file ({@code --test-data}), absent without one
 * @param scores "train", "validation" and "test" as present, in that order; for a saved model
 *     "scored" and "test"
 * @param classFileBytes the class file javac writes with its default debug information (Java)
 * @param classFileBytesNoDebug the same source compiled with {@code -g:none} (Java)
 * @param dexBytes the DEX file D8 writes for the class alone in release mode at {@code
 *     dexMinApi}; absent, like the three fields after it, unless DEX sizes were asked for
 * @param dexBytesEmptyClass the DEX file of an empty class of the same name, dexed the same way
 * @param dexBytesOverEmptyClass what the classifier adds to the empty class
 * @param dexMinApi the minimum Android API level D8 compiled for
 * @param ensemble the kind and trees of an ensemble, absent for a single tree; then {@code depth}
 *     is the deepest tree's, {@code leaves} and {@code internalNodes} the sums over the trees and
 *     {@code root} the first tree's
 * @param flash the object file's flash bytes (C)
 * @param selection the budget search's record, absent when no budget was given
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
@JsonPropertyOrder({"tool", "language", "data", "dataSha256", "trainedOn", "testData", "target",
    "classes", "features", "options", "layout", "input", "depth", "leaves", "internalNodes", "root",
    "ensemble", "sourceBytes", "classFileBytes", "classFileBytesNoDebug", "dexBytes",
    "dexBytesEmptyClass", "dexBytesOverEmptyClass", "dexMinApi", "maxMethodBytecodeBytes",
    "methodByteCap", "constantPoolCount", "methods", "flash", "scores", "verification",
    "selection"})
public record CompileReport(
    String tool,
    String language,
    String data,
    String dataSha256,
    DataRef trainedOn,
    TestData testData,
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
    Ensemble ensemble,
    int sourceBytes,
    Integer classFileBytes,
    Integer classFileBytesNoDebug,
    Integer dexBytes,
    Integer dexBytesEmptyClass,
    Integer dexBytesOverEmptyClass,
    Integer dexMinApi,
    Integer maxMethodBytecodeBytes,
    Integer methodByteCap,
    Integer constantPoolCount,
    List<MethodBytes> methods,
    Flash flash,
    Map<String, PartScores> scores,
    Verification verification,
    Object selection) {

  public CompileReport {
    classes = List.copyOf(classes);
    features = List.copyOf(features);
    methods = methods == null ? null : List.copyOf(methods);
  }

  /**
   * An ensemble: its kind ({@code forest} or {@code boosted}), how many trees, the float32 sum of
   * the weights, and each tree in combination order.
   */
  @JsonPropertyOrder({"kind", "trees", "totalWeight", "perTree"})
  public record Ensemble(String kind, int trees, float totalWeight, List<TreeShape> perTree) {
    public Ensemble {
      perTree = List.copyOf(perTree);
    }
  }

  /** One tree of an ensemble: depth, leaves, splits and the weight of its vote. */
  @JsonPropertyOrder({"depth", "leaves", "internalNodes", "weight"})
  public record TreeShape(int depth, int leaves, int internalNodes, float weight) {}

  /** A data file: its name, without any directory, and the SHA-256 of its bytes. */
  @JsonPropertyOrder({"name", "sha256"})
  public record DataRef(String name, String sha256) {}

  /**
   * The separate test file and how many of its rows hold a category the training data never
   * showed: the model scores such a value as missing, so those rows test a fallback.
   */
  @JsonPropertyOrder({"name", "sha256", "rows", "rowsWithUnseenCategory"})
  public record TestData(String name, String sha256, long rows, long rowsWithUnseenCategory) {}

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

  /**
   * What the check of the emitted code found.
   *
   * @param compiler the C compiler that built the checked program; absent for Java, which is
   *     checked in this JVM
   * @param onChip the proofs of the same code on emulated Cortex-M cores ({@code --prove-on}), in
   *     the order asked for; absent when none was asked for
   */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  @JsonPropertyOrder({"passed", "compiler", "inputsChecked", "mismatches", "branchCoverage",
      "splitsCovered", "splits", "firstMismatches", "onChip"})
  public record Verification(boolean passed, Compiler compiler, long inputsChecked,
      long mismatches, double branchCoverage, int splitsCovered, int splits,
      List<String> firstMismatches, List<OnChip> onChip) {

    public Verification {
      onChip = onChip == null || onChip.isEmpty() ? null : List.copyOf(onChip);
    }
  }

  /**
   * The emitted C proved on one emulated Cortex-M core: built with a bare-metal harness, run on
   * qemu over the inputs the host check used, every answer compared with the model.
   *
   * @param core the core's name as {@code --prove-on} takes it, e.g. {@code cortex-m0plus}
   * @param board the qemu machine that ran the image, e.g. {@code mps2-an385}
   * @param emulator the first line of {@code qemu-system-arm --version}
   * @param compilerFlags every compiler option of the image, in order
   * @param linkFlags every link option of the image, after the sources
   * @param instructions instructions per classify call as the emulator counted them
   */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  @JsonPropertyOrder({"core", "board", "emulator", "compilerFlags", "linkFlags", "inputsChecked",
      "mismatches", "instructions"})
  public record OnChip(String core, String board, String emulator, List<String> compilerFlags,
      List<String> linkFlags, int inputsChecked, int mismatches, Instructions instructions) {

    public OnChip {
      compilerFlags = List.copyOf(compilerFlags);
      linkFlags = List.copyOf(linkFlags);
    }
  }

  /**
   * Instructions one classify call executes on an emulated core, over every input checked.
   *
   * @param best the fewest of one call
   * @param worst the most of one call
   * @param mean the mean per call
   */
  @JsonPropertyOrder({"best", "worst", "mean"})
  public record Instructions(long best, long worst, double mean) {}

  /**
   * A C compiler as a report names it.
   *
   * @param version the first line it prints for {@code --version}
   */
  @JsonPropertyOrder({"version", "flags"})
  public record Compiler(String version, List<String> flags) {

    public Compiler {
      flags = List.copyOf(flags);
    }
  }

  /**
   * Flash bytes of the object file of the emitted C, read from its ELF section and symbol tables.
   *
   * @param compiler the first line of the measuring compiler's {@code --version}
   * @param sections bytes of each allocated {@code .text*}, {@code .rodata*} and {@code .data*}
   *     section, by name
   * @param functions each defined function's {@code st_size}, by name
   * @param layouts with {@code --layout smallest}, the flash bytes of each layout measured
   */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  @JsonPropertyOrder({"compiler", "flags", "totalBytes", "sections", "functions", "layouts"})
  public record Flash(String compiler, List<String> flags, long totalBytes,
      Map<String, Long> sections, Map<String, Long> functions, Map<String, Long> layouts) {

    public Flash {
      flags = List.copyOf(flags);
    }
  }
}
