package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.splitwright.demo.DemoFiles;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import javax.tools.ToolProvider;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

/** The budget search through the real command line, {@link Main#run}. */
class BudgetCommandTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  /** Groups: budget, least size, size with --bare (fits), least budget, size with --bare. */
  private static final Pattern TOO_SMALL = Pattern.compile("error: option --budget: (\\d+) bytes "
      + "is too small: the smallest classifier for this data \\(1 leaf\\) has a class file size "
      + "of (\\d+) bytes; (?:add --bare \\(no label and feature tables\\), which makes this "
      + "classifier (\\d+) bytes; or )?give --budget (\\d+) or more(?:, or (\\d+) or more with "
      + "--bare \\(no label and feature tables\\))?");

  /** Output of one run. */
  record Run(int exit, String out, String err) {}

  static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int exit = Main.run(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(exit, out.toString(), err.toString());
  }

  static Stream<Arguments> dataSets() throws URISyntaxException {
    // Wisconsin diagnostic breast cancer (UCI, Wolberg, Street and Mangasarian 1995, CC BY 4.0;
    // provenance in src/test/resources/datasets/README.md) and our own seeded pump demo sample.
    Path cancer = Path.of(BudgetCommandTest.class
        .getResource("/datasets/breast-cancer-wisconsin-diagnostic.csv").toURI());
    Path pump = DemoFiles.pump();
    // --bare leaves out the label and feature tables and the length check: smaller classes.
    return Stream.of(
        Arguments.of(cancer, List.of()),
        Arguments.of(pump, List.of("--target", "state")),
        Arguments.of(cancer, List.of("--bare")),
        Arguments.of(pump, List.of("--target", "state", "--bare")));
  }

  @ParameterizedTest(name = "{0} {1}")
  @MethodSource("dataSets")
  void choosesClassifiersThatFitGrowingBudgets(Path data, List<String> extra, @TempDir Path dir)
      throws IOException {
    double previousScore = Double.NEGATIVE_INFINITY;
    boolean fitted = false;
    boolean leastTried = false;
    for (int budget : new int[] {400, 1024, 2048, 4096, 16384}) {
      Path out = dir.resolve("b" + budget);
      Run run = compile(data, extra, budget, out);

      if (run.exit() == 2) {
        // Too small: one line naming the least budget, which must exceed this one; once a
        // budget fits, every larger one must.
        assertThat(fitted).as("budget %d failed after a smaller one fitted", budget).isFalse();
        assertThat(run.err().strip()).doesNotContain("\n");
        Matcher m = TOO_SMALL.matcher(run.err().strip());
        assertThat(m.matches()).as(run.err()).isTrue();
        assertThat(Integer.parseInt(m.group(1))).isEqualTo(budget);
        int least = Integer.parseInt(m.group(4));
        assertThat(Integer.parseInt(m.group(2))).isGreaterThan(budget).isEqualTo(least);
        String bare = m.group(3) != null ? m.group(3) : m.group(5);
        // Without --bare the message measures how small --bare gets, and offers it when it fits.
        assertThat(bare != null).as(run.err()).isEqualTo(!extra.contains("--bare"));
        if (bare != null) {
          assertThat(Integer.parseInt(bare)).isLessThan(least);
          assertThat(m.group(3) != null).isEqualTo(Integer.parseInt(bare) <= budget);
        }
        assertThat(out).doesNotExist();
        if (!leastTried) {
          // The least budget named must itself be enough, by an independent javac recompile.
          leastTried = true;
          Path leastOut = dir.resolve("least");
          Run fits = compile(data, extra, least, leastOut);
          assertThat(fits.exit()).as(fits.err()).isZero();
          assertThat(classFileOnDisk(leastOut.resolve("demo/budget/Fit.java"),
              dir.resolve("javac-least"))).isLessThanOrEqualTo(least);
          if (bare != null) {
            // And the --bare figure is a budget that --bare meets, by the same recompile.
            List<String> withBare = new ArrayList<>(extra);
            withBare.add("--bare");
            Path bareOut = dir.resolve("least-bare");
            Run bareFits = compile(data, withBare, Integer.parseInt(bare), bareOut);
            assertThat(bareFits.exit()).as(bareFits.err()).isZero();
            assertThat(classFileOnDisk(bareOut.resolve("demo/budget/Fit.java"),
                dir.resolve("javac-bare"))).isLessThanOrEqualTo(Integer.parseInt(bare));
          }
        }
        continue;
      }
      assertThat(run.exit()).as(run.err()).isZero();
      fitted = true;
      JsonNode report = JSON.readTree(out.resolve("Fit.report.json").toFile());
      JsonNode selection = report.get("selection");
      int written = classFileOnDisk(out.resolve("demo/budget/Fit.java"), dir.resolve("javac"));
      assertThat(written).as("budget %d", budget).isLessThanOrEqualTo(budget)
          .isEqualTo(selection.get("chosen").get("size").asInt())
          .isEqualTo(report.get("classFileBytes").asInt());
      double score = selection.get("chosen").get("validationScore").asDouble();
      assertThat(score).as("budget %d", budget).isGreaterThanOrEqualTo(previousScore)
          .isEqualTo(report.get("scores").get("validation").get("balancedAccuracy").asDouble());
      previousScore = score;
      checkChosenIsBestOnFrontier(selection, budget);
      assertThat(report.get("scores").get("test").get("rows").asInt()).isPositive();
      assertThat(report.get("scores").get("test").get("balancedAccuracy").asDouble())
          .isBetween(0.0, 1.0);
      assertThat(out.resolve("Fit.frontier.svg")).exists();
    }
    assertThat(fitted).as("some budget up to 16 KiB fits").isTrue();
  }

  private static Run compile(Path data, List<String> extra, int budget, Path out) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", data.toString(),
        "--budget", budget + "B", "--package", "demo.budget", "--class", "Fit", "--out",
        out.toString(), "--quiet"));
    args.addAll(extra);
    return run(args.toArray(new String[0]));
  }

  /**
   * The frontier grows in size and score, and the chosen point is on it: the best-scoring point
   * within the budget, which on a frontier sorted that way is the largest that fits.
   */
  private static void checkChosenIsBestOnFrontier(JsonNode selection, int budget) {
    List<JsonNode> frontier = new ArrayList<>();
    selection.get("frontier").forEach(frontier::add);
    for (int i = 1; i < frontier.size(); i++) {
      assertThat(frontier.get(i).get("size").asInt())
          .isGreaterThan(frontier.get(i - 1).get("size").asInt());
      assertThat(frontier.get(i).get("validationScore").asDouble())
          .isGreaterThan(frontier.get(i - 1).get("validationScore").asDouble());
    }
    JsonNode best = null;
    for (JsonNode point : frontier) {
      if (point.get("size").asInt() <= budget) {
        best = point;
      }
    }
    assertThat(best).as("a frontier point within %d bytes", budget).isNotNull();
    assertThat(best.get("chosen").asBoolean()).as("budget %d", budget).isTrue();
    assertThat(frontier).filteredOn(p -> p.get("chosen").asBoolean()).hasSize(1);
    assertThat(best.get("size").asInt()).isEqualTo(selection.get("chosen").get("size").asInt());
    assertThat(best.get("validationScore").asDouble())
        .isEqualTo(selection.get("chosen").get("validationScore").asDouble());
  }

  @ParameterizedTest(name = "budget \"{0}\"")
  @ValueSource(strings = {"", "2KiB"})
  void everyNoDebugFigureIsTheWrittenSourceCompiledWithGNone(String budget, @TempDir Path dir)
      throws IOException {
    Path out = dir.resolve("out");
    List<String> args = new ArrayList<>(List.of("compile", "--data",
        DemoFiles.pump().toString(), "--target", "state", "--package",
        "demo.size", "--class", "Pump", "--out", out.toString()));
    if (!budget.isEmpty()) {
      args.addAll(List.of("--budget", budget));
    }
    Run run = run(args.toArray(new String[0]));
    assertThat(run.exit()).as(run.err()).isZero();

    // Outside reference: the JDK's own javac run on the file written, with -g:none (no
    // LineNumberTable, LocalVariableTable or SourceFile attributes; javac documentation).
    Path source = out.resolve("demo/size/Pump.java");
    int javacNoDebug = classFileOnDisk(source, dir.resolve("none"), "-g:none");
    int javacDefault = classFileOnDisk(source, dir.resolve("default"));
    Matcher summary = Pattern.compile("class file (\\d+) bytes \\((\\d+) without debug info\\)")
        .matcher(run.out());
    assertThat(summary.find()).as(run.out()).isTrue();
    JsonNode report = JSON.readTree(out.resolve("Pump.report.json").toFile());
    assertThat(Integer.parseInt(summary.group(1))).isEqualTo(javacDefault)
        .isEqualTo(report.get("classFileBytes").asInt());
    assertThat(Integer.parseInt(summary.group(2))).isEqualTo(javacNoDebug)
        .isEqualTo(report.get("classFileBytesNoDebug").asInt());
    assertThat(report.has("classFileBytesWithoutDebug")).isFalse();
    if (!budget.isEmpty()) {
      Matcher line = Pattern.compile("weighs (\\d+) bytes with javac -g:none").matcher(run.out());
      assertThat(line.find()).as(run.out()).isTrue();
      assertThat(Integer.parseInt(line.group(1))).isEqualTo(javacNoDebug);
      assertThat(report.get("selection").get("chosen").get("classFileBytesNoDebug").asInt())
          .isEqualTo(javacNoDebug);
    }
  }

  @Test
  void reportsFrontierAndChoiceOnTheDemo(@TempDir Path dir) throws IOException {
    Run run = run("compile", "--data", CompileCommandTest.PUMP.toString(), "--target",
        "state", "--budget", "2KiB", "--class", "Pump", "--out", dir.toString());

    assertThat(run.exit()).as(run.err()).isZero();
    assertThat(run.out()).contains("budget: 2048 bytes (class); chosen max-depth ");
    JsonNode selection = JSON.readTree(dir.resolve("Pump.report.json").toFile()).get("selection");
    assertThat(selection.get("budget").asInt()).isEqualTo(2048);
    assertThat(selection.get("budgetUnit").asText()).isEqualTo("class");
    assertThat(selection.get("metric").asText()).isEqualTo("balanced-accuracy");
    JsonNode chosen = selection.get("chosen");
    for (String field : List.of("maxDepth", "minLeaf", "alpha", "depth", "leaves", "size",
        "classFileBytesNoDebug", "classFileBytesFullDebug")) {
      assertThat(chosen.has(field)).as(field).isTrue();
    }
    assertThat(chosen.get("classFileBytesNoDebug").asInt())
        .isLessThan(chosen.get("classFileBytes").asInt());
    assertThat(chosen.get("classFileBytesFullDebug").asInt())
        .isGreaterThan(chosen.get("classFileBytes").asInt());
    List<JsonNode> frontier = new ArrayList<>();
    selection.get("frontier").forEach(frontier::add);
    assertThat(frontier).filteredOn(p -> p.get("chosen").asBoolean()).hasSize(1)
        .allMatch(p -> p.get("size").asInt() == chosen.get("size").asInt());
    for (int i = 1; i < frontier.size(); i++) {
      assertThat(frontier.get(i).get("size").asInt())
          .isGreaterThan(frontier.get(i - 1).get("size").asInt());
      assertThat(frontier.get(i).get("validationScore").asDouble())
          .isGreaterThan(frontier.get(i - 1).get("validationScore").asDouble());
    }
    checkConsoleFrontier(run.out(), frontier);
  }

  @Test
  void measureAllMeasuresTheSkippedCandidatesAndChoosesTheSame(@TempDir Path dir)
      throws IOException {
    List<JsonNode> selections = new ArrayList<>();
    List<String> searchLines = new ArrayList<>();
    for (String mode : List.of("lazy", "all")) {
      Path out = dir.resolve(mode);
      List<String> args = new ArrayList<>(List.of("compile", "--data",
          CompileCommandTest.PUMP.toString(), "--target", "state", "--budget", "2KiB",
          "--max-depth", "5", "--class", "Pump", "--out", out.toString()));
      if (mode.equals("all")) {
        args.add("--measure-all");
      }
      Run run = run(args.toArray(new String[0]));
      assertThat(run.exit()).as(run.err()).isZero();
      selections.add(JSON.readTree(out.resolve("Pump.report.json").toFile()).get("selection"));
      searchLines.add(run.out().lines().filter(l -> l.startsWith("search: ")).findFirst()
          .orElseThrow());
    }
    JsonNode lazy = selections.get(0);
    JsonNode all = selections.get(1);
    int skipped = lazy.get("settingsSkipped").asInt();
    assertThat(skipped).isPositive();
    assertThat(all.get("settingsSkipped").asInt()).isZero();
    assertThat(all.get("distinctTrees").asInt()).isGreaterThan(lazy.get("distinctTrees").asInt());
    // The source differs only by the option in its header's command line.
    ObjectNode lazyChosen = lazy.get("chosen").deepCopy();
    ObjectNode allChosen = all.get("chosen").deepCopy();
    assertThat(allChosen.remove("sourceBytes").asInt() - lazyChosen.remove("sourceBytes").asInt())
        .isEqualTo(" --measure-all".length());
    assertThat(allChosen).isEqualTo(lazyChosen);
    assertThat(all.get("settingsTried")).isEqualTo(lazy.get("settingsTried"));
    assertThat(searchLines.get(0))
        .contains("settings (" + skipped + " larger than one already over budget, not measured)");
    assertThat(searchLines.get(1)).doesNotContain("not measured");
  }

  /**
   * The console's frontier table is a run of consecutive report frontier points around the chosen
   * one, each line its size, score and leaves; the {@code wrote} lines come after it, last.
   */
  private static void checkConsoleFrontier(String out, List<JsonNode> frontier) {
    List<String> lines = out.lines().toList();
    int header = -1;
    for (int i = 0; i < lines.size(); i++) {
      if (lines.get(i).startsWith("frontier (size -> validation balanced-accuracy -> leaves")) {
        header = i;
      }
    }
    assertThat(header).as(out).isNotNegative();
    Pattern row = Pattern.compile("  ([> ]) +(\\d+) B  (\\d\\.\\d{4}) +(\\d+) (leaf|leaves)"
        + "(  (?:forest|boosted) of \\d+)?(  chosen|  over budget)?");
    // Groups: chosen mark, size, score, leaves, leaf word, kind of an ensemble, note.
    List<Matcher> rows = new ArrayList<>();
    for (int i = header + 1; i < lines.size() && lines.get(i).startsWith("  ")
        && !lines.get(i).startsWith("  ("); i++) {
      Matcher m = row.matcher(lines.get(i));
      assertThat(m.matches()).as(lines.get(i)).isTrue();
      rows.add(m);
    }
    assertThat(rows).hasSizeBetween(2, BudgetSummary.BELOW + BudgetSummary.ABOVE + 1);
    int first = -1;
    for (int i = 0; i < frontier.size(); i++) {
      if (frontier.get(i).get("size").asInt() == Integer.parseInt(rows.get(0).group(2))) {
        first = i;
      }
    }
    assertThat(first).as("first row is a frontier point").isNotNegative();
    for (int k = 0; k < rows.size(); k++) {
      JsonNode p = frontier.get(first + k);
      Matcher m = rows.get(k);
      assertThat(Integer.parseInt(m.group(2))).isEqualTo(p.get("size").asInt());
      assertThat(Double.parseDouble(m.group(3)))
          .isCloseTo(p.get("validationScore").asDouble(), Offset.offset(5e-5));
      assertThat(Integer.parseInt(m.group(4))).isEqualTo(p.get("leaves").asInt());
      assertThat(m.group(1).equals(">")).isEqualTo(p.get("chosen").asBoolean());
      assertThat(m.group(6)).isEqualTo(p.get("trees").asInt() == 1 ? null
          : "  " + p.get("kind").asText() + " of " + p.get("trees").asInt());
      assertThat("  over budget".equals(m.group(7))).isEqualTo(p.get("size").asInt() > 2048);
    }
    assertThat(rows).anyMatch(m -> m.group(1).equals(">"));
    List<String> wrote = lines.stream().filter(l -> l.startsWith("wrote ")).toList();
    assertThat(wrote).isNotEmpty();
    assertThat(lines.subList(lines.size() - wrote.size(), lines.size())).isEqualTo(wrote);
  }

  @Test
  void foldsStoreTheirScoreUnderACrossValidatedName(@TempDir Path dir) throws IOException {
    // Issue 12 item 9: a mean over folds is not a validation score, so it must not be named one.
    Run run = run("compile", "--data", CompileCommandTest.PUMP.toString(), "--target",
        "state", "--budget", "2KiB", "--max-depth", "3", "--folds", "3", "--class", "Pump",
        "--out", dir.toString());

    assertThat(run.exit()).as(run.err()).isZero();
    JsonNode selection = JSON.readTree(dir.resolve("Pump.report.json").toFile()).get("selection");
    assertThat(selection.get("scoredOn").asText())
        .isEqualTo("3-fold cross-validation of train+validation");
    List<JsonNode> scored = new ArrayList<>();
    scored.add(selection.get("chosen"));
    selection.get("frontier").forEach(scored::add);
    for (JsonNode node : scored) {
      assertThat(node.has("validationScore")).as(node.toString()).isFalse();
      assertThat(node.get("crossValidatedScore").asDouble()).isBetween(0.0, 1.0);
    }
  }

  @ParameterizedTest
  @ValueSource(strings = {"abc", "-1", "4 XB", "0", "99999999999KiB", "1e3"})
  void malformedBudgetExitsTwoWithOneLineNamingTheOption(String size, @TempDir Path dir) {
    Run run = run("compile", "--data", CompileCommandTest.PUMP.toString(), "--budget",
        size, "--class", "Pump", "--out", dir.toString());

    assertThat(run.exit()).isEqualTo(2);
    assertThat(run.err().strip()).doesNotContain("\n")
        .startsWith("error: option '--budget' ")
        .endsWith("(see 'splitwright compile --help')");
    assertThat(run.out()).isEmpty();
  }

  @Test
  void searchOptionsNeedABudget(@TempDir Path dir) {
    for (String[] option : new String[][] {{"--folds", "5"}, {"--refit-all"}, {"--measure-all"},
        {"--budget-unit", "source"}, {"--metric", "accuracy"}}) {
      List<String> args = new ArrayList<>(List.of("compile", "--data",
          CompileCommandTest.PUMP.toString(), "--class", "Pump", "--out",
          dir.toString()));
      args.addAll(List.of(option));
      Run run = run(args.toArray(new String[0]));
      assertThat(run.exit()).isEqualTo(2);
      assertThat(run.err().strip()).isEqualTo("error: option '" + option[0]
          + "' only applies together with --budget (see 'splitwright compile --help')");
    }
  }

  @Test
  void rejectsBadSearchValues(@TempDir Path dir) {
    String[][] cases = {
        {"--folds", "1", "option '--folds' must be at least 2, but it is 1"},
        {"--budget-unit", "bits", "option '--budget-unit' must be class, bytecode, source or dex "
            + "with --emit java, but it is 'bits'"},
        {"--budget-unit", "flash", "option '--budget-unit' must be class, bytecode, source or dex "
            + "with --emit java, but it is 'flash'"},
        {"--metric", "f2", "option '--metric' must be accuracy, balanced-accuracy or macro-f1, but "
            + "it is 'f2'"}};
    for (String[] c : cases) {
      Run run = run("compile", "--data", CompileCommandTest.PUMP.toString(),
          "--budget", "4KiB", c[0], c[1], "--class", "Pump", "--out", dir.toString());
      assertThat(run.exit()).isEqualTo(2);
      assertThat(run.err().strip())
          .isEqualTo("error: " + c[2] + " (see 'splitwright compile --help')");
    }
  }

  /** Compiles {@code source} with the system javac as a user's build would; returns the size. */
  static int classFileOnDisk(Path source, Path out, String... flags) throws IOException {
    Files.createDirectories(out);
    List<String> args = new ArrayList<>(List.of("--release", "17", "-encoding", "UTF-8"));
    args.addAll(List.of(flags));
    args.addAll(List.of("-d", out.toString(), source.toString()));
    int status = ToolProvider.getSystemJavaCompiler().run(null, null, null,
        args.toArray(new String[0]));
    assertThat(status).isZero();
    String name = source.getFileName().toString().replace(".java", ".class");
    try (Stream<Path> files = Files.walk(out)) {
      Path classFile = files.filter(p -> p.getFileName().toString().equals(name)).findFirst()
          .orElseThrow();
      return (int) Files.size(classFile);
    }
  }
}
