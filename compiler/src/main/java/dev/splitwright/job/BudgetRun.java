package dev.splitwright.job;

import dev.splitwright.backend.Emission;
import dev.splitwright.backend.OutputLanguage;
import dev.splitwright.backend.SizeFigures;
import dev.splitwright.data.FieldLog;
import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadedData;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.Layout;
import dev.splitwright.eval.Scores;
import dev.splitwright.model.Classifier;
import dev.splitwright.persist.SavedClassifier;
import dev.splitwright.report.CompileReport;
import dev.splitwright.report.FrontierSvg;
import dev.splitwright.select.BudgetSelection;
import dev.splitwright.select.SearchProgress;
import dev.splitwright.select.SearchSettings;
import java.io.IOException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The compile job with a byte budget: search in the output language's unit, emit the choice, write
 * it with report and chart. Nothing here knows which language it is.
 */
final class BudgetRun {
  private BudgetRun() {}

  static <E extends Emission> CompileResult run(OutputLanguage<E> lang, CompileRequest request,
      OutputTargets targets, LoadedData loaded, Optional<FieldLog> testLog,
      CompileJob.Parts parts, SearchSettings settings, SearchProgress progress)
      throws InputException, IOException {
    if (request.model().isPresent()) {
      throw new InputException("budget", "cannot be combined with --model: the budget search "
          + "trains its own trees", "leave out --model or --budget");
    }
    BudgetSelection.Outcome<E> outcome = new BudgetSelection<>(settings,
        lang.searchMeter(settings.unit()), progress).run(
            new BudgetSelection.Data(parts.train(), parts.validation(), parts.all(),
                request.seed()),
            header(loaded, testLog, request, placeholderScores(parts)),
            tree -> header(loaded, testLog, request, CompileJob.score(tree, parts)));
    Classifier tree = outcome.model();
    E emission = outcome.emitted();
    Map<String, Scores> scores = CompileJob.score(tree, parts);
    Map<String, Object> options = CompileJob.optionsMap(request);
    if (request.emit().layout() == Layout.SMALLEST) {
      emission.layoutChoice().ifPresent(choice -> options.put("layoutChoice", choice));
    }
    SizeFigures sizes = lang.measure(emission);
    CompileReport report = ReportBuilder.build(loaded.sourceName(), loaded.sha256(),
        Optional.empty(), testLog, tree, options, lang.name(), emission, sizes,
        outcome.verification(), lang.verifyingCompiler(), lang.onChipProofs(), scores,
        outcome.report());
    if (!outcome.verification().passed()) {
      return new CompileResult(tree, emission, sizes, outcome.verification(), scores, report,
          List.of());
    }
    String chart = FrontierSvg.render(FrontierChartBuilder.build(loaded.sourceName(), settings,
        outcome));
    SavedClassifier model = CompileJob.saved(tree, loaded.file(), CompileJob.optionsMap(request));
    List<Path> written = CompileJob.write(targets, request, model, emission.files(), report,
        Optional.of(chart));
    return new CompileResult(tree, emission, sizes, outcome.verification(), scores, report,
        written);
  }

  private static HeaderInfo header(LoadedData loaded, Optional<FieldLog> testLog,
      CompileRequest request, Map<String, Scores> scores) {
    return new HeaderInfo(loaded.sourceName(), loaded.sha256(), request.optionsText(),
        CompileJob.scoreLines(scores), Optional.empty(), testLog.map(t -> t.loaded().file()));
  }

  /**
   * Zero scores with each part's row count: score lines have a fixed width, so candidates emitted
   * with them have sources exactly as long as the final one's, without scoring test rows.
   */
  private static Map<String, Scores> placeholderScores(CompileJob.Parts parts) {
    // The same parts, in the same order, as CompileJob.score reports.
    Map<String, Scores> placeholder = new LinkedHashMap<>();
    placeholder.put("train", zero(parts.train().rows()));
    if (parts.validation().rows() > 0) {
      placeholder.put("validation", zero(parts.validation().rows()));
    }
    if (parts.test().rows() > 0) {
      placeholder.put("test", zero(parts.test().rows()));
    }
    return placeholder;
  }

  private static Scores zero(int rows) {
    return new Scores(rows, 0, 0, 0, List.of(), List.of(), List.of());
  }
}
