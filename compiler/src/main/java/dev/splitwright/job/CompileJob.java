package dev.splitwright.job;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadedData;
import dev.splitwright.data.SourcePosition;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.Layout;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.eval.Scores;
import dev.splitwright.eval.SplitParts;
import dev.splitwright.eval.StratifiedSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.persist.ModelFile;
import dev.splitwright.report.CompileReport;
import dev.splitwright.report.ReportJson;
import dev.splitwright.report.TreeSvg;
import dev.splitwright.select.DebugSizes;
import dev.splitwright.select.DexMeter;
import dev.splitwright.select.DexSizes;
import dev.splitwright.select.LayoutChoice;
import dev.splitwright.select.LayoutChooser;
import dev.splitwright.select.SearchProgress;
import dev.splitwright.select.SearchSettings;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.function.UnaryOperator;

/**
 * Runs the main job: load, split, train (or read a saved model), score, emit, verify, and write the
 * classifier and its report only when verification passed.
 */
public final class CompileJob {
  private final Verifier verifier;
  private final UnaryOperator<DecisionTree> emitFrom;

  public CompileJob(Verifier verifier) {
    this(verifier, UnaryOperator.identity());
  }

  /**
   * Test seam: emits code from {@code emitFrom(tree)} but verifies it against {@code tree}, so a
   * test can make verification fail on purpose and see that nothing is written.
   */
  CompileJob(Verifier verifier, UnaryOperator<DecisionTree> emitFrom) {
    this.verifier = Objects.requireNonNull(verifier, "verifier");
    this.emitFrom = Objects.requireNonNull(emitFrom, "emitFrom");
  }

  /**
   * Runs {@code request}.
   *
   * @throws InputException if a file or option is unusable
   * @throws IOException if an output cannot be written (nothing is left half-written)
   */
  public CompileResult run(CompileRequest request) throws InputException, IOException {
    return run(request, Optional.empty(), SearchProgress.none());
  }

  /**
   * Runs {@code request}; with {@code budget}, the tree is the best validated one that fits it
   * (see {@link dev.splitwright.select.BudgetSelection}) and a frontier chart is written too.
   *
   * @throws InputException if a file or option is unusable, or the budget is too small
   * @throws IOException if an output cannot be written (nothing is left half-written)
   */
  public CompileResult run(CompileRequest request, Optional<SearchSettings> budget,
      SearchProgress progress) throws InputException, IOException {
    OutputTargets targets = OutputTargets.of(request, budget.isPresent());
    targets.check();
    LoadedData loaded = CsvLoader.load(request.data(), request.load());
    TrainingClasses.requireTwo(request.data().toString(), loaded);
    DataChecks.trainingData(request, loaded);
    Parts parts = split(loaded.dataset(), request);
    if (budget.isPresent()) {
      return BudgetRun.run(verifier, request, targets, loaded, parts, budget.get(), progress);
    }
    DecisionTree tree = request.model().isPresent()
        ? ModelFile.read(request.model().get())
        : CartTrainer.train(parts.train(), request.training());
    if (request.model().isPresent() && !tree.schema().equals(loaded.dataset().schema())) {
      throw new InputException(
          SourcePosition.ofFile(String.valueOf(request.model().get().getFileName())),
          "the model's features, target or classes differ from those of "
              + loaded.sourceName(),
          "pass the CSV the model was trained on, or retrain");
    }
    Map<String, Scores> scores = score(tree, parts);
    HeaderInfo header = new HeaderInfo(loaded.sourceName(), loaded.sha256(),
        request.optionsText(), scoreLines(scores));
    // --layout smallest is resolved here: both layouts emitted and compiled, the smaller kept.
    LayoutChoice layout = LayoutChooser.resolve(emitFrom.apply(tree), request.emit(), header,
        verifier.compiler());
    EmittedSource source = layout.source();
    VerificationResult verification = verifier.check(tree, layout.classes(), source,
        layout.options(), parts.all(), request.seed());
    Map<String, Object> options = optionsMap(request);
    if (request.emit().layout() == Layout.SMALLEST) {
      options.put("layoutChoice", layout.describe());
    }
    // D8 is loaded only here, when DEX sizes were asked for.
    Optional<DexSizes> dex = request.dexMinApi().isPresent()
        ? Optional.of(DexMeter.forMinApi(request.dexMinApi().getAsInt())
            .measure(layout.classes(), source.qualifiedName()))
        : Optional.empty();
    CompileReport report = ReportBuilder.build(loaded.sourceName(), loaded.sha256(), tree,
        options, layout.options(), source, verification, DebugSizes.noDebug(source), dex,
        scores, null);
    if (!verification.passed()) {
      return new CompileResult(tree, source, verification, scores, report, List.of());
    }
    List<Path> written = write(targets, request, tree, source, report, Optional.empty());
    return new CompileResult(tree, source, verification, scores, report, written);
  }

  /**
   * Writes the classifier, its report, the frontier chart of a budget search and the model if
   * asked for to {@code targets}: all of them or, on failure, none.
   *
   * @return the files written, in order
   * @throws OutputException if a file cannot be written; nothing was changed then
   */
  static List<Path> write(OutputTargets targets, CompileRequest request, DecisionTree tree,
      EmittedSource source, CompileReport report, Optional<String> frontierSvg)
      throws OutputException {
    if (targets.frontier().isPresent() != frontierSvg.isPresent()) {
      throw new IllegalArgumentException("a frontier chart goes with a budget search alone");
    }
    OutputFiles out = new OutputFiles();
    out.add(targets.source(), source.source());
    out.add(targets.report(), ReportJson.render(report));
    out.add(targets.tree(), TreeSvg.render(tree, request.emit().className()));
    if (targets.frontier().isPresent()) {
      out.add(targets.frontier().get(), frontierSvg.get());
    }
    if (targets.model().isPresent()) {
      out.add(targets.model().get(), ModelFile.toJson(tree, optionsMap(request)));
    }
    out.commit();
    return out.paths();
  }

  /** The rows each part holds; validation and test may be empty. */
  record Parts(Dataset train, Dataset validation, Dataset test) {
    List<Dataset> all() {
      return List.of(train, validation, test);
    }
  }

  private static Parts split(Dataset data, CompileRequest request) throws InputException {
    double[] f = request.fractions();
    if (request.testData().isPresent()) {
      Path testFile = request.testData().get();
      LoadedData testLoaded = CsvLoader.loadWithSchema(testFile, data.schema(), request.load());
      DataChecks.evaluationData(request, testFile, testLoaded);
      Dataset test = testLoaded.dataset();
      double trainShare = f[0] / (f[0] + f[1]);
      SplitParts p =
          StratifiedSplit.split(data, trainShare, 1 - trainShare, 0, request.seed());
      return new Parts(p.train(), p.validation(), test);
    }
    SplitParts p = StratifiedSplit.split(data, f[0], f[1], f[2], request.seed());
    return new Parts(p.train(), p.validation(), p.test());
  }

  static Map<String, Scores> score(DecisionTree tree, Parts parts) {
    Map<String, Scores> scores = new LinkedHashMap<>();
    scores.put("train", Evaluator.score(tree, parts.train()));
    if (parts.validation().rows() > 0) {
      scores.put("validation", Evaluator.score(tree, parts.validation()));
    }
    if (parts.test().rows() > 0) {
      scores.put("test", Evaluator.score(tree, parts.test()));
    }
    return scores;
  }

  static List<String> scoreLines(Map<String, Scores> scores) {
    List<String> lines = new ArrayList<>();
    scores.forEach((part, s) -> lines.add(String.format(Locale.ROOT,
        "%s (%d rows): accuracy %.4f, balanced accuracy %.4f, macro-F1 %.4f",
        part, s.rows(), s.accuracy(), s.balancedAccuracy(), s.macroF1())));
    return lines;
  }

  static Map<String, Object> optionsMap(CompileRequest request) {
    Map<String, Object> options = new LinkedHashMap<>();
    options.put("command", request.optionsText());
    options.put("seed", request.seed());
    return options;
  }
}
