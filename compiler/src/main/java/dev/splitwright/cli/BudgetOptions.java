package dev.splitwright.cli;

import dev.splitwright.backend.Languages;
import dev.splitwright.data.InputException;
import dev.splitwright.eval.Metric;
import dev.splitwright.select.BudgetUnit;
import dev.splitwright.select.ModelKind;
import dev.splitwright.select.SearchSettings;
import dev.splitwright.select.SizeText;
import dev.splitwright.train.TrainingOptions;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import picocli.CommandLine;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;

/** The {@code compile} options of the byte-budget search, mixed into {@link CompileCommand}. */
final class BudgetOptions {
  @Option(names = "--budget", paramLabel = "SIZE",
      description = "Emit the best validated tree whose size fits SIZE bytes: 1500, 2.5KB (1000 "
          + "bytes each), 4KiB (1024 bytes each), 1MiB; units B, KB, KiB, MB, MiB in any case. "
          + "Searches depths 1..--max-depth, leaf sizes from --min-leaf among 1,2,5,10,20 and "
          + "every cost-complexity pruning of each, measuring each candidate compiled; also "
          + "writes <out>/<Class>.frontier.svg.")
  String budget;

  @Option(names = "--budget-unit", paramLabel = "UNIT",
      description = "What --budget counts. Java: the .class file javac writes with --release 17 "
          + "and its default debug info (class, the default), the methods' bytecode, the .java "
          + "file's UTF-8 bytes (source), or the DEX file D8 writes for the class alone in "
          + "release mode at --min-api (dex). C: the flash bytes (.text, .rodata, .data) of the "
          + "object file --cc writes with --cflags (flash, the only one).")
  String unit;

  @Option(names = "--kinds", paramLabel = "KINDS",
      description = "Kinds of classifier the budget search tries, comma-separated: tree (one "
          + "CART tree and its prunings), forest (voting forests, Breiman 2001), boosted (SAMME, "
          + "Zhu et al. 2009); ensembles of 2 to 64 trees (default: all three).")
  String kinds;

  @Option(names = "--metric", defaultValue = "balanced-accuracy",
      paramLabel = "METRIC",
      description = "Validation score the budget search maximises (default: ${DEFAULT-VALUE}).")
  String metric;

  @Option(names = "--folds", paramLabel = "K",
      description = "Score budget candidates by stratified K-fold cross-validation on train and "
          + "validation rows together instead of on the validation rows.")
  Integer folds;

  @Option(names = "--refit-all",
      description = "Refit the budget search's chosen settings on train and validation rows "
          + "together (default: train rows only).")
  boolean refitAll;

  @Option(names = "--measure-all",
      description = "Measure every budget candidate compiled, also those that hold a smaller one "
          + "already over the budget, for a whole frontier chart (slower; the choice is the "
          + "same).")
  boolean measureAll;

  /**
   * The search settings, or empty without {@code --budget}.
   *
   * @throws ParameterException if a value is malformed, or a search option is given without
   *     {@code --budget}
   */
  Optional<SearchSettings> settings(CommandLine cli, TrainingOptions training, long seed,
      String language) {
    if (budget == null) {
      for (String option : List.of("--budget-unit", "--metric", "--folds", "--refit-all",
          "--kinds", "--measure-all")) {
        if (cli.getParseResult().hasMatchedOption(option)) {
          throw bad(cli, option, "only applies together with --budget");
        }
      }
      return Optional.empty();
    }
    int bytes;
    try {
      bytes = SizeText.parse("budget", budget);
    } catch (InputException e) {
      throw bad(cli, "--budget", e.problem() + "; " + e.remedy());
    }
    BudgetUnit budgetUnit = unit(cli, language);
    Metric score = Metric.parse(metric).orElseThrow(() -> bad(cli, "--metric",
        "must be " + Choices.oneOf(Choices.METRICS) + ", but it is '" + metric + "'"));
    if (folds != null && folds < 2) {
      throw bad(cli, "--folds", "must be at least 2, but it is " + folds);
    }
    if (training.maxDepth() > SearchSettings.MAX_DEPTH) {
      throw bad(cli, "--max-depth", "must be at most " + SearchSettings.MAX_DEPTH
          + " with --budget, but it is " + training.maxDepth());
    }
    return Optional.of(SearchSettings.builder(bytes)
        .unit(budgetUnit)
        .metric(score)
        .maxDepth(training.maxDepth())
        .minLeafs(SearchSettings.minLeafsFrom(training.minLeaf()))
        .folds(folds == null ? 0 : folds)
        .refitAll(refitAll)
        .training(training)
        .seed(seed)
        .kinds(kinds(cli))
        .measureAll(measureAll)
        .build());
  }

  private List<ModelKind> kinds(CommandLine cli) {
    if (kinds == null) {
      return List.of(ModelKind.values());
    }
    List<ModelKind> parsed = new ArrayList<>();
    for (String name : kinds.split(",", -1)) {
      ModelKind kind = ModelKind.parse(name).orElseThrow(() -> bad(cli, "--kinds", "must list "
          + "tree, forest or boosted, separated by commas, but it is '" + kinds + "'"));
      if (!parsed.contains(kind)) {
        parsed.add(kind);
      }
    }
    return parsed;
  }

  /**
   * What the budget counts: {@code --budget-unit}, or the language's default.
   *
   * @throws ParameterException if the unit is unknown or not one the language measures
   */
  private BudgetUnit unit(CommandLine cli, String language) {
    List<BudgetUnit> accepted = Languages.budgetUnits(language);
    if (unit == null) {
      return accepted.get(0);
    }
    List<String> names = accepted.stream().map(BudgetUnit::optionName).toList();
    return BudgetUnit.parse(unit).filter(accepted::contains).orElseThrow(() -> bad(cli,
        "--budget-unit", "must be " + Choices.oneOf(names) + " with --emit " + language
            + ", but it is '" + unit + "'"));
  }

  /** Whether a budget is given and counts DEX bytes. */
  boolean countsDex() {
    return budget != null && unit != null
        && BudgetUnit.parse(unit).orElse(null) == BudgetUnit.DEX;
  }

  /** The search options for the reproducing command line, or nothing without a budget. */
  List<String> optionsText(CommandLine cli, String language) {
    List<String> parts = new ArrayList<>();
    if (budget != null) {
      parts.add("--budget " + budget.replaceAll("\\s", ""));
      parts.add("--budget-unit " + unit(cli, language).optionName());
      parts.add("--metric " + metric.strip().toLowerCase(Locale.ROOT));
      parts.add("--kinds " + String.join(",", kinds(cli).stream().sorted()
          .map(ModelKind::optionName).toList()));
      if (folds != null) {
        parts.add("--folds " + folds);
      }
      if (refitAll) {
        parts.add("--refit-all");
      }
      if (measureAll) {
        parts.add("--measure-all");
      }
    }
    return parts;
  }

  private static ParameterException bad(CommandLine cli, String option, String message) {
    return new ParameterException(cli, "option '" + option + "' " + message);
  }
}
