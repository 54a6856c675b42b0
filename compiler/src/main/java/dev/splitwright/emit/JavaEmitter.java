package dev.splitwright.emit;

import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.Objects;

/** Emits a trained tree or ensemble as one dependency-free Java source file. */
public final class JavaEmitter {
  /**
   * The many-row entry of a single {@code flat} tree with array input, {@code classifyAll(rows,
   * out)}: the rows are walked {@link #BATCH_LANES} side by side. Other classes do not have it.
   */
  public static final String BATCH_METHOD = "classifyAll";

  /** How many rows {@link #BATCH_METHOD} walks side by side; the rest go one at a time. */
  public static final int BATCH_LANES = FlatBatchWriter.LANES;

  /**
   * Bound of {@link #BATCH_METHOD}'s bytecode bytes: a class whose method cap ({@link
   * EmitOptions#maxMethodBytes()}) is below it does not get the method.
   */
  public static final int BATCH_MAX_BYTES = FlatBatchWriter.MAX_BYTES;

  private JavaEmitter() {}

  /**
   * Emits {@code tree} with the given layout and options. {@link Layout#SMALLEST} needs a compiler
   * to measure, so it is resolved by the caller; here it is rejected.
   *
   * @throws EmitLimitException if the options do not fit the tree: named arguments for more than 32
   *     features, or a {@code branches} tree with more constants than a class file holds
   * @throws IllegalArgumentException for {@link Layout#SMALLEST}
   */
  public static EmittedSource emit(DecisionTree tree, EmitOptions options, HeaderInfo header) {
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(options, "options");
    Objects.requireNonNull(header, "header");
    String source = switch (options.layout()) {
      case BRANCHES -> BranchesWriter.write(tree, options, header);
      case TABLE -> TableWriter.write(tree, options, header);
      case FLAT -> FlatWriter.write(tree, options, header);
      case SMALLEST -> throw new IllegalArgumentException(
          "layout 'smallest' is chosen by measuring both layouts; emit each and compare");
    };
    return new EmittedSource(options.qualifiedName(), options.layout(), source);
  }

  /**
   * Emits {@code model}: a single tree as {@link #emit(DecisionTree, EmitOptions, HeaderInfo)}
   * does, an ensemble with each tree in a method of its own ({@code branches}), all trees in one
   * table ({@code table}) or all as complete trees in shared arrays ({@code flat}), combined in
   * {@code classify} by the rule of {@link TreeEnsemble}.
   *
   * @throws EmitLimitException if the options do not fit the model
   * @throws IllegalArgumentException for {@link Layout#SMALLEST}
   */
  public static EmittedSource emit(Classifier model, EmitOptions options, HeaderInfo header) {
    Objects.requireNonNull(model, "model");
    if (model instanceof DecisionTree tree) {
      return emit(tree, options, header);
    }
    Objects.requireNonNull(options, "options");
    Objects.requireNonNull(header, "header");
    TreeEnsemble ensemble = (TreeEnsemble) model;
    String source = switch (options.layout()) {
      case BRANCHES -> BranchesWriter.write(ensemble, options, header);
      case TABLE -> TableWriter.write(ensemble, options, header);
      case FLAT -> FlatWriter.write(ensemble, options, header);
      case SMALLEST -> throw new IllegalArgumentException(
          "layout 'smallest' is chosen by measuring both layouts; emit each and compare");
    };
    return new EmittedSource(options.qualifiedName(), options.layout(), source);
  }
}
