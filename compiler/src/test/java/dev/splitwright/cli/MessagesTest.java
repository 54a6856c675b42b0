package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.splitwright.eval.Scores;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Messages that say what happened and what to do about it. */
class MessagesTest {
  @TempDir Path dir;

  @Test
  void aMissingLabelInTheDefaultTargetNamesTheFirstColumnWhenItLooksLikeALabel()
      throws IOException {
    Path csv = dir.resolve("devices.csv");
    Files.writeString(csv, "device,rms,temp\npump,1.5,20\nfan,2.5,\n");

    CliRun run = CliRun.of("compile", "--data", csv.toString(), "--class", "X", "--out",
        dir.resolve("out").toString());

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()).containsExactly("error: " + csv + ":3:3: missing class label "
        + "(column 'temp'); --target was not given, so the target is the last column 'temp'; "
        + "the first column 'device' holds text such as 'fan': if it holds the labels, give "
        + "--target device");
  }

  @Test
  void aMissingLabelWithoutALikelyAlternativeStillSaysTheTargetDefaulted() throws IOException {
    Path csv = dir.resolve("numbers.csv");
    Files.writeString(csv, "a,b,state\n1,2,on\n3,4,\n");

    CliRun run = CliRun.of("compile", "--data", csv.toString(), "--class", "X", "--out",
        dir.resolve("out").toString());
    CliRun named = CliRun.of("compile", "--data", csv.toString(), "--target", "state",
        "--class", "X", "--out", dir.resolve("out").toString());

    assertThat(run.errLines()).singleElement().asString()
        .endsWith("; --target was not given, so the target is the last column 'state'; name "
            + "the label column with --target, or give every row a label, or remove the row");
    assertThat(named.errLines()).singleElement().asString()
        .endsWith("missing class label (column 'state'); give every row a label, or remove the "
            + "row");
  }

  @Test
  void warnsOnceWhenAClassHasFewerThanThirtyValidationRows() {
    // Rows of each class are the confusion matrix's row sums: 29, 30 and 3.
    Scores scores = Scores.fromConfusion(new int[][] {{20, 9, 0}, {0, 30, 0}, {1, 1, 1}});

    assertThat(NoisyScores.warning("validation", List.of("fault", "normal", "drift"), scores))
        .contains("warning: the validation part has fewer than 30 rows of 2 classes (fault 29, "
            + "drift 3), so its scores are noisy; give it a larger share with --split, or use "
            + "--folds with --budget");
    Scores enough = Scores.fromConfusion(new int[][] {{30, 0}, {5, 25}});
    assertThat(NoisyScores.warning("validation", List.of("a", "b"), enough)).isEmpty();
  }

  @Test
  void theNoisyScoresWarningIsPrintedForASmallValidationPart() throws IOException {
    StringBuilder csv = new StringBuilder("device,a,b\n");
    for (int i = 1; i <= 60; i++) {
      csv.append("d").append(i % 3).append(',').append(i).append(',').append(i * 7 % 11)
          .append('\n');
    }
    Path data = Files.writeString(dir.resolve("small.csv"), csv);

    CliRun run = CliRun.of("compile", "--data", data.toString(), "--target", "device",
        "--class", "X", "--out", dir.resolve("out").toString());

    assertThat(run.exitCode()).as(run.err()).isZero();
    // 60 rows, 0.2 of them for validation, stratified: 4 of each class.
    assertThat(run.out()).contains("warning: the validation part has fewer than 30 rows of 3 "
        + "classes (d0 4, d1 4, d2 4)");
  }

  @Test
  void smallestLayoutWithABudgetNamesTheLayoutThatWonAndBothSizes() throws IOException {
    Path out = dir.resolve("out");
    CliRun run = CliRun.of("compile", "--data", CompileCommandTest.PUMP.toString(), "--target",
        "state", "--budget", "2KiB", "--layout", "smallest", "--class", "Pump", "--out",
        out.toString());

    assertThat(run.exitCode()).as(run.err()).isZero();
    JsonNode report = new ObjectMapper().readTree(out.resolve("Pump.report.json").toFile());
    String won = report.get("layout").asText();
    assertThat(won).isIn("branches", "table");
    assertThat(report.get("selection").get("chosen").get("layout").asText()).isEqualTo(won);
    String other = won.equals("table") ? "branches" : "table";
    String choice = report.get("options").get("layoutChoice").asText();
    assertThat(choice).matches(won + ": \\d+ bytes \\(" + other + " \\d+ bytes\\).*");
    assertThat(choice).startsWith(won + ": " + report.get("classFileBytes").asInt() + " bytes");
    assertThat(run.out()).contains("layout: " + choice + "\n");
  }

  @Test
  void everyErrorStartsWithTheSamePrefix() throws IOException {
    CliRun usage = CliRun.of("compile", "--max-depth", "deep");
    CliRun input = CliRun.of("compile", "--data", dir.resolve("none.csv").toString(), "--class",
        "X", "--out", dir.toString());
    CliRun unknown = CliRun.of("frobnicate");

    for (CliRun run : List.of(usage, input, unknown)) {
      assertThat(run.exitCode()).isEqualTo(2);
      assertThat(run.errLines()).as(run.err()).singleElement().asString().startsWith("error: ");
    }
  }
}
