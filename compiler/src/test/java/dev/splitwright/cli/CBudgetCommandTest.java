package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.splitwright.backend.BinutilsSize;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.select.SizeText;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The budget search with {@code --emit c}: every candidate measured in flash bytes of the object
 * file the C compiler writes, the chosen one within the budget as GNU binutils' {@code size -A}
 * counts the written file compiled again outside Splitwright.
 */
class CBudgetCommandTest {
  private static final ObjectMapper JSON = new ObjectMapper();

  @TempDir Path temp;

  private static List<String> args(Path out, String budget, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data",
        DemoFiles.pump().toString(), "--target", "state", "--class", "PumpStateClassifier",
        "--emit", "c", "--budget", budget, "--out", out.toString()));
    args.addAll(List.of(extra));
    return args;
  }

  @ParameterizedTest
  @CsvSource({
      "1KiB, branches, tree",
      "600, branches, tree",
      "4KiB, smallest, 'tree,forest,boosted'"})
  void theChosenObjectFitsTheBudgetAsBinutilsCountsIt(String budget, String layout, String kinds)
      throws Exception {
    // Single trees keep most rows quick; the last searches every kind, ensembles in C included.
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(args(out, budget, "--layout", layout, "--kinds", kinds)
        .toArray(new String[0]));
    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).contains("emitted: c", "0 mismatches", "(flash)", "cc runs");

    JsonNode report = JSON.readTree(out.resolve("pump_state_classifier.report.json").toFile());
    JsonNode selection = report.get("selection");
    int bytes = SizeText.parse("budget", budget);
    int chosen = selection.get("chosen").get("size").asInt();
    assertThat(selection.get("budgetUnit").asText()).isEqualTo("flash");
    assertThat(chosen).isPositive().isLessThanOrEqualTo(bytes)
        .isEqualTo(selection.get("chosen").get("flashBytes").asInt())
        .isEqualTo(report.get("flash").get("totalBytes").asInt());
    assertThat(selection.get("chosen").has("classFileBytes")).isFalse();
    // No candidate within the budget scores better than the chosen one.
    double score = selection.get("chosen").get("validationScore").asDouble();
    for (JsonNode point : selection.get("frontier")) {
      if (point.get("size").asInt() <= bytes) {
        assertThat(point.get("validationScore").asDouble()).isLessThanOrEqualTo(score);
      }
    }
    // The written files compiled again by the same compiler and flags, counted by binutils.
    assertThat(flashBySize(out, "cc", List.of("-Os"), "size")).isEqualTo(chosen);
    assertThat(out.resolve("pump_state_classifier.frontier.svg")).exists();
  }

  @Test
  void aCortexM0PlusBudgetOfOneKibibyteIsMetAndProvedOnTheEmulatedCore() throws Exception {
    assumeTrue(runs("arm-none-eabi-gcc") && runs("qemu-system-arm"), "arm-none-eabi-gcc and "
        + "qemu-system-arm are needed: apt-get install gcc-arm-none-eabi qemu-system-arm "
        + "(.ci/run does)");
    Path out = temp.resolve("m0");
    CliRun run = CliRun.of(args(out, "1KiB", "--core", "cortex-m0plus", "--prove-on",
        "cortex-m0plus").toArray(new String[0]));
    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).contains("proved on cortex-m0plus", "0 mismatches");

    JsonNode report = JSON.readTree(out.resolve("pump_state_classifier.report.json").toFile());
    int chosen = report.get("selection").get("chosen").get("size").asInt();
    assertThat(chosen).isLessThanOrEqualTo(1024);
    List<String> flags = new ArrayList<>();
    report.get("flash").get("flags").forEach(f -> flags.add(f.asText()));
    assertThat(flags).contains("-mcpu=cortex-m0plus", "-mthumb", "-Os");
    // The written file rebuilt with the recorded flags, counted by binutils for Arm.
    assertThat(flashBySize(out, "arm-none-eabi-gcc", flags, "arm-none-eabi-size"))
        .isEqualTo(chosen);
    // Proved once, on the chosen classifier: the host check and the emulated core agree.
    JsonNode onChip = report.get("verification").get("onChip");
    assertThat(onChip).hasSize(1);
    assertThat(onChip.get(0).get("mismatches").asInt()).isZero();
    assertThat(onChip.get(0).get("inputsChecked").asLong())
        .isEqualTo(report.get("verification").get("inputsChecked").asLong());
  }

  @Test
  void aCrossCompilerBudgetOfOneKibibyteIsMetWhenRebuiltByHand() throws Exception {
    assumeTrue(runs("arm-none-eabi-gcc"), "arm-none-eabi-gcc is needed: apt-get install "
        + "gcc-arm-none-eabi libnewlib-arm-none-eabi (.ci/run does)");
    Path out = temp.resolve("cc");
    List<String> flags = List.of("-mcpu=cortex-m0plus", "-mthumb", "-Os");
    CliRun run = CliRun.of(args(out, "1KiB", "--cc", "arm-none-eabi-gcc", "--cflags",
        String.join(" ", flags), "--kinds", "tree").toArray(new String[0]));
    assertThat(run.exitCode()).as(run.err()).isZero();

    JsonNode report = JSON.readTree(out.resolve("pump_state_classifier.report.json").toFile());
    int chosen = report.get("selection").get("chosen").get("size").asInt();
    assertThat(chosen).isLessThanOrEqualTo(1024);
    assertThat(report.get("flash").get("compiler").asText()).contains("arm-none-eabi-gcc");
    assertThat(flashBySize(out, "arm-none-eabi-gcc", flags, "arm-none-eabi-size"))
        .isEqualTo(chosen);
  }

  @Test
  void aMissingCrossCompilerIsExitTwoNamingTheDebianPackage() {
    Path out = temp.resolve("missing");
    CliRun run = CliRun.of(args(out, "1KiB", "--cc", "arm-none-eabi-gcc-does-not-exist")
        .toArray(new String[0]));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.err().strip()).isEqualTo("error: option --cc: no C compiler "
        + "'arm-none-eabi-gcc-does-not-exist' found; install it (on Debian: apt-get install "
        + "gcc-arm-none-eabi) or name another with --cc (a command on PATH or a path)");
    assertThat(out).doesNotExist();
  }

  @Test
  void aBudgetBelowTheSmallestObjectNamesTheLeastInFlashBytes() {
    Path out = temp.resolve("small");
    CliRun run = CliRun.of(args(out, "64", "--max-depth", "3").toArray(new String[0]));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.err().strip()).matches("error: option --budget: 64 bytes is too small: the "
        + "smallest classifier for this data \\(1 leaf\\) has a flash size of \\d+ bytes; .*"
        + "--budget \\d+ or more.*");
    assertThat(run.err().strip().lines()).hasSize(1);
    assertThat(out).doesNotExist();
  }

  /** Compiles the written {@code .c} with {@code cc flags -c} and sums binutils' flash rows. */
  private long flashBySize(Path out, String cc, List<String> flags, String size)
      throws IOException, InterruptedException {
    Path object = temp.resolve(cc + ".o");
    List<String> command = new ArrayList<>(List.of(cc));
    command.addAll(flags);
    command.addAll(List.of("-c", out.resolve("pump_state_classifier.c").toString(), "-o",
        object.toString()));
    Process process = new ProcessBuilder(command).redirectErrorStream(true).start();
    String text = new String(process.getInputStream().readAllBytes());
    assertThat(process.waitFor(120, TimeUnit.SECONDS)).isTrue();
    assertThat(process.exitValue()).as(text).isZero();
    assertThat(Files.size(object)).isPositive();
    return BinutilsSize.flashBytes(size, object);
  }

  private static boolean runs(String command) {
    try {
      Process p = new ProcessBuilder(command, "--version").redirectErrorStream(true).start();
      p.getInputStream().readAllBytes();
      return p.waitFor(60, TimeUnit.SECONDS) && p.exitValue() == 0;
    } catch (IOException e) {
      return false;
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      return false;
    }
  }
}
