package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.splitwright.data.DataFile;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.persist.ModelFile;
import dev.splitwright.persist.SavedModel;
import dev.splitwright.report.TreeSvg;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CheckCommandTest {
  private static final ObjectMapper JSON = new ObjectMapper();

  /** The training data the hand-built model's file names; made up, as the model is. */
  private static final DataFile HAND_DATA = new DataFile("hand-train.csv", "ab".repeat(32));

  @TempDir Path temp;

  /**
   * temp <= 50 (missing right) ? (mode in {auto} (missing left) ? ok : fault) : fault, with
   * classes [fault, ok] and mode's categories [auto, manual].
   */
  private Path handModel() throws IOException {
    Schema schema = new Schema(List.of(Feature.numeric("temp"),
        Feature.categorical("mode", List.of("auto", "manual"))), "state", List.of("fault", "ok"));
    DecisionTree tree = new DecisionTree(schema, new NumericSplit(0, 50f, false,
        new CategoricalSplit(1, CategoricalSplit.CodeSet.of(0), true,
            new Leaf(1, ClassCounts.of(1, 9)), new Leaf(0, ClassCounts.of(6, 2)),
            ClassCounts.of(7, 11)),
        new Leaf(0, ClassCounts.of(9, 1)), ClassCounts.of(16, 12)));
    Path model = temp.resolve("hand.model.json");
    ModelFile.write(model, new SavedModel(tree, HAND_DATA, Map.of()));
    return model;
  }

  /** Eight rows; what the model predicts for each is worked by hand beside it. */
  private Path handLog() throws IOException {
    return Files.writeString(temp.resolve("field.csv"), String.join("\n",
        "mode,temp,state",   // columns in another order than the model's
        "auto,40,ok",        // left, auto -> ok (right)
        "manual,45,ok",      // left, manual -> fault (wrong)
        "auto,60,fault",     // right -> fault (right)
        "auto,,fault",       // temp missing -> right -> fault (right); a missing value
        "turbo,30,ok",       // left, turbo never seen -> as missing -> left -> ok (right); unseen
        "manual,55,ok",      // right -> fault (wrong)
        "manual,20,fault",   // left, manual -> fault (right)
        "NA,10,fault",       // left, mode missing -> left -> ok (wrong); a missing value
        ""));
  }

  @Test
  void scoresAHandWorkedLog() throws IOException {
    Path report = temp.resolve("check.json");
    CliRun run = CliRun.of("check", "--model", handModel().toString(), "--data",
        handLog().toString(), "--missing", "NA", "--report", report.toString());

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.err()).isEmpty();
    JsonNode json = JSON.readTree(report.toFile());
    JsonNode scores = json.get("scores");
    // Worked by hand from the comments above: confusion[actual][predicted], classes fault, ok:
    // fault rows 3, 4, 7 predicted fault, row 8 ok; ok rows 2, 6 predicted fault, 1, 5 ok.
    assertThat(scores.get("confusion").toString()).isEqualTo("[[3,1],[2,2]]");
    assertThat(scores.get("rows").asInt()).isEqualTo(8);
    // Accuracy 5/8; recall 3/4 and 2/4, so balanced accuracy 5/8; precision 3/5 and 2/3;
    // F1 2/3 and 4/7, so macro-F1 13/21 (worked by hand).
    assertThat(scores.get("accuracy").asDouble()).isCloseTo(5.0 / 8, within(1e-12));
    assertThat(scores.get("balancedAccuracy").asDouble()).isCloseTo(5.0 / 8, within(1e-12));
    assertThat(scores.get("macroF1").asDouble()).isCloseTo(13.0 / 21, within(1e-12));
    assertThat(scores.get("precision").get("fault").asDouble()).isCloseTo(3.0 / 5, within(1e-12));
    assertThat(scores.get("precision").get("ok").asDouble()).isCloseTo(2.0 / 3, within(1e-12));
    assertThat(scores.get("recall").get("fault").asDouble()).isCloseTo(3.0 / 4, within(1e-12));
    assertThat(scores.get("recall").get("ok").asDouble()).isCloseTo(2.0 / 4, within(1e-12));
    assertThat(json.get("rowsWithUnseenCategory").asLong()).isEqualTo(1);
    assertThat(json.get("rowsWithMissingValue").asLong()).isEqualTo(2);
    assertThat(json.get("floors").size()).isZero();
    assertThat(json.get("passed").asBoolean()).isTrue();
    assertThat(json.get("data").asText()).isEqualTo("field.csv");
    // The model's provenance, as its file records it.
    assertThat(json.get("modelTrainedOn").get("name").asText()).isEqualTo("hand-train.csv");
    assertThat(json.get("modelTrainedOn").get("sha256").asText()).isEqualTo("ab".repeat(32));

    // The console shows the same, as aligned tables.
    assertThat(run.out()).contains(
        "model trained on hand-train.csv (SHA-256 " + "ab".repeat(32) + ")",
        "rows with a category the model never saw: 1 (scored as missing)",
        "rows with a missing value: 2",
        "accuracy           0.6250",
        "balanced accuracy  0.6250",
        "macro-F1           0.6190",
        "class  precision  recall  rows\n"
            + "fault     0.6000  0.7500     4\n"
            + "ok        0.6667  0.5000     4\n",
        "       fault  ok\n"
            + "fault      3   1\n"
            + "ok         2   2\n");
  }

  @Test
  void aFloorPassesWhenReachedAndFailsWithExitFourBelowIt() throws IOException {
    Path model = handModel();
    Path log = handLog();
    Path report = temp.resolve("gate.json");

    // Accuracy is exactly 0.625: equal passes.
    CliRun pass = CliRun.of("check", "--model", model.toString(), "--data", log.toString(),
        "--missing", "NA", "--floor", "accuracy=0.625", "--floor", "macro-f1=0.6");
    assertThat(pass.exitCode()).as(pass.err()).isEqualTo(ExitCodes.OK);
    assertThat(pass.out()).contains("floor accuracy 0.6250: 0.6250, met",
        "floor macro-f1 0.6000: 0.6190, met");

    CliRun fail = CliRun.of("check", "--model", model.toString(), "--data", log.toString(),
        "--missing", "NA", "--floor", "accuracy=0.5,balanced-accuracy=0.63", "--report",
        report.toString(), "--quiet");
    assertThat(fail.exitCode()).isEqualTo(4).isEqualTo(ExitCodes.BELOW_FLOOR);
    assertThat(fail.out()).isEmpty();
    assertThat(fail.errLines()).containsExactly(
        "check failed: balanced-accuracy 0.6250 is below its floor 0.6300");
    JsonNode json = JSON.readTree(report.toFile());
    assertThat(json.get("passed").asBoolean()).isFalse();
    assertThat(json.get("floors").toString()).isEqualTo("[{\"metric\":\"accuracy\",\"floor\":0.5,"
        + "\"value\":0.625,\"met\":true},{\"metric\":\"balanced-accuracy\",\"floor\":0.63,"
        + "\"value\":0.625,\"met\":false}]");
  }

  @Test
  void badInputIsOneLineAndExitTwo() throws IOException {
    Path model = handModel();
    Path log = handLog();
    Path wrongColumns = Files.writeString(temp.resolve("wrong.csv"), "temp,speed,state\n1,2,ok\n");
    Path reportDir = Files.createDirectory(temp.resolve("taken"));
    Object[][] cases = {
        {new String[] {"--floor", "precision=0.5"}, "option '--floor' names no metric"},
        {new String[] {"--floor", "accuracy=1.5"},
            "option '--floor' needs a number between 0 and 1"},
        {new String[] {"--floor", "accuracy=NaN"},
            "option '--floor' needs a number between 0 and 1"},
        {new String[] {"--floor", "accuracy"}, "option '--floor' must be METRIC=VALUE"},
        {new String[] {"--report", reportDir.toString()}, "a directory of that name exists"},
    };
    for (Object[] c : cases) {
      String[] extra = (String[]) c[0];
      String[] args = new String[6 + extra.length];
      System.arraycopy(new String[] {"check", "--model", model.toString(), "--data",
          log.toString(), "--missing=NA"}, 0, args, 0, 6);
      System.arraycopy(extra, 0, args, 6, extra.length);
      CliRun run = CliRun.of(args);
      assertThat(run.exitCode()).as(run.err()).isEqualTo(2);
      assertThat(run.errLines()).as(String.join(" ", extra)).hasSize(1);
      assertThat(run.err()).contains((String) c[1]).doesNotContain("Exception");
    }
    CliRun noModel = CliRun.of("check", "--model", temp.resolve("none.json").toString(),
        "--data", log.toString());
    assertThat(noModel.exitCode()).isEqualTo(2);
    assertThat(noModel.errLines()).hasSize(1);
    assertThat(noModel.err()).contains("none.json").contains("cannot read the model file");

    CliRun columns = CliRun.of("check", "--model", model.toString(), "--data",
        wrongColumns.toString());
    assertThat(columns.exitCode()).isEqualTo(2);
    assertThat(columns.errLines()).hasSize(1);
    assertThat(columns.err()).contains("wrong.csv:1").contains("missing column 'mode'");
    assertThat(Files.list(temp).map(p -> p.getFileName().toString()))
        .containsExactlyInAnyOrder("hand.model.json", "field.csv", "wrong.csv", "taken");
  }

  @Test
  void agreesExactlyWithTheCompileCommandsTestFigures() throws Exception {
    Path field = temp.resolve("field.csv");
    assertThat(CliRun.of("demo", "--scenario", "pump-vibration", "--rows", "900", "--seed", "99",
        "--out", field.toString()).exitCode()).isZero();
    Path model = temp.resolve("pump.model.json");
    Path out = temp.resolve("out");
    CliRun compile = CliRun.of("compile", "--data", CompileCommandTest.PUMP.toString(),
        "--target", "state", "--test-data", field.toString(), "--max-depth", "6",
        "--class", "Pump", "--out", out.toString(), "--save-model", model.toString(), "--quiet");
    assertThat(compile.exitCode()).as(compile.err()).isZero();
    Path report = temp.resolve("check.json");
    CliRun check = CliRun.of("check", "--model", model.toString(), "--data", field.toString(),
        "--report", report.toString());
    assertThat(check.exitCode()).as(check.err()).isZero();

    // The compile command scored the same rows as its test part: every figure must be equal.
    JsonNode compiled = JSON.readTree(out.resolve("Pump.report.json").toFile())
        .get("scores").get("test");
    JsonNode checked = JSON.readTree(report.toFile()).get("scores");
    assertThat(checked).isEqualTo(compiled);
    assertThat(checked.get("rows").asInt()).isEqualTo(900);
    // The compile also drew the saved tree, through the same atomic output.
    assertThat(Files.readString(out.resolve("Pump.tree.svg")))
        .isEqualTo(TreeSvg.render(ModelFile.read(model), "Pump"));
  }

  @Test
  void anEnsembleModelIsCheckedWithTheCompileCommandsTestFigures() throws Exception {
    Path field = temp.resolve("field.csv");
    assertThat(CliRun.of("demo", "--scenario", "pump-vibration", "--rows", "600", "--seed", "98",
        "--out", field.toString()).exitCode()).isZero();
    Path model = temp.resolve("forest.model.json");
    Path out = temp.resolve("out");
    CliRun compile = CliRun.of("compile", "--data", CompileCommandTest.PUMP.toString(),
        "--target", "state", "--test-data", field.toString(), "--forest", "8", "--max-depth",
        "4", "--class", "Pump", "--out", out.toString(), "--save-model", model.toString(),
        "--quiet");
    assertThat(compile.exitCode()).as(compile.err()).isZero();
    Path report = temp.resolve("check.json");
    CliRun check = CliRun.of("check", "--model", model.toString(), "--data", field.toString(),
        "--report", report.toString());
    assertThat(check.exitCode()).as(check.err()).isZero();

    // The forest scored the same rows as the compile command's test part: equal figures.
    assertThat(JSON.readTree(report.toFile()).get("scores"))
        .isEqualTo(JSON.readTree(out.resolve("Pump.report.json").toFile()).get("scores")
            .get("test"));
  }

  @Test
  void theShippedPumpModelIsCheckedOnAFreshDemoLogWithAGate() throws IOException {
    // As a CI job would: compile with --save-model, log fresh field data, check it with a floor.
    Path model = temp.resolve("pump.model.json");
    CliRun compile = CliRun.of("compile", "--data", CompileCommandTest.PUMP.toString(),
        "--target", "state", "--budget", "2KiB", "--seed", "7", "--package", "com.example.pump",
        "--class", "PumpStateClassifier", "--out", temp.resolve("out").toString(),
        "--save-model", model.toString(), "--quiet");
    assertThat(compile.exitCode()).as(compile.err()).isZero();
    Path field = temp.resolve("field-99.csv");
    assertThat(CliRun.of("demo", "--scenario", "pump-vibration", "--seed", "99", "--out",
        field.toString()).exitCode()).isZero();

    CliRun pass = CliRun.of("check", "--model", model.toString(), "--data", field.toString(),
        "--floor", "balanced-accuracy=0.75");
    assertThat(pass.exitCode()).as(pass.err()).isZero();
    assertThat(pass.out()).contains("field-99.csv: 3000 rows", "floor balanced-accuracy 0.7500: ");

    CliRun fail = CliRun.of("check", "--model", model.toString(), "--data", field.toString(),
        "--floor", "balanced-accuracy=0.99");
    assertThat(fail.exitCode()).isEqualTo(4);
    assertThat(fail.errLines()).singleElement().asString()
        .startsWith("check failed: balanced-accuracy 0.");
  }
}
