package dev.splitwright.job;

import dev.splitwright.backend.Emission;
import dev.splitwright.backend.SizeFigures;
import dev.splitwright.eval.Scores;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.report.CompileReport;
import dev.splitwright.verify.VerificationResult;
import java.nio.file.Path;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The outcome of a compile run. When {@link #verification} did not pass, {@link #written} is empty:
 * nothing was written.
 *
 * @param model the tree or ensemble emitted
 * @param emission the files emitted, in any language
 */
public record CompileResult(
    Classifier model,
    Emission emission,
    SizeFigures sizes,
    VerificationResult verification,
    Map<String, Scores> scores,
    CompileReport report,
    List<Path> written) {

  public CompileResult {
    // Insertion order (train, validation, test) is the order reports and summaries print.
    scores = Collections.unmodifiableMap(new LinkedHashMap<>(scores));
    written = List.copyOf(written);
  }

  /**
   * Returns the single tree emitted.
   *
   * @throws IllegalStateException if the run emitted an ensemble
   */
  public DecisionTree tree() {
    if (model instanceof DecisionTree tree) {
      return tree;
    }
    throw new IllegalStateException("the run emitted " + model + ", not a single tree");
  }
}
