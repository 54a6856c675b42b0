package dev.splitwright.job;

import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadedData;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.eval.Scores;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.persist.ModelFile;
import dev.splitwright.report.CompileReport;
import dev.splitwright.report.ReportJson;
import dev.splitwright.report.TreeSvg;
import dev.splitwright.select.BudgetSelection;
import dev.splitwright.select.SearchProgress;
import dev.splitwright.select.SearchSettings;
import dev.splitwright.verify.Verifier;
import java.io.IOException;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The compile job with a byte budget: search, emit the choice, write it with report and chart. */
final class BudgetRun {
  private BudgetRun() {}

  static CompileResult run(Verifier verifier, CompileRequest request, LoadedData loaded,
      CompileJob.Parts parts, SearchSettings settings, SearchProgress progress)
      throws InputException, IOException {
    if (request.model().isPresent()) {
      throw new InputException("budget", "cannot be combined with --model: the budget search "
          + "trains its own trees", "leave out --model or --budget");
    }
    BudgetSelection.Outcome outcome = new BudgetSelection(settings, request.emit(), verifier,
        progress).run(
            new BudgetSelection.Data(loaded.sourceName(), parts.train(), parts.validation(),
                parts.all(), request.seed()),
            header(loaded, request, placeholderScores(parts)),
            tree -> header(loaded, request, CompileJob.score(tree, parts)));
    DecisionTree tree = outcome.tree();
    Map<String, Scores> scores = CompileJob.score(tree, parts);
    Map<String, Object> options = CompileJob.optionsMap(request);
    CompileReport report = ReportBuilder.build(loaded.sourceName(), loaded.sha256(), tree,
        options, request.emit(), outcome.source(), outcome.verification(), scores,
        outcome.report());
    if (!outcome.verification().passed()) {
      return new CompileResult(tree, outcome.source(), outcome.verification(), scores, report,
          List.of());
    }
    String name = outcome.source().simpleName();
    OutputFiles out = new OutputFiles();
    out.add(request.outDir().resolve(outcome.source().relativePath()), outcome.source().source());
    out.add(request.outDir().resolve(name + ".report.json"), ReportJson.render(report));
    out.add(OutputTargets.treeFile(request.outDir(), name), TreeSvg.render(tree, name));
    out.add(request.outDir().resolve(name + ".frontier.svg"), outcome.frontierSvg());
    if (request.saveModel().isPresent()) {
      out.add(request.saveModel().get(), ModelFile.toJson(tree, options));
    }
    out.commit();
    return new CompileResult(tree, outcome.source(), outcome.verification(), scores, report,
        out.paths());
  }

  private static HeaderInfo header(LoadedData loaded, CompileRequest request,
      Map<String, Scores> scores) {
    return new HeaderInfo(loaded.sourceName(), loaded.sha256(), request.optionsText(),
        CompileJob.scoreLines(scores));
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
