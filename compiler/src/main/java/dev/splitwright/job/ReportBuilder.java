package dev.splitwright.job;

import dev.splitwright.backend.Emission;
import dev.splitwright.backend.SizeFigures;
import dev.splitwright.data.DataFile;
import dev.splitwright.data.FieldLog;
import dev.splitwright.data.Schema;
import dev.splitwright.eval.Scores;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.model.TreeEnsemble;
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
   * @param language the output language's name
   * @param trainedOn a saved model's training data, when the run scored a model it did not train
   * @param testData the {@code --test-data} file, if one was given
   * @param emission the files emitted, with their layout and input type
   * @param sizes what they weigh
   * @param compiler the C compiler that built the checked program, if any
   * @param selection the budget search's section, or null without a budget
   * @param onChip the proofs on emulated cores, in order; empty when none ran
   */
  static CompileReport build(String dataName, String sha256, Optional<DataFile> trainedOn,
      Optional<FieldLog> testData, Classifier model, Map<String, Object> options,
      String language, Emission emission, SizeFigures sizes,
      VerificationResult verification, Optional<CompileReport.Compiler> compiler,
      List<CompileReport.OnChip> onChip, Map<String, Scores> scores, Object selection) {
    Schema schema = model.schema();
    List<DecisionTree> trees = model instanceof TreeEnsemble e ? e.trees()
        : List.of((DecisionTree) model);
    CompileReport.Ensemble ensemble = model instanceof TreeEnsemble e ? ensemble(e) : null;
    DecisionTree tree = trees.get(0);
    Map<String, CompileReport.PartScores> parts = new LinkedHashMap<>();
    scores.forEach((part, s) -> parts.put(part, partScores(schema, s)));
    CompileReport.DataRef trained = trainedOn
        .map(f -> new CompileReport.DataRef(f.name(), f.sha256())).orElse(null);
    CompileReport.TestData test = testData.map(t -> new CompileReport.TestData(
        t.loaded().sourceName(), t.loaded().sha256(), t.loaded().dataRows(),
        t.unseenCategoryRows())).orElse(null);
    Optional<SizeFigures.JavaFigures> java = sizes.java();
    Optional<DexSizes> dex = java.flatMap(SizeFigures.JavaFigures::dex);
    return new CompileReport(TOOL, language, dataName, sha256, trained, test, schema.target(),
        schema.classes(), schema.featureNames(), options, emission.layout(), emission.input(),
        trees.stream().mapToInt(DecisionTree::depth).max().orElse(0),
        trees.stream().mapToInt(DecisionTree::leafCount).sum(),
        trees.stream().mapToInt(DecisionTree::internalNodeCount).sum(), root(tree), ensemble,
        sizes.sourceBytes(),
        java.map(SizeFigures.JavaFigures::classFileBytes).orElse(null),
        java.map(SizeFigures.JavaFigures::noDebugBytes).orElse(null),
        dex.map(DexSizes::dexBytes).orElse(null), dex.map(DexSizes::emptyClassBytes).orElse(null),
        dex.map(DexSizes::classifierBytes).orElse(null), dex.map(DexSizes::minApi).orElse(null),
        java.map(SizeFigures.JavaFigures::maxMethodBytes).orElse(null),
        java.map(SizeFigures.JavaFigures::methodByteCap).orElse(null),
        java.map(SizeFigures.JavaFigures::constantPoolCount).orElse(null),
        java.map(SizeFigures.JavaFigures::methods).orElse(null), sizes.flash().orElse(null),
        parts,
        new CompileReport.Verification(verification.passed(), compiler.orElse(null),
            verification.inputsChecked(), verification.mismatches(),
            verification.branchCoverage(), verification.coveredSplits(), verification.splits(),
            verification.firstMismatches(), onChip),
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

  private static CompileReport.Ensemble ensemble(TreeEnsemble e) {
    List<CompileReport.TreeShape> shapes = new ArrayList<>();
    for (int t = 0; t < e.treeCount(); t++) {
      DecisionTree tree = e.trees().get(t);
      shapes.add(new CompileReport.TreeShape(tree.depth(), tree.leafCount(),
          tree.internalNodeCount(), e.weight(t)));
    }
    return new CompileReport.Ensemble(e.kind().fileName(), e.treeCount(), e.totalWeight(),
        shapes);
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
