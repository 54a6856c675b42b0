package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.demo.DemoFiles;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CompileCommandTest {
  static final Path PUMP = DemoFiles.pump();

  @TempDir Path temp;

  private String[] compileArgs(Path out, String... extra) {
    return args(out, "state", "5", extra);
  }

  private static String[] args(Path out, String target, String maxDepth, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", PUMP.toString(),
        "--target", target, "--max-depth", maxDepth, "--package", "com.example.pump",
        "--class", "PumpState", "--out", out.toString()));
    args.addAll(List.of(extra));
    return args.toArray(new String[0]);
  }

  @Test
  void compilesTheDemoAndWritesVerifiedSourceAndReport() throws IOException {
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(compileArgs(out));

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).contains("0 mismatches").contains("branch coverage 100.0%");
    Path source = out.resolve("com/example/pump/PumpState.java");
    Path report = out.resolve("PumpState.report.json");
    assertThat(source).exists();
    assertThat(Files.readString(report)).contains("\"classFileBytes\"", "\"branchCoverage\" : 1.0",
        "\"mismatches\" : 0", "\"validation\"", "\"test\"", "\"root\"");
    // No machine-specific text may reach the outputs (STYLE.md: deterministic output).
    String text = Files.readString(source);
    assertThat(text).doesNotContain(temp.toString()).doesNotContain(System.getProperty("user.name"))
        .doesNotContain(System.getProperty("java.version"));
  }

  @Test
  void sameDataAndSeedGiveByteIdenticalOutputsUnderAnyLocale() throws IOException {
    Path first = temp.resolve("a");
    Path second = temp.resolve("b");
    assertThat(CliRun.of(compileArgs(first)).exitCode()).isZero();
    Locale saved = Locale.getDefault();
    try {
      // Turkish and German locales change case mapping and decimal separators (from memory).
      Locale.setDefault(Locale.forLanguageTag("tr-TR"));
      assertThat(CliRun.of(compileArgs(second)).exitCode()).isZero();
    } finally {
      Locale.setDefault(saved);
    }
    assertSameTree(first, second);
  }

  @Test
  void savedModelReEmitsTheSameSourceWithoutRetraining() throws IOException {
    Path model = temp.resolve("pump.model.json");
    Path first = temp.resolve("a");
    Path second = temp.resolve("b");
    assertThat(CliRun.of(compileArgs(first, "--save-model", model.toString())).exitCode()).isZero();
    CliRun reload = CliRun.of("compile", "--data", PUMP.toString(), "--target", "state",
        "--model", model.toString(), "--package", "com.example.pump", "--class", "PumpState",
        "--out", second.toString());
    assertThat(reload.exitCode()).as(reload.err()).isZero();
    String trained = Files.readString(first.resolve("com/example/pump/PumpState.java"));
    String reloaded = Files.readString(second.resolve("com/example/pump/PumpState.java"));
    // Only the options line differs (it names the model file); the code must be identical.
    assertThat(codeOf(reloaded)).isEqualTo(codeOf(trained));
  }

  private static String codeOf(String source) {
    return source.substring(source.indexOf("public final class"));
  }

  private static void assertSameTree(Path a, Path b) throws IOException {
    List<Path> filesA = list(a);
    assertThat(filesA).isNotEmpty();
    assertThat(filesA).isEqualTo(list(b));
    for (Path rel : filesA) {
      assertThat(Files.readAllBytes(b.resolve(rel))).as(rel.toString())
          .isEqualTo(Files.readAllBytes(a.resolve(rel)));
    }
  }

  private static List<Path> list(Path root) throws IOException {
    try (Stream<Path> files = Files.walk(root)) {
      return files.filter(Files::isRegularFile).map(root::relativize).sorted().toList();
    }
  }

  @Test
  void missingDataFileIsOneLineExitTwo() {
    CliRun run = CliRun.of("compile", "--data", temp.resolve("nope.csv").toString(),
        "--class", "C", "--out", temp.resolve("out").toString());
    assertOneLineError(run, "nope.csv");
  }

  @Test
  void unknownTargetIsOneLineExitTwoListingColumns() {
    CliRun run = CliRun.of(args(temp.resolve("out"), "pressure", "5"));
    assertOneLineError(run, "pressure");
    assertThat(run.err()).contains("vibration_rms_mm_s");
  }

  @Test
  void nonNumericCellInANumericColumnNamesLineAndColumn() throws IOException {
    Path csv = temp.resolve("bad.csv");
    Files.writeString(csv, "rms,temp,state\n1.5,40,ok\n2.5,forty,fault\n3.0,41,ok\n",
        StandardCharsets.UTF_8);
    CliRun run = CliRun.of("compile", "--data", csv.toString(), "--numeric", "temp",
        "--class", "C", "--out", temp.resolve("out").toString());
    assertOneLineError(run, "bad.csv:3:2");
  }

  @Test
  void maxDepthZeroIsAnOptionError() {
    CliRun run = CliRun.of(args(temp.resolve("out"), "state", "0"));
    assertOneLineError(run, "--max-depth");
    assertThat(run.err()).contains("at least 1");
  }

  @Test
  void methodCapOutsideTheJvmLimitIsAnOptionError() {
    CliRun run = CliRun.of(compileArgs(temp.resolve("out"), "--max-method-bytes", "70000"));
    assertOneLineError(run, "--max-method-bytes");
    assertThat(run.err()).contains("between 256 and 65535").doesNotContain("maxMethodBytes");
  }

  @Test
  void splitFractionsMustSumToOne() {
    CliRun run = CliRun.of(compileArgs(temp.resolve("out"), "--split", "0.5,0.2,0.2"));
    assertOneLineError(run, "--split");
  }

  private void assertOneLineError(CliRun run, String mentions) {
    assertThat(run.exitCode()).as(run.err()).isEqualTo(2);
    assertThat(run.errLines()).hasSize(1);
    assertThat(run.err()).contains(mentions).doesNotContain("\tat ");
    assertThat(temp.resolve("out")).doesNotExist();
  }
}
