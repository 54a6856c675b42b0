package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import dev.splitwright.demo.DemoFiles;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The flat layout holds single trees: ensembles with it are refused, and a budget keeps trees. */
class FlatKindsTest {
  @TempDir Path temp;

  private String[] args(Path out, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", DemoFiles.pump().toString(),
        "--target", "state", "--class", "P", "--layout", "flat", "--out", out.toString()));
    args.addAll(List.of(extra));
    return args.toArray(new String[0]);
  }

  @Test
  void aBudgetWithTheFlatLayoutSearchesTreesAlone() throws Exception {
    Path out = temp.resolve("tree");
    CliRun run = CliRun.of(args(out, "--budget", "4KiB", "--max-depth", "3"));

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(new ObjectMapper().readTree(out.resolve("P.report.json").toFile())
        .get("selection").get("kinds").toString()).isEqualTo("[\"tree\"]");
  }

  @Test
  void ensemblesWithTheFlatLayoutAreRefusedInOneLine() {
    for (String[] extra : List.of(new String[] {"--budget", "4KiB", "--kinds", "tree,forest"},
        new String[] {"--forest", "4", "--max-depth", "3"},
        new String[] {"--boosted", "4", "--max-depth", "3", "--emit", "c"})) {
      Path out = temp.resolve("refused");
      CliRun run = CliRun.of(args(out, extra));

      assertThat(run.exitCode()).as(String.join(" ", extra)).isEqualTo(2);
      assertThat(run.err().strip().lines()).hasSize(1);
      assertThat(run.err()).contains("flat").contains("single trees");
      assertThat(out).doesNotExist();
    }
  }
}
