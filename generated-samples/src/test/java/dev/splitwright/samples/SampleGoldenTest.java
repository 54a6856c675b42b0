package dev.splitwright.samples;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.fail;

import dev.splitwright.cli.Main;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Regenerates each committed sample from its CSV with its recorded command line and compares the
 * source, report, frontier SVG and tree SVG byte for byte. Refresh after an intended change with
 * {@value #REFRESH} and review the diff before committing; CI never refreshes.
 */
class SampleGoldenTest {
  static final String REFRESH = "mvn -B -pl generated-samples -am test -Dtest=SampleGoldenTest "
      + "-Dsurefire.failIfNoSpecifiedTests=false -Dgolden.update=true";

  private static final boolean UPDATE = Boolean.getBoolean("golden.update");
  private static final String DEMO_DATA = "${splitwright.demoData}";

  @TempDir Path temp;

  @ParameterizedTest
  @ValueSource(strings = {"pump-monitor", "gesture-band"})
  void regeneratedSampleMatchesTheCommittedFiles(String sample) throws IOException {
    List<String> args = new ArrayList<>(recordedArgs(sample));
    args.add("--out");
    args.add(temp.toString());
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = Main.run(args.toArray(new String[0]), new PrintWriter(out), new PrintWriter(err));
    assertThat(code).as("splitwright %s failed: %s", String.join(" ", args), err).isZero();

    List<Path> produced = files(temp);
    // Source, report, frontier chart and tree picture.
    assertThat(produced).as("files written for %s", sample).hasSize(4);
    StringBuilder diffs = new StringBuilder();
    for (Path rel : produced) {
      Path committed = committedPlace(rel);
      String actual = Files.readString(temp.resolve(rel), StandardCharsets.UTF_8);
      if (UPDATE) {
        Files.createDirectories(committed.getParent());
        Files.writeString(committed, actual, StandardCharsets.UTF_8);
        continue;
      }
      String expected = Files.exists(committed)
          ? Files.readString(committed, StandardCharsets.UTF_8) : "";
      if (!expected.equals(actual)) {
        diffs.append(UnifiedDiff.of(committed.toString(), expected, "regenerated " + rel, actual));
      }
    }
    if (diffs.length() > 0) {
      fail("sample '%s' no longer matches its committed files:%n%s%nIf the change is intended, "
          + "refresh the goldens with:%n  %s%nand review the diff.", sample, diffs, REFRESH);
    }
  }

  /**
   * The sample's command line: one argument a line, '#' comments; {@value #DEMO_DATA} stands for
   * the demo data directory the build declares (system property {@code splitwright.demoData}).
   */
  static List<String> recordedArgs(String sample) throws IOException {
    String demoData = System.getProperty("splitwright.demoData");
    assertThat(demoData).as("system property splitwright.demoData (set by the parent pom)")
        .isNotBlank();
    return Files.readAllLines(Path.of("commands", sample + ".args"), StandardCharsets.UTF_8)
        .stream().map(String::strip).filter(l -> !l.isEmpty() && !l.startsWith("#"))
        .map(l -> l.replace(DEMO_DATA, demoData)).toList();
  }

  /** Sources live in the module's source tree; reports and pictures in {@code reports/}. */
  static Path committedPlace(Path relative) {
    return relative.toString().endsWith(".java")
        ? Path.of("src/main/java").resolve(relative)
        : Path.of("reports").resolve(relative.getFileName());
  }

  static List<Path> files(Path root) throws IOException {
    try (Stream<Path> walk = Files.walk(root)) {
      return walk.filter(Files::isRegularFile).map(root::relativize).sorted().toList();
    }
  }
}
