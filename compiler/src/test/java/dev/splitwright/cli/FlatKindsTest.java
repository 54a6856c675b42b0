package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import dev.splitwright.demo.DemoFiles;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The flat layout holds ensembles too: they are emitted and proved, and a budget tries them. */
class FlatKindsTest {
  @TempDir Path temp;

  private String[] args(Path out, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", DemoFiles.pump().toString(),
        "--target", "state", "--class", "P", "--layout", "flat", "--out", out.toString()));
    args.addAll(List.of(extra));
    return args.toArray(new String[0]);
  }

  @Test
  void aBudgetWithTheFlatLayoutSearchesEveryKind() throws Exception {
    Path out = temp.resolve("all");
    CliRun run = CliRun.of(args(out, "--budget", "4KiB", "--max-depth", "3"));

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(new ObjectMapper().readTree(out.resolve("P.report.json").toFile())
        .get("selection").get("kinds").toString())
        .isEqualTo("[\"tree\",\"forest\",\"boosted\"]");
  }

  @Test
  void aFlatForestIsEmittedAndProvedInJava() throws Exception {
    Path out = temp.resolve("forest");
    CliRun run = CliRun.of(args(out, "--forest", "4", "--max-depth", "3"));

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).contains("0 mismatches");
    assertThat(Files.readString(out.resolve("P.java")))
        .contains("int walkFinite(float[] x, int t)");
  }

  @Test
  void aFlatBoostedEnsembleIsEmittedAndProvedInC() throws Exception {
    Path out = temp.resolve("boosted");
    CliRun run = CliRun.of(args(out, "--boosted", "4", "--max-depth", "3", "--emit", "c"));

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).contains("emitted: c", "0 mismatches");
  }
}
