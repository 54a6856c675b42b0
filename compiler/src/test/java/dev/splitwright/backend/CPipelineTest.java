package dev.splitwright.backend;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.LoadOptions;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.job.CompileJob;
import dev.splitwright.job.CompileRequest;
import dev.splitwright.job.CompileResult;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The whole job with {@code --emit c} on open data sets: the C file built by the host compiler
 * must agree with the model on every row and boundary probe and take every split both ways.
 */
class CPipelineTest {
  static final Languages.CTools HOST = new Languages.CTools("cc", "cc", List.of("-Os"));

  @TempDir Path temp;

  static Stream<Arguments> dataSets() {
    return Stream.of(
        // UCI Breast Cancer Wisconsin (Diagnostic), 569 rows, no missing values.
        Arguments.of("breast-cancer-wisconsin-diagnostic.csv", "diagnosis", 6, Layout.SMALLEST,
            InputKind.FLOAT, false),
        // UCI Pima Indians Diabetes (mlbench PimaIndiansDiabetes2): empty cells are missing.
        Arguments.of("pima-indians-diabetes-2.csv", "diabetes", 10, Layout.TABLE,
            InputKind.FLOAT, true),
        // UCI Congressional Voting Records: categorical y/n with missing votes.
        Arguments.of("house-votes-84.csv", "Class", 6, Layout.BRANCHES, InputKind.FLOAT, true),
        // The same as int32 input: category codes are whole numbers, -1 is missing.
        Arguments.of("house-votes-84.csv", "Class", 6, Layout.TABLE, InputKind.INT, false),
        // The flat layout on the same data: numeric, missing cells, categorical, int32.
        Arguments.of("breast-cancer-wisconsin-diagnostic.csv", "diagnosis", 6, Layout.FLAT,
            InputKind.FLOAT, false),
        Arguments.of("pima-indians-diabetes-2.csv", "diabetes", 10, Layout.FLAT,
            InputKind.FLOAT, true),
        Arguments.of("house-votes-84.csv", "Class", 6, Layout.FLAT, InputKind.FLOAT, true),
        Arguments.of("house-votes-84.csv", "Class", 6, Layout.FLAT, InputKind.INT, false));
  }

  @ParameterizedTest
  @MethodSource("dataSets")
  void emittedCAgreesWithTheModelOnEveryRowAndBoundary(String csv, String target, int depth,
      Layout layout, InputKind input, boolean probabilities) throws Exception {
    Path data = Path.of("src/test/resources/datasets", csv);
    EmitOptions emit = EmitOptions.builder("", "OpenDataClassifier").layout(layout)
        .inputKind(input).probabilities(probabilities).build();
    CompileRequest request = new CompileRequest(data, Optional.empty(), Optional.empty(),
        LoadOptions.builder().target(target).build(), new double[] {0.6, 0.2, 0.2}, 1,
        TrainingOptions.builder().maxDepth(depth).build(), emit, temp, Optional.empty(), "test");
    Verifier verifier = Verifier.create();

    CompileResult result = new CompileJob(verifier, Languages.c(emit, HOST)).run(request);

    VerificationResult v = result.verification();
    assertThat(v.mismatches()).as(v.verdict()).isZero();
    assertThat(v.passed()).isTrue();
    assertThat(v.branchCoverage()).isEqualTo(1.0);
    assertThat(v.splits()).isEqualTo(result.tree().internalNodeCount()).isPositive();
    long rows;
    try (Stream<String> lines = Files.lines(data)) {
      rows = lines.count() - 1;
    }
    assertThat(v.inputsChecked()).isGreaterThan(rows + 6L * v.splits());
    assertThat(result.report().language()).isEqualTo("c");
    assertThat(result.report().verification().compiler().flags())
        .containsAll(List.of("-std=c99", "-ffp-contract=off", "-Werror"));
    assertThat(result.report().flash().totalBytes()).isPositive();
    assertThat(result.report().classFileBytes()).isNull();
    assertThat(result.report().input()).isEqualTo(input.optionName());
    if (layout == Layout.SMALLEST) {
      // Both layouts compiled and measured; the one kept has the fewer flash bytes.
      assertThat(result.report().flash().layouts()).containsOnlyKeys("branches", "table");
      assertThat(result.report().flash().totalBytes())
          .isEqualTo(result.report().flash().layouts().get(result.report().layout()))
          .isEqualTo(result.report().flash().layouts().values().stream()
              .mapToLong(Long::longValue).min().orElseThrow());
    } else {
      assertThat(result.report().layout()).isEqualTo(layout.optionName());
    }
    assertThat(temp.resolve("open_data_classifier.h")).exists();
    assertThat(temp.resolve("open_data_classifier.c")).exists();
    assertThat(temp.resolve("open_data_classifier.report.json")).exists();
    assertThat(temp.resolve("open_data_classifier.tree.svg")).exists();
  }
}
