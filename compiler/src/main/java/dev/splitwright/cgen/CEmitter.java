package dev.splitwright.cgen;

import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.Objects;

/** Emits a trained tree as a C99 header and source file. */
public final class CEmitter {
  private CEmitter() {}

  /**
   * Emits {@code tree} as {@code <base>.h} and {@code <base>.c}. The text is ASCII with {@code
   * \n} line ends and depends only on the arguments.
   *
   * @throws IllegalArgumentException for a schema without features (C99 has no array of length
   *     0, 6.7.5.2)
   */
  public static CSource emit(DecisionTree tree, CEmitOptions options, HeaderInfo header) {
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(options, "options");
    Objects.requireNonNull(header, "header");
    if (tree.schema().featureCount() == 0) {
      throw new IllegalArgumentException("a C classifier needs at least one feature");
    }
    CApi api = CApi.of(tree.schema(), options);
    return new CSource(api.headerName(), CHeaderWriter.write(tree, options, header, api),
        api.sourceName(), CSourceWriter.write(tree, options, header, api));
  }

  /**
   * Emits {@code model}: a tree as {@link #emit(DecisionTree, CEmitOptions, HeaderInfo)} does, an
   * ensemble with each tree a {@code static} function and {@code <base>_classify} combining them
   * by the rule of {@link TreeEnsemble}; that file needs {@code FLT_EVAL_METHOD == 0}.
   *
   * @throws IllegalArgumentException for a schema without features
   */
  public static CSource emit(Classifier model, CEmitOptions options, HeaderInfo header) {
    Objects.requireNonNull(model, "model");
    if (model instanceof DecisionTree tree) {
      return emit(tree, options, header);
    }
    Objects.requireNonNull(options, "options");
    Objects.requireNonNull(header, "header");
    TreeEnsemble ensemble = (TreeEnsemble) model;
    if (ensemble.schema().featureCount() == 0) {
      throw new IllegalArgumentException("a C classifier needs at least one feature");
    }
    CApi api = CApi.of(ensemble.schema(), options);
    return new CSource(api.headerName(), CHeaderWriter.write(ensemble, options, header, api),
        api.sourceName(), CSourceWriter.write(ensemble, options, header, api));
  }
}
