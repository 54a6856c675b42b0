package dev.splitwright.job;

import dev.splitwright.check.CompilationException;
import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadedData;
import dev.splitwright.data.SourcePosition;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.eval.Scores;
import dev.splitwright.eval.SplitParts;
import dev.splitwright.eval.StratifiedSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.persist.ModelFile;
import dev.splitwright.report.CompileReport;
import dev.splitwright.report.ReportJson;
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
    OutputTargets targets = OutputTargets.of(request);
    targets.check();
    LoadedData loaded = CsvLoader.load(request.data(), request.load());
    TrainingClasses.requireTwo(request.data().toString(), loaded);
    Parts parts = split(loaded.dataset(), request);
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
    EmittedSource source = JavaEmitter.emit(emitFrom.apply(tree), request.emit(), header);
    VerificationResult verification =
        verify(tree, source, request.emit(), parts, request.seed(), request.data());
    CompileReport report = ReportBuilder.build(loaded.sourceName(), loaded.sha256(), tree,
        optionsMap(request), request.emit(), source, verification, scores, null);
    if (!verification.passed()) {
      return new CompileResult(tree, source, verification, scores, report, List.of());
    }
    OutputFiles out = new OutputFiles();
    out.add(targets.source(), source.source());
    out.add(targets.report(), ReportJson.render(report));
    if (targets.model().isPresent()) {
      out.add(targets.model().get(), ModelFile.toJson(tree, optionsMap(request)));
    }
    out.commit();
    return new CompileResult(tree, source, verification, scores, report, out.paths());
  }

  private VerificationResult verify(DecisionTree tree, EmittedSource source, EmitOptions emit,
      Parts parts, long seed, Path data) throws InputException {
    try {
      return verifier.verify(tree, source, emit, parts.all(), seed);
    } catch (CompilationException e) {
      if (ClassFileLimits.exceeded(e)) {
        throw ClassFileLimits.tooLarge(data.toString(), tree, e);
      }
      // The emitter made source javac rejects: a bug of ours, not the user's input.
      throw new IllegalStateException("emitted source does not compile:\n" + e.getMessage(), e);
    }
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
      Dataset test = CsvLoader.loadWithSchema(testFile, data.schema(), request.load()).dataset();
      double trainShare = f[0] / (f[0] + f[1]);
      SplitParts p =
          StratifiedSplit.split(data, trainShare, 1 - trainShare, 0, request.seed());
      return new Parts(p.train(), p.validation(), test);
    }
    SplitParts p = StratifiedSplit.split(data, f[0], f[1], f[2], request.seed());
    return new Parts(p.train(), p.validation(), p.test());
  }

  private static Map<String, Scores> score(DecisionTree tree, Parts parts) {
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

  private static Map<String, Object> optionsMap(CompileRequest request) {
    Map<String, Object> options = new LinkedHashMap<>();
    options.put("command", request.optionsText());
    options.put("seed", request.seed());
    return options;
  }
}
