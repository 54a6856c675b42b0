package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.splitwright.backend.BackendAccess;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.onchip.OnChipFixtures;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * {@code compile --emit c --core ... --prove-on ...}: the flash measured for a Cortex-M core, the
 * proof on emulated cores over the host check's inputs, and the options' refusals. The runs that
 * build and emulate are skipped, naming the Debian packages, where arm-none-eabi-gcc or
 * qemu-system-arm is missing; the refusals need neither tool.
 */
class OnChipCommandTest {
  private static final ObjectMapper JSON = new ObjectMapper();

  @TempDir Path temp;

  private static String[] args(Path data, Path out, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", data.toString(),
        "--target", "state", "--class", "PumpState", "--emit", "c", "--out", out.toString()));
    args.addAll(List.of(extra));
    return args.toArray(new String[0]);
  }

  @Test
  void pumpDemoIsProvedOnBothCoresOverTheHostCheckInputs() throws Exception {
    OnChipFixtures.arm();
    Path out = temp.resolve("out");

    CliRun run = CliRun.of(args(DemoFiles.pump(), out, "--core", "cortex-m0plus",
        "--prove-on", "cortex-m0plus,cortex-m4f"));

    assertThat(run.exitCode()).as(run.err()).isZero();
    JsonNode report = JSON.readTree(out.resolve("pump_state.report.json").toFile());
    JsonNode verification = report.get("verification");
    long hostInputs = verification.get("inputsChecked").asLong();
    long rows;
    try (Stream<String> lines = Files.lines(DemoFiles.pump())) {
      rows = lines.count() - 1;
    }
    // Every CSV row, the boundary probes of every split and 2,000 random inputs.
    assertThat(hostInputs).isGreaterThan(rows + 2000);
    JsonNode onChip = verification.get("onChip");
    assertThat(onChip).hasSize(2);
    assertThat(onChip.get(0).get("core").asText()).isEqualTo("cortex-m0plus");
    assertThat(onChip.get(1).get("core").asText()).isEqualTo("cortex-m4f");
    for (JsonNode core : onChip) {
      assertThat(core.get("inputsChecked").asLong()).isEqualTo(hostInputs);
      assertThat(core.get("mismatches").asLong()).isZero();
      assertThat(core.get("emulator").asText()).startsWith("QEMU emulator version");
      assertThat(core.get("instructions").get("worst").asLong())
          .isGreaterThanOrEqualTo(core.get("instructions").get("best").asLong());
      assertThat(run.out()).contains("proved on " + core.get("core").asText() + " (qemu "
          + core.get("board").asText() + "): " + hostInputs + " inputs, 0 mismatches");
    }
    // The target options GCC's Arm documentation gives for these cores (from memory): the
    // Cortex-M0+ has no FPU; the Cortex-M4F's is FPv4 single precision, used with the hard ABI.
    assertThat(texts(onChip.get(1).get("compilerFlags"))).containsSubsequence("-mcpu=cortex-m4",
        "-mthumb", "-mfloat-abi=hard", "-mfpu=fpv4-sp-d16");
    List<String> measured = texts(report.get("flash").get("flags"));
    assertThat(measured).containsSubsequence("-mcpu=cortex-m0plus", "-mthumb").endsWith("-Os");
    // The measured object and the M0+ proof image are built with the same flags.
    assertThat(texts(onChip.get(0).get("compilerFlags"))).isEqualTo(measured);
    assertThat(report.get("flash").get("compiler").asText()).contains("arm-none-eabi-gcc");
    long flash = report.get("flash").get("totalBytes").asLong();
    assertThat(run.out()).contains("flash " + flash + " bytes (arm-none-eabi-gcc "
        + String.join(" ", measured) + ")");
    // Outside reference, GNU binutils: the written file rebuilt by hand with the recorded flags,
    // its .text*, .rodata* and .data* sections as arm-none-eabi-size -A lists them.
    assertThat(sizeAFlashBytes(out.resolve("pump_state.c"), measured)).isEqualTo(flash);
  }

  private long sizeAFlashBytes(Path source, List<String> flags)
      throws IOException, InterruptedException {
    Path object = temp.resolve("by-hand.o");
    List<String> compile = new ArrayList<>(List.of("arm-none-eabi-gcc"));
    compile.addAll(flags);
    compile.addAll(List.of("-c", source.toString(), "-o", object.toString()));
    assertThat(exec(compile)).isEmpty();
    long bytes = 0;
    for (String line : exec(List.of("arm-none-eabi-size", "-A", object.toString())).split("\n")) {
      String[] cells = line.trim().split("\\s+");
      if (cells.length == 3 && cells[0].matches("\\.(text|rodata|data)(\\..*)?")) {
        bytes += Long.parseLong(cells[1]);
      }
    }
    return bytes;
  }

  private static String exec(List<String> command) throws IOException, InterruptedException {
    Process process = new ProcessBuilder(command).redirectErrorStream(true).start();
    String text = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertThat(process.waitFor(120, TimeUnit.SECONDS)).isTrue();
    assertThat(process.exitValue()).as("%s: %s", command, text).isZero();
    return text;
  }

  @Test
  void cflagsWithAnOptimisationLevelReplaceTheDefaultOs() throws IOException {
    OnChipFixtures.arm();
    Path out = temp.resolve("out");

    CliRun run = CliRun.of(args(DemoFiles.pump(), out, "--max-depth", "3", "--core",
        "cortex-m7", "--cflags", "-O2 -std=c99"));

    assertThat(run.exitCode()).as(run.err()).isZero();
    JsonNode report = JSON.readTree(out.resolve("pump_state.report.json").toFile());
    List<String> flags = texts(report.get("flash").get("flags"));
    assertThat(flags).containsSubsequence("-mcpu=cortex-m7", "-O2", "-std=c99")
        .doesNotContain("-Os");
    assertThat(report.get("verification").has("onChip")).isFalse();
  }

  @Test
  void anUnknownCoreIsRefusedListingTheKnownOnes() {
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(args(temp.resolve("absent.csv"), out, "--prove-on",
        "cortex-m4f,cortex-m9"));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()).containsExactly("error: option '--prove-on' must be one of "
        + "cortex-m0plus, cortex-m3, cortex-m4f, cortex-m7, but it is 'cortex-m9' (see "
        + "'splitwright compile --help')");
    assertThat(out).doesNotExist();
  }

  @Test
  void coreIsRefusedWithJava() {
    Path out = temp.resolve("out");
    CliRun run = CliRun.of("compile", "--data", temp.resolve("absent.csv").toString(),
        "--class", "PumpState", "--core", "cortex-m0plus", "--out", out.toString());

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()).containsExactly("error: option '--core' only applies together "
        + "with --emit c (see 'splitwright compile --help')");
    assertThat(out).doesNotExist();
  }

  @Test
  void coreIsRefusedWithCc() {
    CliRun run = CliRun.of(args(temp.resolve("absent.csv"), temp.resolve("out"), "--core",
        "cortex-m4f", "--cc", "gcc"));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()).containsExactly("error: option '--core' measures with "
        + "arm-none-eabi-gcc and the core's flags; leave out --cc, or --core to measure with --cc "
        + "and --cflags (see 'splitwright compile --help')");
  }

  @Test
  void cflagsChoosingTheTargetAreRefusedWithACore() {
    CliRun run = CliRun.of(args(temp.resolve("absent.csv"), temp.resolve("out"), "--prove-on",
        "cortex-m0plus", "--cflags", "-mcpu=cortex-m4 -Os"));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()).containsExactly("error: option '--cflags' chooses the target with "
        + "-mcpu=cortex-m4, but with --core or --prove-on the core does; leave -mcpu=cortex-m4 "
        + "out (see 'splitwright compile --help')");
  }

  @Test
  void twoOptimisationLevelsAreRefusedBeforeAnyDataIsRead() {
    CliRun run = CliRun.of(args(temp.resolve("absent.csv"), temp.resolve("out"), "--core",
        "cortex-m3", "--cflags", "-O2 -Os"));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()).containsExactly("error: option --cflags: a core's build needs "
        + "exactly one of -O0 -O1 -O2 -O3 -Os -Oz -Og -O (not -Ofast, which gives up IEEE 754 "
        + "semantics), but the flags are '-O2 -Os'; give one optimisation level, e.g. -Os");
  }

  /**
   * A PATH without the cross compiler: one line naming it and the Debian package, and the data
   * file, which does not exist, is never read. Runs {@link Main} in a child JVM whose PATH is an
   * empty directory, so no root and no uninstalled tool is needed.
   */
  @Test
  void aMissingCrossCompilerIsOneLineNamingTheDebianPackage() throws Exception {
    Path bin = Files.createDirectory(temp.resolve("bin"));

    ChildRun run = withPath(bin, args(temp.resolve("absent.csv"), temp.resolve("out"), "--core",
        "cortex-m0plus"));

    assertThat(run.exitCode()).as(run.err()).isEqualTo(2);
    assertThat(run.err().strip().lines()).containsExactly("error: option --core: "
        + "\"arm-none-eabi-gcc\" is not installed (not found on PATH); install the Debian "
        + "packages gcc-arm-none-eabi and binutils-arm-none-eabi, e.g. apt-get install "
        + "gcc-arm-none-eabi binutils-arm-none-eabi");
    assertThat(temp.resolve("out")).doesNotExist();
  }

  /**
   * The cross compiler is there (an executable file of that name is all the lookup needs; it is
   * never run, since the emulator's lookup fails first), the emulator is not.
   */
  @Test
  void aMissingEmulatorIsOneLineNamingTheDebianPackage() throws Exception {
    Path bin = Files.createDirectory(temp.resolve("bin"));
    Files.createFile(bin.resolve("arm-none-eabi-gcc"),
        PosixFilePermissions.asFileAttribute(PosixFilePermissions.fromString("rwx------")));

    ChildRun run = withPath(bin, args(temp.resolve("absent.csv"), temp.resolve("out"),
        "--prove-on", "cortex-m4f"));

    assertThat(run.exitCode()).as(run.err()).isEqualTo(2);
    assertThat(run.err().strip().lines()).containsExactly("error: option --prove-on: "
        + "\"qemu-system-arm\" is not installed (not found on PATH); install the Debian package "
        + "qemu-system-arm, e.g. apt-get install qemu-system-arm");
    assertThat(temp.resolve("out")).doesNotExist();
  }

  /**
   * An on-chip proof that did not finish (time limit, fault) fails the run as a mismatch does:
   * exit 1 and one line; {@code OnChipGateTest} shows the job throws it and writes nothing.
   */
  @Test
  void anUnfinishedProofExitsOneWithOneLine() {
    StringWriter err = new StringWriter();
    CommandLine cli = new CommandLine(new SplitwrightCommand());
    cli.setErr(new PrintWriter(err, true));
    CommandLine.ParseResult parsed = cli.parseArgs("compile", "--data", "a.csv", "--class", "C",
        "--out", "o");

    int code = new ErrorHandlers.Execution().handleExecutionException(
        BackendAccess.unfinishedProof("the proof on cortex-m0plus did not finish: the image did "
            + "not finish 5448 inputs within 300000 ms\nsecond line"), cli, parsed);

    assertThat(code).isEqualTo(ExitCodes.VERIFICATION_FAILED).isEqualTo(1);
    assertThat(err.toString().strip().lines()).containsExactly("error: verification failed, "
        + "nothing written: the proof on cortex-m0plus did not finish: the image did not finish "
        + "5448 inputs within 300000 ms");
  }

  private record ChildRun(int exitCode, String err) {}

  private static ChildRun withPath(Path bin, String[] args)
      throws IOException, InterruptedException {
    Path java = Path.of(System.getProperty("java.home"), "bin", "java");
    List<String> command = new ArrayList<>(List.of(java.toString(), "-cp",
        System.getProperty("java.class.path"), Main.class.getName()));
    command.addAll(List.of(args));
    ProcessBuilder builder = new ProcessBuilder(command)
        .redirectOutput(ProcessBuilder.Redirect.DISCARD);
    builder.environment().put("PATH", bin.toString());
    Process process = builder.start();
    String err = new String(process.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
    assertThat(process.waitFor(120, TimeUnit.SECONDS)).isTrue();
    return new ChildRun(process.exitValue(), err);
  }

  private static List<String> texts(JsonNode array) {
    List<String> out = new ArrayList<>();
    array.forEach(n -> out.add(n.asText()));
    return out;
  }
}
