package dev.splitwright.job;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.FieldLog;
import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.data.LoadedData;
import dev.splitwright.data.SourcePosition;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.eval.Floor;
import dev.splitwright.eval.Scores;
import dev.splitwright.model.Classifier;
import dev.splitwright.persist.ModelFile;
import dev.splitwright.persist.SavedClassifier;
import dev.splitwright.report.CompileReport;
import dev.splitwright.report.FieldCheckReport;
import dev.splitwright.report.ReportJson;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Scores a saved model on a field log: loads the model, loads the log with the model's schema (a
 * category it never saw is scored as missing, as the emitted code would route it), scores every
 * row with the model's own prediction, checks the floors and writes the report.
 */
public final class FieldCheck {
  static final String OPTION_REPORT = "report";

  private FieldCheck() {}

  /**
   * What to check.
   *
   * @param model the {@code --save-model} file
   * @param data the field log: a CSV with the model's feature columns and target
   * @param load only its missing-value tokens apply
   * @param floors the lowest acceptable scores, in option order
   * @param report where to write the JSON report, if anywhere
   */
  public record Request(Path model, Path data, LoadOptions load, List<Floor> floors,
      Optional<Path> report) {
    public Request {
      Objects.requireNonNull(model, "model");
      Objects.requireNonNull(data, "data");
      Objects.requireNonNull(load, "load");
      floors = List.copyOf(floors);
      Objects.requireNonNull(report, "report");
    }
  }

  /** What the check found; {@code written} holds the report's path once it was written. */
  public record Result(Classifier tree, FieldLog log, Scores scores, FieldCheckReport report,
      List<Path> written) {
    public Result {
      Objects.requireNonNull(tree, "tree");
      Objects.requireNonNull(log, "log");
      Objects.requireNonNull(scores, "scores");
      Objects.requireNonNull(report, "report");
      written = List.copyOf(written);
    }

    /** True when every floor was reached. */
    public boolean passed() {
      return report.passed();
    }
  }

  /**
   * Runs the check; the report is written (atomically) whether or not the floors held.
   *
   * @throws InputException if the model, the log or the report location is unusable
   * @throws IOException if the report cannot be written (nothing is left half-written)
   */
  public static Result run(Request request) throws InputException, IOException {
    Objects.requireNonNull(request, "request");
    if (request.report().isPresent()) {
      OutputTargets.checkFile(OPTION_REPORT, request.report().get());
    }
    // Any model file: a single tree or an ensemble is scored the same way.
    SavedClassifier model = ModelFile.loadAny(request.model());
    Classifier tree = model.classifier();
    String modelSha = sha256(request.model());
    FieldLog log = CsvLoader.loadFieldLog(request.data(), tree.schema(), request.load());
    LoadedData loaded = log.loaded();
    Scores scores = Evaluator.score(tree, loaded.dataset());
    List<FieldCheckReport.FloorResult> floors = request.floors().stream()
        .map(f -> new FieldCheckReport.FloorResult(f.metric().optionName(), f.value(),
            scores.get(f.metric()), f.metBy(scores)))
        .toList();
    boolean passed = floors.stream().allMatch(FieldCheckReport.FloorResult::met);
    FieldCheckReport report = new FieldCheckReport(ReportBuilder.TOOL,
        String.valueOf(request.model().getFileName()), modelSha,
        new CompileReport.DataRef(model.trainedOn().name(), model.trainedOn().sha256()),
        loaded.sourceName(),
        loaded.sha256(), tree.schema().target(), tree.schema().classes(),
        log.unseenCategoryRows(), log.missingValueRows(),
        ReportBuilder.partScores(tree.schema(), scores), floors, passed);
    List<Path> written = List.of();
    if (request.report().isPresent()) {
      OutputFiles out = new OutputFiles();
      out.add(request.report().get(), ReportJson.render(report));
      out.commit();
      written = out.paths();
    }
    return new Result(tree, log, scores, report, written);
  }

  private static String sha256(Path file) throws InputException {
    try {
      return HexFormat.of().formatHex(
          MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
    } catch (IOException e) {
      throw new InputException(SourcePosition.ofFile(String.valueOf(file.getFileName())),
          "cannot read the model file (" + e.getMessage() + ")", "check the path and permissions");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every JVM has SHA-256", e);
    }
  }
}
