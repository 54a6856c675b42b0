package dev.splitwright.job;

import dev.splitwright.backend.Emission;
import dev.splitwright.backend.JavaLanguage;
import dev.splitwright.backend.OutputLanguage;
import dev.splitwright.backend.OutputText;
import dev.splitwright.backend.SizeFigures;
import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.DataFile;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.FieldLog;
import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadedData;
import dev.splitwright.data.SourcePosition;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.Layout;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.eval.Scores;
import dev.splitwright.eval.SplitParts;
import dev.splitwright.eval.StratifiedSplit;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.persist.ModelFile;
import dev.splitwright.persist.SavedClassifier;
import dev.splitwright.persist.SavedEnsemble;
import dev.splitwright.persist.SavedModel;
import dev.splitwright.report.CompileReport;
import dev.splitwright.report.ReportJson;
import dev.splitwright.report.TreeSvg;
import dev.splitwright.select.SearchProgress;
import dev.splitwright.select.SearchSettings;
import dev.splitwright.text.DecimalText;
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
  /** The part a saved model's scores are filed under: rows it was scored on, never trained on. */
  public static final String SCORED = "scored";

  private final Verifier verifier;
  private final Optional<OutputLanguage<?>> language;
  private final UnaryOperator<Classifier> emitFrom;

  /** A job that emits Java, as each request's emit options say. */
  public CompileJob(Verifier verifier) {
    this(verifier, UnaryOperator.identity());
  }

  /**
   * A job that emits {@code language}; {@code verifier} still serves the Java budget search.
   */
  public CompileJob(Verifier verifier, OutputLanguage<?> language) {
    this.verifier = Objects.requireNonNull(verifier, "verifier");
    this.language = Optional.of(language);
    this.emitFrom = UnaryOperator.identity();
  }

  /**
   * Test seam: emits code from {@code emitFrom(tree)} but verifies it against {@code tree}, so a
   * test can make verification fail on purpose and see that nothing is written.
   */
  CompileJob(Verifier verifier, UnaryOperator<DecisionTree> emitFrom) {
    this(verifier, Optional.empty(), model -> model instanceof DecisionTree tree
        ? emitFrom.apply(tree) : model);
    Objects.requireNonNull(emitFrom, "emitFrom");
  }

  private CompileJob(Verifier verifier, Optional<OutputLanguage<?>> language,
      UnaryOperator<Classifier> emitFrom) {
    this.verifier = Objects.requireNonNull(verifier, "verifier");
    this.language = language;
    this.emitFrom = emitFrom;
  }

  /**
   * Test seam for ensembles: emits {@code alter(ensemble)} in {@code language} (Java when empty)
   * but verifies it against the ensemble trained or read.
   */
  static CompileJob alteringEnsembles(Verifier verifier, Optional<OutputLanguage<?>> language,
      UnaryOperator<TreeEnsemble> alter) {
    Objects.requireNonNull(alter, "alter");
    return new CompileJob(verifier, language, model -> model instanceof TreeEnsemble ensemble
        ? alter.apply(ensemble) : model);
  }

  private OutputLanguage<?> language(CompileRequest request) {
    return language.isPresent() ? language.get()
        : new JavaLanguage(request.emit(), verifier, request.dexMinApi());
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

  /** The data of {@code request}, loaded and checked for training. */
  private static LoadedData load(CompileRequest request) throws InputException {
    LoadedData loaded = CsvLoader.load(request.data(), request.load());
    TrainingClasses.requireTwo(request.data().toString(), loaded);
    DataChecks.trainingData(request, loaded);
    return loaded;
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
    OutputLanguage<?> lang = language(request);
    OutputTargets targets = OutputTargets.of(request, lang, budget.isPresent());
    targets.check();
    if (budget.isPresent() && !lang.budgetUnits().contains(budget.get().unit())) {
      // Before any data is read.
      throw new InputException("budget-unit", "counts " + budget.get().unit().description()
          + ", which --emit " + lang.name() + " does not measure", "use " + String.join(" or ",
              lang.budgetUnits().stream().map(u -> u.optionName()).toList()));
    }
    if (budget.isPresent()) {
      // A search compiles many candidates: worth warming the compiler up while the data loads.
      Runnable stopWarmUp = lang.warmUp();
      try {
        LoadedData loaded = load(request);
        Optional<FieldLog> testLog = testData(loaded.dataset(), request);
        Parts parts = split(loaded.dataset(), request, testLog);
        return BudgetRun.run(lang, request, targets, loaded, testLog, parts, budget.get(),
            progress);
      } finally {
        stopWarmUp.run();
      }
    }
    LoadedData loaded = load(request);
    Optional<FieldLog> testLog = testData(loaded.dataset(), request);
    Optional<SavedClassifier> saved = Optional.empty();
    Classifier tree;
    Map<String, Dataset> scored;
    List<Dataset> verifyOn;
    if (request.model().isPresent()) {
      saved = Optional.of(ModelFile.loadAny(request.model().get()));
      tree = saved.get().classifier();
      if (!tree.schema().equals(loaded.dataset().schema())) {
        throw new InputException(
            SourcePosition.ofFile(String.valueOf(request.model().get().getFileName())),
            "the model's features, target or classes differ from those of "
                + loaded.sourceName(),
            "pass the CSV the model was trained on, or retrain");
      }
      // The model never saw these rows: they are scored as one part, not as a train/test split.
      scored = new LinkedHashMap<>();
      scored.put(SCORED, loaded.dataset());
      testLog.ifPresent(t -> scored.put("test", t.loaded().dataset()));
      verifyOn = List.copyOf(scored.values());
    } else {
      Parts parts = split(loaded.dataset(), request, testLog);
      tree = request.ensemble().isPresent()
          ? request.ensemble().get().train(parts.train(), request.seed(), request.training())
          : CartTrainer.train(parts.train(), request.training());
      scored = parts.named();
      verifyOn = parts.all();
    }
    Map<String, Scores> scores = score(tree, scored);
    HeaderInfo header = new HeaderInfo(loaded.sourceName(), loaded.sha256(),
        request.optionsText(), scoreLines(scores), saved.map(SavedClassifier::trainedOn),
        testLog.map(t -> t.loaded().file()));
    SavedClassifier toSave = saved.orElseGet(() -> saved(tree, loaded.file(),
        optionsMap(request)));
    return emitAndCheck(lang, request, targets, loaded, toSave, testLog, verifyOn, scores,
        header);
  }

  static SavedClassifier saved(Classifier model, DataFile trainedOn,
      Map<String, Object> training) {
    return model instanceof TreeEnsemble ensemble
        ? new SavedEnsemble(ensemble, trainedOn, training)
        : new SavedModel((DecisionTree) model, trainedOn, training);
  }

  /** Emits, verifies and measures the model in {@code lang}; writes all only if it passed. */
  private <E extends Emission> CompileResult emitAndCheck(OutputLanguage<E> lang,
      CompileRequest request, OutputTargets targets, LoadedData loaded, SavedClassifier model,
      Optional<FieldLog> testLog, List<Dataset> verifyOn, Map<String, Scores> scores,
      HeaderInfo header) throws InputException, IOException {
    Classifier tree = model.classifier();
    // --layout smallest is resolved here: both layouts emitted and measured, the smaller kept.
    E emission = lang.emit(emitFrom.apply(tree), header);
    VerificationResult verification = lang.verify(tree, emission, verifyOn, request.seed());
    SizeFigures sizes = lang.measure(emission);
    Map<String, Object> options = optionsMap(request);
    if (request.emit().layout() == Layout.SMALLEST) {
      emission.layoutChoice().ifPresent(choice -> options.put("layoutChoice", choice));
    }
    Optional<DataFile> trainedOn = request.model().isPresent()
        ? Optional.of(model.trainedOn()) : Optional.empty();
    CompileReport report = ReportBuilder.build(loaded.sourceName(), loaded.sha256(), trainedOn,
        testLog, tree, options, lang.name(), emission, sizes, verification,
        lang.verifyingCompiler(), lang.onChipProofs(), scores, null);
    if (!verification.passed()) {
      return new CompileResult(tree, emission, sizes, verification, scores, report, List.of());
    }
    List<Path> written = write(targets, request, model, emission.files(), report,
        Optional.empty());
    return new CompileResult(tree, emission, sizes, verification, scores, report, written);
  }

  /**
   * Writes the classifier, its report, the frontier chart of a budget search and the model if
   * asked for to {@code targets}: all of them or, on failure, none.
   *
   * @return the files written, in order
   * @throws OutputException if a file cannot be written; nothing was changed then
   */
  static List<Path> write(OutputTargets targets, CompileRequest request, SavedClassifier model,
      List<OutputText> files, CompileReport report, Optional<String> frontierSvg)
      throws OutputException {
    if (targets.frontier().isPresent() != frontierSvg.isPresent()) {
      throw new IllegalArgumentException("a frontier chart goes with a budget search alone");
    }
    OutputFiles out = new OutputFiles();
    if (files.size() != targets.sources().size()) {
      throw new IllegalArgumentException("emitted " + files.size() + " files, planned "
          + targets.sources().size());
    }
    for (int i = 0; i < files.size(); i++) {
      out.add(targets.sources().get(i), files.get(i).text());
    }
    out.add(targets.report(), ReportJson.render(report));
    out.add(targets.tree(), treeSvg(model.classifier(), request.emit().className()));
    if (targets.frontier().isPresent()) {
      out.add(targets.frontier().get(), frontierSvg.get());
    }
    if (targets.model().isPresent()) {
      out.add(targets.model().get(), ModelFile.toJson(model));
    }
    out.commit();
    return out.paths();
  }

  /**
   * The tree picture: the tree, or an ensemble's first tree titled as such (one deterministic
   * picture; the report lists every tree's depth and leaves).
   */
  private static String treeSvg(Classifier model, String className) {
    if (model instanceof TreeEnsemble ensemble) {
      return TreeSvg.render(ensemble.trees().get(0), className + ": tree 0 of "
          + ensemble.treeCount() + " (" + ensemble.kind().fileName() + ")");
    }
    return TreeSvg.render((DecisionTree) model, className);
  }

  /** The rows each part holds; validation and test may be empty. */
  record Parts(Dataset train, Dataset validation, Dataset test) {
    List<Dataset> all() {
      return List.of(train, validation, test);
    }

    /** The parts that hold rows, by name: train, then validation and test if not empty. */
    Map<String, Dataset> named() {
      Map<String, Dataset> named = new LinkedHashMap<>();
      named.put("train", train);
      if (validation.rows() > 0) {
        named.put("validation", validation);
      }
      if (test.rows() > 0) {
        named.put("test", test);
      }
      return named;
    }
  }

  /** The {@code --test-data} file, coded with the training schema, with its unseen categories. */
  private static Optional<FieldLog> testData(Dataset data, CompileRequest request)
      throws InputException {
    if (request.testData().isEmpty()) {
      return Optional.empty();
    }
    Path testFile = request.testData().get();
    FieldLog log = CsvLoader.loadFieldLog(testFile, data.schema(), request.load());
    DataChecks.evaluationData(request, testFile, log.loaded());
    return Optional.of(log);
  }

  private static Parts split(Dataset data, CompileRequest request, Optional<FieldLog> testLog) {
    double[] f = request.fractions();
    if (testLog.isPresent()) {
      Dataset test = testLog.get().loaded().dataset();
      double trainShare = f[0] / (f[0] + f[1]);
      SplitParts p =
          StratifiedSplit.split(data, trainShare, 1 - trainShare, 0, request.seed());
      return new Parts(p.train(), p.validation(), test);
    }
    SplitParts p = StratifiedSplit.split(data, f[0], f[1], f[2], request.seed());
    return new Parts(p.train(), p.validation(), p.test());
  }

  static Map<String, Scores> score(Classifier tree, Parts parts) {
    return score(tree, parts.named());
  }

  private static Map<String, Scores> score(Classifier tree, Map<String, Dataset> parts) {
    Map<String, Scores> scores = new LinkedHashMap<>();
    parts.forEach((name, rows) -> scores.put(name, Evaluator.score(tree, rows)));
    return scores;
  }

  static List<String> scoreLines(Map<String, Scores> scores) {
    List<String> lines = new ArrayList<>();
    scores.forEach((part, s) -> lines.add(String.format(Locale.ROOT,
        "%s (%d rows): accuracy %s, balanced accuracy %s, macro-F1 %s",
        part, s.rows(), DecimalText.fixed(s.accuracy(), 4),
        DecimalText.fixed(s.balancedAccuracy(), 4), DecimalText.fixed(s.macroF1(), 4))));
    return lines;
  }

  static Map<String, Object> optionsMap(CompileRequest request) {
    Map<String, Object> options = new LinkedHashMap<>();
    options.put("command", request.optionsText());
    options.put("seed", request.seed());
    return options;
  }
}
