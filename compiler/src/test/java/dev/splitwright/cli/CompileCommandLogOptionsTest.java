package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code --class-weight}, {@code --int-inputs} and the recall line through the real entry point,
 * on the open data sets of src/test/resources/datasets.
 */
class CompileCommandLogOptionsTest {
  @TempDir Path out;

  private final StringWriter stdout = new StringWriter();
  private final StringWriter stderr = new StringWriter();

  private int run(String... args) {
    List<String> all = new ArrayList<>(List.of("compile", "--class", "Logs", "--out",
        out.toString()));
    all.addAll(List.of(args));
    return Main.run(all.toArray(new String[0]), new PrintWriter(stdout), new PrintWriter(stderr));
  }

  private static Path resource(String name) throws URISyntaxException {
    return Path.of(CompileCommandLogOptionsTest.class.getResource("/datasets/" + name).toURI());
  }

  @Test
  void rejectsIntInputsForNonIntegralColumnNamingCellAndColumn() throws Exception {
    Path file = resource("breast-cancer-wisconsin-diagnostic.csv");
    assertThat(run("--data", file.toString(), "--int-inputs")).isEqualTo(ExitCodes.BAD_INPUT);
    assertThat(stderr.toString()).isEqualTo("error: " + file + ":2:1: '17.99' is not a whole"
        + " number, as --int-inputs needs in numeric columns (column 'radius_mean'); drop"
        + " --int-inputs, or round or scale the column, or declare it with --categorical\n");
    assertThat(stdout.toString()).isEmpty();
    try (var files = Files.list(out)) {
      assertThat(files).isEmpty();
    }
  }

  @Test
  void rejectsInputIntForMissingNumericCell() throws Exception {
    // Pima's first data row has no insulin value (column 5).
    Path file = resource("pima-indians-diabetes-2.csv");
    assertThat(run("--data", file.toString(), "--input", "int")).isEqualTo(ExitCodes.BAD_INPUT);
    assertThat(stderr.toString()).isEqualTo("error: " + file + ":2:5: missing value, which an"
        + " int input cannot express (column 'insulin'); drop --int-inputs, or fill or remove the"
        + " rows whose value is missing\n");
  }

  @Test
  void rejectsIntInputsTogetherWithAnotherInputType() throws Exception {
    Path file = resource("pima-indians-diabetes-2.csv");
    assertThat(run("--data", file.toString(), "--int-inputs", "--input", "double"))
        .isEqualTo(ExitCodes.BAD_INPUT);
    assertThat(stderr.toString()).startsWith(
        "error: option '--int-inputs' contradicts --input double");
  }

  @Test
  void rejectsClassWeightForUnknownLabelListingTheLabels() throws Exception {
    Path file = resource("pima-indians-diabetes-2.csv");
    assertThat(run("--data", file.toString(), "--class-weight", "pos=3,positive=2"))
        .isEqualTo(ExitCodes.BAD_INPUT);
    assertThat(stderr.toString()).isEqualTo("error: option --class-weight: no class 'positive'"
        + " in column 'diabetes' of pima-indians-diabetes-2.csv; name classes among neg, pos\n");
  }

  @Test
  void rejectsMalformedClassWeightBeforeReadingData() {
    assertThat(run("--data", "no-such-file.csv", "--class-weight", "pos=heavy"))
        .isEqualTo(ExitCodes.BAD_INPUT);
    assertThat(stderr.toString()).startsWith("error: option '--class-weight':"
        + " weight of class 'pos' must be a positive decimal number, but it is 'heavy'");
  }

  @Test
  void rejectsAnotherToolsWordForClassWeightNamingOurs() {
    // Exit 2 and one line that names our value; nothing else is accepted silently.
    assertThat(run("--data", "no-such-file.csv", "--class-weight", "balanced"))
        .isEqualTo(ExitCodes.BAD_INPUT);
    assertThat(stderr.toString()).startsWith("error: option '--class-weight':"
        + " 'balanced' is not a value of ours; for weights inverse to class frequency write"
        + " inverse-frequency");
    assertThat(stderr.toString().lines().count()).isEqualTo(1);
  }

  @Test
  void printsTestRecallPerClassAndRecordsWeightsInTheHeader() throws Exception {
    Path file = resource("pima-indians-diabetes-2.csv");
    assertThat(run("--data", file.toString(), "--max-depth", "3", "--class-weight",
        "pos=2")).as(stderr.toString()).isZero();
    assertThat(stdout.toString()).containsPattern(
        "(?m)^test       recall per class: neg 0\\.\\d{3}, pos 0\\.\\d{3}$");
    String source = Files.readString(out.resolve("Logs.java"));
    // The options line of the class comment, wrapped at 100 columns; joined again here.
    assertThat(source.replace("\n * ", " "))
        .contains("--impurity gini --class-weight pos=2.0 --layout");
  }
}
