package dev.splitwright.cli;

import dev.splitwright.data.LoadOptions;
import dev.splitwright.eval.Floor;
import dev.splitwright.job.FieldCheck;
import dev.splitwright.report.FieldCheckReport;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/** {@code splitwright check}: scores a saved model on a new labelled log, with optional floors. */
@Command(
    name = "check",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = "Scores a saved model (--save-model of compile) on a labelled CSV of field logs "
        + "with the same columns, prints accuracy, balanced accuracy, macro-F1, per-class "
        + "precision and recall and the confusion matrix, and counts rows with a category the "
        + "model never saw (scored as missing, as the emitted code routes them) and rows with a "
        + "missing value.",
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {"0:scored, and every --floor was reached",
        "2:bad input file or option", "3:internal error (please report it)",
        "4:a score fell below its --floor (the report is still written)"})
final class CheckCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--model", required = true, paramLabel = "FILE",
      description = "Model file written by compile --save-model.")
  Path model;

  @Option(names = "--data", required = true, paramLabel = "FILE",
      description = "Labelled CSV with the model's feature columns and target, in any order.")
  Path data;

  @Option(names = "--missing", paramLabel = "TOKENS", split = ",",
      description = "Cell texts that mean 'missing', besides an empty cell (e.g. NA,?).")
  List<String> missing = new ArrayList<>();

  @Option(names = "--floor", paramLabel = "METRIC=VALUE", split = ",",
      description = "Lowest acceptable score, e.g. balanced-accuracy=0.75; metrics: accuracy, "
          + "balanced-accuracy, macro-f1. Repeatable. A score below its floor (equal passes) "
          + "makes the command exit with code 4.")
  List<String> floors = new ArrayList<>();

  @Option(names = "--report", paramLabel = "FILE",
      description = "Also write the figures, counts and floors as JSON.")
  Path report;

  @Option(names = "--quiet", description = "Print nothing unless a floor is missed.")
  boolean quiet;

  @Option(names = "--debug", description = "Print stack traces of errors.")
  boolean debug;

  @Override
  public Integer call() throws Exception {
    List<Floor> parsed = new ArrayList<>();
    for (String text : floors) {
      try {
        parsed.add(Floor.parse(text));
      } catch (IllegalArgumentException e) {
        throw new ParameterException(spec.commandLine(),
            "option '--floor' " + e.getMessage());
      }
    }
    LoadOptions load = LoadOptions.builder().missingTokens(missing).build();
    FieldCheck.Result result = FieldCheck.run(
        new FieldCheck.Request(model, data, load, parsed, Optional.ofNullable(report)));
    PrintWriter stdout = spec.commandLine().getOut();
    if (!quiet) {
      CheckTable.print(stdout, result);
      result.written().forEach(p -> stdout.println("wrote " + p));
    }
    if (!result.passed()) {
      List<String> missed = new ArrayList<>();
      for (FieldCheckReport.FloorResult f : result.report().floors()) {
        if (!f.met()) {
          missed.add(String.format(Locale.ROOT, "%s %.4f is below its floor %.4f", f.metric(),
              f.value(), f.floor()));
        }
      }
      spec.commandLine().getErr().println("check failed: " + String.join("; ", missed));
      return ExitCodes.BELOW_FLOOR;
    }
    return ExitCodes.OK;
  }
}
