package dev.splitwright.job;

import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.eval.Scores;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.report.CompileReport;
import dev.splitwright.select.DexSizes;
import dev.splitwright.verify.VerificationResult;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/** Assembles the report of a compile run from its parts. */
final class ReportBuilder {
  static final String TOOL = "Splitwright 0.1.0";

  private ReportBuilder() {}

  /**
   * The report of a run.
   *
   * @param noDebugBytes the class file of {@code source} compiled with {@code -g:none}
   * @param dex the DEX sizes of {@code source}'s class, if asked for
   * @param selection the budget search's section, or null without a budget
   */
  static CompileReport build(String dataName, String sha256, DecisionTree tree,
      Map<String, Object> options, EmitOptions emit, EmittedSource source,
      VerificationResult verification, int noDebugBytes, Optional<DexSizes> dex,
      Map<String, Scores> scores, Object selection) {
    Schema schema = tree.schema();
    Map<String, CompileReport.PartScores> parts = new LinkedHashMap<>();
    scores.forEach((part, s) -> parts.put(part, partScores(schema, s)));
    List<CompileReport.MethodBytes> methods = verification.methods().stream()
        .map(m -> new CompileReport.MethodBytes(m.name(), m.codeLength()))
        .toList();
    return new CompileReport(TOOL, dataName, sha256, schema.target(), schema.classes(),
        schema.featureNames(), options, emit.layout().optionName(),
        emit.inputKind().optionName(), tree.depth(), tree.leafCount(), tree.internalNodeCount(),
        root(tree), source.sourceBytes(), verification.classFileBytes(),
        noDebugBytes, dex.map(DexSizes::dexBytes).orElse(null),
        dex.map(DexSizes::emptyClassBytes).orElse(null),
        dex.map(DexSizes::classifierBytes).orElse(null), dex.map(DexSizes::minApi).orElse(null),
        verification.maxMethodBytes(),
        verification.methodByteCap(), verification.constantPoolCount(), methods, parts,
        new CompileReport.Verification(verification.passed(), verification.inputsChecked(),
            verification.mismatches(), verification.branchCoverage(),
            verification.coveredSplits(), verification.splits(), verification.firstMismatches()),
        selection);
  }

  static CompileReport.PartScores partScores(Schema schema, Scores s) {
    Map<String, Double> precision = new LinkedHashMap<>();
    Map<String, Double> recall = new LinkedHashMap<>();
    for (int c = 0; c < schema.classCount(); c++) {
      precision.put(schema.classes().get(c), s.precision().get(c));
      recall.put(schema.classes().get(c), s.recall().get(c));
    }
    return new CompileReport.PartScores(s.rows(), s.accuracy(), s.balancedAccuracy(), s.macroF1(),
        s.confusion(), precision, recall);
  }

  private static CompileReport.RootSplit root(DecisionTree tree) {
    Schema schema = tree.schema();
    if (tree.root() instanceof Leaf leaf) {
      return new CompileReport.RootSplit(null, null, null, null,
          schema.classes().get(leaf.prediction()));
    }
    Split split = (Split) tree.root();
    String feature = schema.feature(split.feature()).name();
    String missing = split.missingLeft() ? "left" : "right";
    if (split instanceof NumericSplit numeric) {
      return new CompileReport.RootSplit(feature, numeric.threshold(), null, missing, null);
    }
    List<String> categories = new ArrayList<>();
    for (int code : ((CategoricalSplit) split).leftCodes().toArray()) {
      categories.add(schema.feature(split.feature()).categories().get(code));
    }
    return new CompileReport.RootSplit(feature, null, categories, missing, null);
  }
}
