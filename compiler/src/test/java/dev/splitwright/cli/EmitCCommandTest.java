package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.demo.DemoFiles;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** {@code compile --emit c}: the options it refuses, its compilers, and repeatable output. */
class EmitCCommandTest {
  @TempDir Path temp;

  private static String[] args(Path data, Path out, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", data.toString(),
        "--target", "state", "--max-depth", "4", "--class", "PumpState", "--emit", "c",
        "--out", out.toString()));
    args.addAll(List.of(extra));
    return args.toArray(new String[0]);
  }

  @ParameterizedTest
  @ValueSource(strings = {"--package=com.example", "--named-args", "--max-method-bytes=9000",
      "--dex-size", "--min-api=30"})
  void javaOnlyOptionsAreRefusedBeforeAnyDataIsRead(String option) {
    // The data file does not exist: an error naming the option, not the file, proves the option
    // was refused before the data was read.
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(args(temp.resolve("absent.csv"), out, option));

    assertThat(run.exitCode()).isEqualTo(2);
    String name = option.contains("=") ? option.substring(0, option.indexOf('=')) : option;
    assertThat(run.err()).contains(name).contains("--emit c").doesNotContain("absent.csv");
    assertThat(run.err().strip().lines()).hasSize(1);
    assertThat(out).doesNotExist();
  }

  @Test
  void cOnlyOptionsAreRefusedForJava() {
    CliRun run = CliRun.of("compile", "--data", temp.resolve("absent.csv").toString(),
        "--class", "PumpState", "--cflags", "-O2", "--out", temp.resolve("out").toString());

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.err()).contains("--cflags").doesNotContain("absent.csv");
  }

  @ParameterizedTest
  @ValueSource(strings = {"class", "dex", "bytecode", "source"})
  void aJavaBudgetUnitIsRefusedBeforeAnyDataIsRead(String unit) {
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(args(temp.resolve("absent.csv"), out, "--budget", "2KiB",
        "--budget-unit", unit));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.err().strip()).isEqualTo("error: option '--budget-unit' must be flash with "
        + "--emit c, but it is '" + unit + "' (see 'splitwright compile --help')");
    assertThat(out).doesNotExist();
  }

  @Test
  void aMissingHostCompilerIsOneLineNamingTheOption() {
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(args(DemoFiles.pump(), out, "--host-cc",
        temp.resolve("no-such-cc").toString()));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.err()).contains("--host-cc");
    assertThat(run.err().strip().lines()).hasSize(1);
    assertThat(out).doesNotExist();
  }

  @Test
  void flagsTheTargetCompilerRejectsAreNamedWithItsFirstError() {
    // Defining the header's include guard empties the header, so the source cannot compile; the
    // host compiler, without that flag, accepts the same files: the flags are at fault.
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(args(DemoFiles.pump(), out, "--cflags", "-Os -DPUMP_STATE_H"));

    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.err()).contains("--cflags").contains("pump_state").contains("error");
    assertThat(run.err().strip().lines()).hasSize(1);
    assertThat(out).doesNotExist();
  }

  @Test
  void emittedCTheHostCompilerRejectsIsOurBugExitThreeWithItsFirstErrorLine() throws IOException {
    // A stand-in host compiler that answers --version and rejects every file, as a compiler
    // would reject emitted C it cannot build; the target compiler (cc) still measures.
    Path fake = temp.resolve("rejecting-cc");
    Files.writeString(fake, "#!/bin/sh\nfor a in \"$@\"; do\n  if [ \"$a\" = --version ]; then "
        + "echo 'rejecting-cc 1.0'; exit 0; fi\ndone\necho 'pump_state.c:9:1: error: injected "
        + "failure' >&2\necho 'pump_state.c:9:1: note: second line' >&2\nexit 1\n");
    assertThat(fake.toFile().setExecutable(true)).isTrue();
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(args(DemoFiles.pump(), out, "--host-cc", fake.toString(), "--cc",
        "cc"));

    assertThat(run.exitCode()).isEqualTo(3);
    assertThat(run.err()).contains("pump_state.c:9:1: error: injected failure")
        .doesNotContain("second line");
    assertThat(run.err().strip().lines()).hasSize(1);
    assertThat(out).doesNotExist();
  }

  @Test
  void sameInputGivesByteIdenticalFilesAndASavedModelReemitsThem() throws IOException {
    Path first = temp.resolve("a");
    Path second = temp.resolve("b");
    Path third = temp.resolve("c");
    Path model = temp.resolve("pump.model.json");
    CliRun run = CliRun.of(args(DemoFiles.pump(), first, "--save-model", model.toString()));
    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).contains("emitted: c").contains("0 mismatches")
        .contains("branch coverage 100.0%").contains("flash");
    assertThat(CliRun.of(args(DemoFiles.pump(), second)).exitCode()).isZero();
    CliRun fromModel = CliRun.of(args(DemoFiles.pump(), third, "--model", model.toString()));
    assertThat(fromModel.exitCode()).as(fromModel.err()).isZero();

    for (String name : List.of("pump_state.h", "pump_state.c", "pump_state.report.json")) {
      assertThat(Files.readString(second.resolve(name))).as(name)
          .isEqualTo(Files.readString(first.resolve(name)));
    }
    // The same tree from the model file: identical code; the header's command line differs.
    assertThat(body(third.resolve("pump_state.c"))).isEqualTo(body(first.resolve("pump_state.c")));
    assertThat(Files.readString(first.resolve("pump_state.report.json")))
        .contains("\"language\" : \"c\"", "\"flash\"", "\"totalBytes\"", "\"compiler\"");
  }

  /** The file after its leading comment block, which records the command line. */
  private static String body(Path file) throws IOException {
    String text = Files.readString(file);
    return text.substring(text.indexOf("*/"));
  }
}
