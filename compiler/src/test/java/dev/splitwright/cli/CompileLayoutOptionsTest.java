package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code --layout smallest}, {@code --named-args} and {@code --probabilities} end to end. */
class CompileLayoutOptionsTest {
  @TempDir Path temp;

  private String[] args(Path data, String target, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", data.toString(),
        "--target", target, "--max-depth", "6", "--package", "com.example.pump",
        "--class", "PumpState", "--out", temp.resolve("out").toString()));
    args.addAll(List.of(extra));
    return args.toArray(new String[0]);
  }

  @Test
  void smallestReportsBothSizesAndKeepsTheSmaller() throws IOException {
    CliRun run = CliRun.of(args(CompileCommandTest.PUMP, "state", "--layout", "smallest"));

    assertThat(run.exitCode()).as(run.err()).isZero();
    String line = run.out().lines().filter(l -> l.startsWith("layout: ")).findFirst().orElseThrow();
    assertThat(line)
        .matches("layout: (branches|table): \\d+ bytes \\((branches|table) \\d+ bytes\\)");
    String[] words = line.split("[ :()]+");
    String kept = words[1];
    int keptBytes = Integer.parseInt(words[2]);
    int otherBytes = Integer.parseInt(words[5]);
    assertThat(keptBytes).isLessThanOrEqualTo(otherBytes);
    String report = Files.readString(temp.resolve("out/PumpState.report.json"));
    assertThat(report).contains("\"layout\" : \"" + kept + "\"")
        .contains("\"classFileBytes\" : " + keptBytes).contains("\"layoutChoice\"");
    assertThat(Files.readString(temp.resolve("out/com/example/pump/PumpState.java")))
        .contains("layout " + kept + ", input float");
  }

  @Test
  void namedArgumentsAndProbabilitiesAreEmittedAndVerified() throws IOException {
    CliRun run = CliRun.of(args(CompileCommandTest.PUMP, "state", "--named-args",
        "--probabilities", "--layout", "table", "--input", "double"));

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).contains(" 0 mismatches");
    String source = Files.readString(temp.resolve("out/com/example/pump/PumpState.java"),
        StandardCharsets.UTF_8);
    assertThat(source).contains("public static int classify(double vibrationRmsMmS, "
        + "double peakAccelG, double crestFactor,")
        .containsPattern("double kurtosis, double bearingTempC, double motorCurrentA\\)")
        .contains("public static void classProbabilities(double vibrationRmsMmS,")
        // The options line of the class comment may wrap; joined again here.
        .satisfies(text -> assertThat(text.replace("\n * ", " "))
            .contains("--named-args --probabilities"));
  }

  @Test
  void namedArgumentsForMoreThan32FeaturesIsAnOptionError() throws IOException {
    Path wide = temp.resolve("wide.csv");
    StringBuilder csv = new StringBuilder();
    for (int f = 0; f < 33; f++) {
      csv.append("f").append(f).append(',');
    }
    csv.append("label\n");
    SplittableRandom random = new SplittableRandom(3);
    for (int r = 0; r < 40; r++) {
      for (int f = 0; f < 33; f++) {
        csv.append(random.nextInt(100)).append(',');
      }
      csv.append(r % 2 == 0 ? "on" : "off").append('\n');
    }
    Files.writeString(wide, csv);

    CliRun run = CliRun.of(args(wide, "label", "--named-args", "--split", "1,0,0"));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()).containsExactly("error: option --named-args: named arguments need "
        + "at most 32 features, but there are 33; pass the features as an array (leave out "
        + "--named-args)");
    assertThat(temp.resolve("out")).doesNotExist();
  }
}
