package dev.splitwright.job;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.LoadOptions;
import dev.splitwright.demo.DemoRow;
import dev.splitwright.demo.PumpVibrationScenario;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.eval.Scores;
import dev.splitwright.train.ClassWeights;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.Verifier;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Inverse-frequency class weights on an imbalanced field log: the pump demo with only one in ten
 * misalignment rows kept, making it a rare fault (about 1.4% of rows). Weighting classes
 * inversely to their frequency (common practice) should make a
 * size-capped tree give the rare fault leaves of its own and find more of it on the test part.
 */
class ClassWeightPipelineTest {
  /** Fixed before the first run, never tuned. */
  private static final long DATA_SEED = 20;
  private static final int ROWS = 12_000;
  private static final String RARE = "misalignment";

  @TempDir static Path dir;
  private static Path csv;
  private static int rareRows;

  @BeforeAll
  static void writeImbalancedVariant() throws Exception {
    List<DemoRow> generated = new PumpVibrationScenario().generate(ROWS, DATA_SEED);
    StringBuilder out = new StringBuilder(String.join(",", PumpVibrationScenario.FEATURES))
        .append(',').append(PumpVibrationScenario.TARGET).append('\n');
    int seen = 0;
    for (DemoRow row : generated) {
      if (row.loggedLabel().equals(RARE) && seen++ % 10 != 0) {
        continue;
      }
      rareRows += row.loggedLabel().equals(RARE) ? 1 : 0;
      out.append(String.join(",", row.cells())).append(',').append(row.loggedLabel()).append('\n');
    }
    csv = Files.writeString(dir.resolve("pump-rare-misalignment.csv"), out,
        StandardCharsets.UTF_8);
  }

  @Test
  void inverseFrequencyWeightsRaiseRecallOfTheRareFault() throws Exception {
    CompileResult plain = compile(ClassWeights.none(), "plain");
    CompileResult balanced = compile(ClassWeights.inverseFrequency(), "inverse");
    assertThat(plain.verification().passed()).isTrue();
    assertThat(balanced.verification().passed()).isTrue();

    int rare = plain.tree().schema().classes().indexOf(RARE);
    Scores before = plain.scores().get("test");
    Scores after = balanced.scores().get("test");
    int rareTestRows = before.confusion().get(rare).stream().mapToInt(Integer::intValue).sum();
    System.out.printf(Locale.ROOT, "rare '%s': %d of %d rows, %d in test; test recall %.3f"
            + " unweighted -> %.3f inverse-frequency (%+.3f); accuracy %.4f -> %.4f,"
            + " balanced accuracy %.4f -> %.4f%n",
        RARE, rareRows, countRows(), rareTestRows, before.recall().get(rare),
        after.recall().get(rare), after.recall().get(rare) - before.recall().get(rare),
        before.accuracy(), after.accuracy(), before.balancedAccuracy(),
        after.balancedAccuracy());
    assertThat(rareTestRows).isGreaterThanOrEqualTo(20);
    assertThat(after.recall().get(rare)).isGreaterThan(before.recall().get(rare));
    assertThat(after.balancedAccuracy()).isGreaterThan(before.balancedAccuracy());
  }

  private static long countRows() throws Exception {
    try (var lines = Files.lines(csv)) {
      return lines.count() - 1;
    }
  }

  private static CompileResult compile(ClassWeights weights, String name) throws Exception {
    CompileRequest request = new CompileRequest(csv, Optional.empty(), Optional.empty(),
        LoadOptions.builder().target(PumpVibrationScenario.TARGET).build(),
        new double[] {0.6, 0.2, 0.2}, 1,
        TrainingOptions.builder().maxDepth(4).weights(weights).build(),
        EmitOptions.builder("", "Pump").build(), dir.resolve(name), Optional.empty(),
        "--class-weight " + weights.optionText());
    return new CompileJob(Verifier.create()).run(request);
  }
}
