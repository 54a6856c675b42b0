package dev.splitwright.job;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.LoadOptions;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The whole job on our demo data and on open data sets: the emitted class must agree with the
 * model on every row and every boundary probe, and take every split both ways.
 */
class PipelineVerificationTest {
  private static final Verifier VERIFIER = Verifier.create();

  @TempDir Path temp;

  static Stream<Arguments> dataSets() {
    return Stream.of(
        // Our own seeded demo scenarios.
        Arguments.of(DemoFiles.pump().toString(), "state", 8),
        Arguments.of(DemoFiles.of("gesture-band").toString(), "gesture", 8),
        // UCI Breast Cancer Wisconsin (Diagnostic), 569 rows, no missing values.
        Arguments.of("src/test/resources/datasets/breast-cancer-wisconsin-diagnostic.csv",
            "diagnosis", 6),
        // UCI Pima Indians Diabetes (mlbench PimaIndiansDiabetes2): empty cells are missing and
        // the rows are kept (learned missing-value directions).
        Arguments.of("src/test/resources/datasets/pima-indians-diabetes-2.csv", "diabetes", 10),
        // UCI Congressional Voting Records: categorical y/n with missing votes.
        Arguments.of("src/test/resources/datasets/house-votes-84.csv", "Class", 6));
  }

  @ParameterizedTest
  @MethodSource("dataSets")
  void emittedCodeAgreesWithTheModelOnEveryRowAndBoundary(String csv, String target, int depth)
      throws Exception {
    CompileRequest request = new CompileRequest(Path.of(csv), Optional.empty(), Optional.empty(),
        LoadOptions.builder().target(target).build(), new double[] {0.6, 0.2, 0.2}, 1,
        TrainingOptions.builder().maxDepth(depth).build(),
        EmitOptions.builder("check", "Classifier").build(), temp, Optional.empty(), "test");

    CompileResult result = new CompileJob(VERIFIER).run(request);

    VerificationResult v = result.verification();
    assertThat(v.mismatches()).as(v.verdict()).isZero();
    assertThat(v.passed()).isTrue();
    assertThat(v.branchCoverage()).isEqualTo(1.0);
    assertThat(v.splits()).isEqualTo(result.tree().internalNodeCount()).isPositive();
    long rows;
    try (Stream<String> lines = Files.lines(Path.of(csv))) {
      rows = lines.count() - 1;
    }
    // Every data row plus eight probes a numeric split (fewer for categorical ones) at least.
    assertThat(v.inputsChecked()).isGreaterThan(rows + 6L * v.splits());
    assertThat(v.foreignReferences()).isEmpty();
    assertThat(temp.resolve("check/Classifier.java")).exists();
    assertThat(temp.resolve("Classifier.report.json")).exists();
  }
}
