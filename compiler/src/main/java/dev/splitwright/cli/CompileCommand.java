package dev.splitwright.cli;

import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.eval.Scores;
import dev.splitwright.job.CompileJob;
import dev.splitwright.job.CompileRequest;
import dev.splitwright.job.CompileResult;
import dev.splitwright.job.EnsembleRequest;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.report.CompileReport;
import dev.splitwright.select.SearchSettings;
import dev.splitwright.select.SelectionReport;
import dev.splitwright.text.DecimalText;
import dev.splitwright.train.ClassWeights;
import dev.splitwright.train.ForestOptions;
import dev.splitwright.train.Impurity;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.IntSummaryStatistics;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/** {@code splitwright compile}: CSV in, verified classifier source and report out. */
@Command(
    name = "compile",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    customSynopsis = "splitwright compile --data FILE --class NAME --out DIR [options]",
    modelTransformer = Choices.Labels.class,
    description = "Trains a CART tree on the CSV (or reads a saved model), emits it as Java, "
        + "checks the compiled code against the model on every row and every threshold boundary, "
        + "and writes <out>/<package path>/<Class>.java, <out>/<Class>.report.json and "
        + "<out>/<Class>.tree.svg only if the check passed.")
final class CompileCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--data", required = true, paramLabel = "FILE",
      description = "Labelled CSV with a header row.")
  Path data;

  @Option(names = "--target", paramLabel = "NAME",
      description = "Column holding the class label (default: the last column).")
  String target;

  @Option(names = "--test-data", paramLabel = "FILE",
      description = "Separate CSV with the same header to test on, instead of a test fraction.")
  Path testData;

  @Option(names = "--missing", paramLabel = "TOKENS", split = ",",
      description = "Cell texts that mean 'missing', besides an empty cell (e.g. NA,?).")
  List<String> missing = new ArrayList<>();

  @Option(names = "--categorical", paramLabel = "COLUMNS", split = ",",
      description = "Columns to treat as categories even if they look numeric.")
  List<String> categorical = new ArrayList<>();

  @Option(names = "--numeric", paramLabel = "COLUMNS", split = ",",
      description = "Columns that must be numeric; a non-number in them is an error.")
  List<String> numeric = new ArrayList<>();

  @Option(names = "--split", paramLabel = "TRAIN,VALIDATION,TEST", defaultValue = "0.6,0.2,0.2",
      description = "Stratified fractions of the rows (default: ${DEFAULT-VALUE}); 1,0,0 trains "
          + "on every row and reports train scores only.")
  String split;

  @Option(names = "--seed", defaultValue = "1", paramLabel = "N",
      description = "Seed of the split and of the random verification inputs "
          + "(default: ${DEFAULT-VALUE}).")
  long seed;

  @Option(names = "--max-depth", defaultValue = "8", paramLabel = "N",
      description = "Most splits on any root-to-leaf path (default: ${DEFAULT-VALUE}).")
  int maxDepth;

  @Option(names = "--max-leaves", paramLabel = "N",
      description = "Most leaves; the tree grows best split first (default: no cap).")
  Integer maxLeaves;

  @Option(names = "--min-leaf", defaultValue = "1", paramLabel = "N",
      description = "Fewest training rows in a leaf (default: ${DEFAULT-VALUE}).")
  int minLeaf;

  @Option(names = "--impurity", defaultValue = "gini", paramLabel = "IMPURITY",
      description = "Split criterion (default: ${DEFAULT-VALUE}).")
  String impurity;

  @Option(names = "--class-weight", defaultValue = "none",
      paramLabel = "inverse-frequency|none|LABEL=W,...",
      description = "How much a training row of each class counts: inverse-frequency (rare "
          + "classes count more, every class the same in total), none, or per label, e.g. "
          + "fault=5,normal=1; unnamed labels weigh 1 (default: ${DEFAULT-VALUE}).")
  String classWeight;

  @Option(names = "--forest", paramLabel = "N",
      description = "Train a voting forest of N trees instead of one tree: each on a bootstrap "
          + "sample of the training rows, splitting on a random subset of features (Breiman "
          + "2001); --max-depth, --min-leaf and --max-leaves limit every tree.")
  Integer forest;

  @Option(names = "--boosted", paramLabel = "N",
      description = "Train up to N trees by multiclass boosting (SAMME, Zhu, Zou, Rosset and "
          + "Hastie 2009) instead of one tree, each vote weighted; keep --max-depth small.")
  Integer boosted;

  @Option(names = "--split-features", paramLabel = "N",
      description = "With --forest: features each split chooses from, drawn at random "
          + "(default: floor(log2 F) + 1 of F features).")
  Integer splitFeatures;

  @Option(names = "--model", paramLabel = "FILE",
      description = "Emit this saved model instead of training; all CSV rows are scored as one "
          + "part, 'scored' (no --split).")
  Path model;

  @Option(names = "--save-model", paramLabel = "FILE",
      description = "Also write the trained model as JSON, naming its training CSV and SHA-256, "
          + "for --model later.")
  Path saveModel;

  @Option(names = "--package", defaultValue = "", paramLabel = "NAME",
      description = "Java package of the emitted class (default: none).")
  String packageName;

  @Option(names = "--class", required = true, paramLabel = "NAME",
      description = "Simple name of the emitted class.")
  String className;

  @Option(names = "--out", required = true, paramLabel = "DIR",
      description = "Directory for the source tree and the report.")
  Path out;

  @Option(names = "--layout", defaultValue = "branches", paramLabel = "LAYOUT",
      description = "Code layout: nested ifs, a packed table walked by a loop (smaller for big "
          + "trees), a complete tree walked without branching on comparisons (steady speed on "
          + "inputs that jump around), or whichever of the first two compiles smaller (default: "
          + "${DEFAULT-VALUE}).")
  String layout;

  @Option(names = "--input", defaultValue = "float", paramLabel = "TYPE",
      description = "Element type of classify's input (default: ${DEFAULT-VALUE}).")
  String input;

  @Option(names = "--int-inputs",
      description = "Same as --input int: classify(int[] x) for raw counts; every numeric cell "
          + "must be a whole number (none missing), else the run stops with exit code 2.")
  boolean intInputs;

  @Option(names = "--named-args",
      description = "Emit classify(float rmsVelocity, float kurtosis, ...) with one parameter per "
          + "feature instead of an array (at most 32 features).")
  boolean namedArgs;

  @Option(names = "--probabilities",
      description = "Also emit classProbabilities(x, out), filling out with the class frequencies "
          + "of the leaf reached.")
  boolean probabilities;

  @Option(names = "--bare",
      description = "Emit only classify (and classProbabilities): no label and feature-name "
          + "tables, accessors or constants, for the tightest size budgets.")
  boolean bare;

  @Option(names = "--max-method-bytes", defaultValue = "8000", paramLabel = "N",
      description = "Largest bytecode of one method; HotSpot does not JIT-compile methods over "
          + "8000 bytes by default (default: ${DEFAULT-VALUE}).")
  int maxMethodBytes;

  @Mixin BudgetOptions budgetOptions = new BudgetOptions();

  @Mixin LanguageOptions languageOptions = new LanguageOptions();
  @Mixin DexOptions dexOptions = new DexOptions();

  @Option(names = "--quiet", description = "Print nothing on success.")
  boolean quiet;

  @Option(names = "--debug", description = "Print stack traces of errors.")
  boolean debug;

  @Override
  public Integer call() throws Exception {
    languageOptions.checkOptions(spec.commandLine());
    CompileRequest request = request();
    ShortRunJit.forData(request.data());
    PrintWriter stdout = spec.commandLine().getOut();
    PrintWriter stderr = spec.commandLine().getErr();
    Optional<SearchSettings> budget =
        budgetOptions.settings(spec.commandLine(), request.training(), seed,
            languageOptions.name(spec.commandLine()));
    ProgressBar progress = ProgressBar.forTerminal(stderr, quiet);
    Verifier verifier = Verifier.create();
    CompileResult result = new CompileJob(verifier,
        languageOptions.language(spec.commandLine(), request.emit(), request.dexMinApi(),
            verifier))
        .run(request, budget, progress);
    VerificationResult v = result.verification();
    if (!v.passed()) {
      stderr.println(ErrorHandlers.PREFIX + "verification failed, nothing written: " + v.verdict()
          + advice(v));
      return ExitCodes.VERIFICATION_FAILED;
    }
    if (!quiet) {
      // What was chosen first, then the search, and the files written last.
      Summary.print(stdout, result);
      if (result.report().selection() instanceof SelectionReport selection) {
        BudgetSummary.print(stdout, selection, progress.stats());
      }
      Summary.written(stdout, result);
    }
    return ExitCodes.OK;
  }

  /** What to do about a failed verification; a disagreement is our bug, a size cap is not. */
  private static String advice(VerificationResult v) {
    if (v.mismatches() > 0) {
      return "; please report this with the data and options";
    }
    if (v.maxMethodBytes() > v.methodByteCap()) {
      return "; raise --max-method-bytes (at most 65535), or use fewer feature columns and classes";
    }
    return "";
  }

  private CompileRequest request() throws InputException {
    JavaNames.checkPackage(packageName);
    JavaNames.checkClass(className);
    double[] fractions = Fractions.parse(spec.commandLine(), "--split", split);
    Impurity criterion = Choices.impurity(impurity).orElseThrow(() -> bad("--impurity",
        "must be " + Choices.oneOf(Choices.IMPURITIES) + ", but it is '" + impurity + "'"));
    ClassWeights weights = classWeights();
    if (intInputs) {
      if (spec.commandLine().getParseResult().hasMatchedOption("--input")
          && !input.trim().equalsIgnoreCase("int")) {
        throw bad("--int-inputs", "contradicts --input " + input);
      }
      input = "int";
    }
    // Every value is checked above or here, each failure naming its own option, so the builders
    // below cannot reject one; if they did, it would be a bug of ours, reported as such.
    TrainingOptions.Builder t = TrainingOptions.builder()
        .impurity(criterion)
        .maxDepth(check("--max-depth", maxDepth, 1, Limits.MAX_DEPTH))
        .minLeaf(check("--min-leaf", minLeaf, 1))
        .weights(weights);
    if (maxLeaves != null) {
      t.maxLeaves(check("--max-leaves", maxLeaves, 2));
    }
    TrainingOptions training = t.build();
    Optional<EnsembleRequest> ensemble = ensemble();
    EmitOptions emit = EmitOptions.builder(packageName, className)
        .layout(Layout.parse(layout).orElseThrow(() -> bad("--layout",
            "must be " + Choices.oneOf(Choices.LAYOUTS) + ", but it is '" + layout + "'")))
        .inputKind(InputKind.parse(input).orElseThrow(() -> bad("--input",
            "must be " + Choices.oneOf(Choices.INPUTS) + ", but it is '" + input + "'")))
        .maxMethodBytes(methodCap())
        .namedArgs(namedArgs)
        .probabilities(probabilities)
        .bare(bare)
        .build();
    OptionalInt dexMinApi = dexOptions.minApi(spec.commandLine(), budgetOptions.countsDex());
    LoadOptions load = LoadOptions.builder()
        .target(target)
        .missingTokens(missing)
        .categoricalColumns(categorical)
        .numericColumns(numeric)
        .build();
    return new CompileRequest(data, Optional.ofNullable(testData), Optional.ofNullable(model),
        load, fractions, seed, training, emit, out, Optional.ofNullable(saveModel),
        optionsText(dexMinApi), dexMinApi, ensemble);
  }

  /** {@code --forest} or {@code --boosted}, checked against the options they exclude. */
  private Optional<EnsembleRequest> ensemble() {
    if (forest != null && boosted != null) {
      throw bad("--boosted", "cannot be combined with --forest: choose one kind of ensemble");
    }
    if (splitFeatures != null && forest == null) {
      throw bad("--split-features", "needs --forest");
    }
    if (forest == null && boosted == null) {
      return Optional.empty();
    }
    String option = forest != null ? "--forest" : "--boosted";
    if (model != null) {
      throw bad(option, "trains a model, but --model reads one: leave one out");
    }
    if (spec.commandLine().getParseResult().hasMatchedOption("--budget")) {
      throw bad(option, "cannot be combined with --budget yet: the budget search chooses "
          + "single trees");
    }
    int trees = check(option, forest != null ? forest : boosted, 1, TreeEnsemble.MAX_TREES);
    int features = splitFeatures == null ? ForestOptions.AUTOMATIC
        : check("--split-features", splitFeatures, 1);
    return Optional.of(new EnsembleRequest(forest != null ? TreeEnsemble.Kind.FOREST
        : TreeEnsemble.Kind.BOOSTED, trees, features));
  }

  private ClassWeights classWeights() {
    try {
      return ClassWeights.parse(classWeight);
    } catch (IllegalArgumentException e) {
      throw new ParameterException(spec.commandLine(),
          "option '--class-weight': " + e.getMessage());
    }
  }

  /** The JVM's own limit is 65,535 bytes of code (JVM Specification §4.7.3). */
  private int methodCap() {
    if (maxMethodBytes < 256 || maxMethodBytes > EmitOptions.JVM_MAX_METHOD_BYTES) {
      throw bad("--max-method-bytes", "must be between 256 and "
          + EmitOptions.JVM_MAX_METHOD_BYTES + ", but it is " + maxMethodBytes);
    }
    return maxMethodBytes;
  }

  private int check(String option, int value, int least) {
    if (value < least) {
      throw bad(option, "must be at least " + least + ", but it is " + value);
    }
    return value;
  }

  private int check(String option, int value, int least, int most) {
    if (value > most) {
      throw bad(option, "must be at most " + most + ", but it is " + value);
    }
    return check(option, value, least);
  }

  private ParameterException bad(String option, String message) {
    return new ParameterException(spec.commandLine(), "option '" + option + "' " + message);
  }

  /** The options that reproduce this run, without file paths, in a fixed order. */
  private String optionsText(OptionalInt dexMinApi) {
    List<String> parts = new ArrayList<>();
    if (target != null) {
      parts.add("--target " + target);
    }
    if (testData != null) {
      parts.add("--test-data " + testData.getFileName());
    }
    if (!missing.isEmpty()) {
      parts.add("--missing " + String.join(",", missing));
    }
    if (!categorical.isEmpty()) {
      parts.add("--categorical " + String.join(",", categorical));
    }
    if (!numeric.isEmpty()) {
      parts.add("--numeric " + String.join(",", numeric));
    }
    if (model == null) {
      parts.add("--split " + split); // a saved model's run scores every row: there is no split
    }
    parts.add("--seed " + seed);
    if (model != null) {
      parts.add("--model " + model.getFileName());
    } else {
      parts.add("--max-depth " + maxDepth);
      if (maxLeaves != null) {
        parts.add("--max-leaves " + maxLeaves);
      }
      parts.add("--min-leaf " + minLeaf);
      parts.add("--impurity " + impurity.toLowerCase(Locale.ROOT));
      String weights = ClassWeights.parse(classWeight).optionText();
      if (!weights.equals("none")) {
        parts.add("--class-weight " + weights);
      }
      if (forest != null) {
        parts.add("--forest " + forest);
      }
      if (boosted != null) {
        parts.add("--boosted " + boosted);
      }
      if (splitFeatures != null) {
        parts.add("--split-features " + splitFeatures);
      }
    }
    parts.add("--layout " + layout.toLowerCase(Locale.ROOT));
    parts.add("--input " + input.toLowerCase(Locale.ROOT));
    if (!languageOptions.name(spec.commandLine()).equals("c")) {
      parts.add("--max-method-bytes " + maxMethodBytes);
    }
    if (namedArgs) {
      parts.add("--named-args");
    }
    if (probabilities) {
      parts.add("--probabilities");
    }
    if (bare) {
      parts.add("--bare");
    }
    parts.addAll(budgetOptions.optionsText(spec.commandLine(),
        languageOptions.name(spec.commandLine())));
    parts.addAll(languageOptions.optionsText(spec.commandLine()));
    parts.addAll(dexOptions.optionsText(dexMinApi));
    return String.join(" ", parts);
  }

  /** Prints the human summary of a successful run. */
  static final class Summary {
    private Summary() {}

    static void print(PrintWriter out, CompileResult result) {
      VerificationResult v = result.verification();
      if (result.model() instanceof TreeEnsemble ensemble) {
        IntSummaryStatistics depths = ensemble.trees().stream()
            .mapToInt(DecisionTree::depth).summaryStatistics();
        out.printf(Locale.ROOT, "%s: %d trees, depth %d to %d, %d leaves, %d splits%n",
            ensemble.kind().fileName(), ensemble.treeCount(), depths.getMin(), depths.getMax(),
            ensemble.trees().stream().mapToInt(DecisionTree::leafCount).sum(),
            ensemble.trees().stream().mapToInt(DecisionTree::internalNodeCount).sum());
      } else {
        out.printf(Locale.ROOT, "tree: depth %d, %d leaves, %d splits%n",
            result.tree().depth(), result.tree().leafCount(), result.tree().internalNodeCount());
      }
      for (Map.Entry<String, Scores> e : result.scores().entrySet()) {
        Scores s = e.getValue();
        out.printf(Locale.ROOT, "%-10s rows %5d  accuracy %s  balanced accuracy %s  "
            + "macro-F1 %s%n", e.getKey(), s.rows(), DecimalText.fixed(s.accuracy(), 4),
            DecimalText.fixed(s.balancedAccuracy(), 4), DecimalText.fixed(s.macroF1(), 4));
      }
      RecallLine.of(result).ifPresent(out::println);
      CompileReport report = result.report();
      if (report.trainedOn() != null) {
        out.printf(Locale.ROOT, "model trained on %s (SHA-256 %s); %s was only scored%n",
            CheckTable.printable(report.trainedOn().name()), report.trainedOn().sha256(),
            CheckTable.printable(report.data()));
      }
      if (report.testData() != null) {
        out.printf(Locale.ROOT, "test data %s (SHA-256 %s): %d of %d rows with a category the "
            + "training data never showed (scored as missing)%n",
            CheckTable.printable(report.testData().name()), report.testData().sha256(),
            report.testData().rowsWithUnseenCategory(), report.testData().rows());
      }
      Scores validation = result.scores().get("validation");
      if (validation != null) {
        NoisyScores.warning("validation", result.model().schema().classes(), validation)
            .ifPresent(out::println);
      }
      out.println(result.sizes().summary());
      Object choice = result.report().options().get("layoutChoice");
      if (choice != null) {
        out.println("layout: " + choice);
      }
      out.printf(Locale.ROOT, "verified: %d inputs, %d mismatches, branch coverage %s%% "
          + "(%d of %d splits both ways)%n", v.inputsChecked(), v.mismatches(),
          DecimalText.fixed(100 * v.branchCoverage(), 1), v.coveredSplits(), v.splits());
      List<CompileReport.OnChip> onChip = result.report().verification().onChip();
      if (onChip != null) {
        onChip.forEach(proof -> out.println(onChipLine(proof)));
      }
      out.println("emitted: " + result.report().language());
    }

    /**
     * E.g. {@code proved on cortex-m0plus (qemu mps2-an385): 6011 inputs, 0 mismatches,
     * instructions per call 12 to 80, mean 41.7}.
     */
    static String onChipLine(CompileReport.OnChip proof) {
      String line = String.format(Locale.ROOT, "proved on %s (qemu %s): %d inputs, %d mismatches",
          proof.core(), proof.board(), proof.inputsChecked(), proof.mismatches());
      CompileReport.Instructions n = proof.instructions();
      return n == null ? line : String.format(Locale.ROOT, "%s, instructions per call %d to %d, "
          + "mean %s", line, n.best(), n.worst(), DecimalText.fixed(n.mean(), 1));
    }

    static void written(PrintWriter out, CompileResult result) {
      for (java.nio.file.Path p : result.written()) {
        out.println("wrote " + p);
      }
    }
  }
}
