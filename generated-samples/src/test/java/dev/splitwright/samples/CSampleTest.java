package dev.splitwright.samples;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.splitwright.check.CCompiler;
import dev.splitwright.check.ElfFile;
import dev.splitwright.check.NativeExecutable;
import dev.splitwright.check.NativeRun;
import dev.splitwright.cli.Main;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The committed C sample in {@code c/}: regenerated from its recorded command line, the header,
 * source and tree picture equal the committed files byte for byte and the report does too apart
 * from the compiler's version line and flash figures, which belong to the machine's compiler;
 * the flash the report states is the object file's; and {@code example.c} builds with the host
 * compiler and classifies its reading. Refresh with {@code -Dgolden.update=true}.
 */
class CSampleTest {
  private static final boolean UPDATE = Boolean.getBoolean("golden.update");
  private static final Path SAMPLE = Path.of("c");
  private static final String BASE = "pump_state_classifier";
  private static final Duration TIMEOUT = Duration.ofMinutes(5);

  @TempDir Path temp;

  @Test
  void regeneratedCSampleMatchesTheCommittedFiles() throws Exception {
    String demoData = System.getProperty("splitwright.demoData");
    List<String> args = new ArrayList<>(Files.readAllLines(
        Path.of("commands", "pump-firmware-c.args"), StandardCharsets.UTF_8).stream()
        .map(String::strip).filter(l -> !l.isEmpty() && !l.startsWith("#"))
        .map(l -> l.replace("${splitwright.demoData}", demoData)).toList());
    args.add("--out");
    args.add(temp.toString());
    StringWriter err = new StringWriter();
    int code = Main.run(args.toArray(new String[0]), new PrintWriter(new StringWriter()),
        new PrintWriter(err));
    assertThat(code).as(err.toString()).isZero();

    for (String name : List.of(BASE + ".h", BASE + ".c", BASE + ".tree.svg",
        BASE + ".frontier.svg", BASE + ".report.json")) {
      String actual = Files.readString(temp.resolve(name), StandardCharsets.UTF_8);
      if (UPDATE) {
        Files.writeString(SAMPLE.resolve(name), actual, StandardCharsets.UTF_8);
        continue;
      }
      String expected = Files.readString(SAMPLE.resolve(name), StandardCharsets.UTF_8);
      if (name.endsWith(".json")) {
        assertThat(machineFree(actual)).as(name).isEqualTo(machineFree(expected));
      } else {
        assertThat(actual).as(name).isEqualTo(expected);
      }
    }
  }

  @Test
  void theStatedFlashIsTheObjectFilesAndFitsTwoKibibytes() throws Exception {
    JsonNode report = new ObjectMapper().readTree(
        Files.readString(SAMPLE.resolve(BASE + ".report.json"), StandardCharsets.UTF_8));
    List<String> flags = new ArrayList<>();
    report.get("flash").get("flags").forEach(f -> flags.add(f.asText()));
    CCompiler cc = CCompiler.find("cc", flags, TIMEOUT);
    ElfFile object = cc.compileObjects(Map.of(BASE + ".h", read(BASE + ".h"), BASE + ".c",
        read(BASE + ".c"))).elf(BASE + ".c");

    // The report was written on some machine; this one's compiler may differ, so the committed
    // figure is checked against the budget, and this machine's object against the same rule.
    assertThat(report.get("flash").get("totalBytes").asLong()).isLessThanOrEqualTo(2048)
        .isEqualTo(report.get("selection").get("chosen").get("flashBytes").asLong());
    assertThat(report.get("selection").get("budgetUnit").asText()).isEqualTo("flash");
    assertThat(object.flashBytes()).isPositive().isLessThanOrEqualTo(2048);
    assertThat(report.get("language").asText()).isEqualTo("c");
    assertThat(report.get("verification").get("mismatches").asLong()).isZero();
  }

  @Test
  void exampleBuildsAndClassifiesItsReading() throws Exception {
    CCompiler cc = CCompiler.find("cc", List.of("-std=c99", "-Os", "-Wall", "-Wextra",
        "-Wpedantic", "-Werror"), TIMEOUT);
    try (NativeExecutable example = cc.buildExecutable(Map.of("example.c", read("example.c"),
        BASE + ".h", read(BASE + ".h"), BASE + ".c", read(BASE + ".c")))) {
      NativeRun run = example.run(List.of(), new byte[0], TIMEOUT);

      // The reading is the first row of the demo CSV, labelled normal there.
      assertThat(run.exitCode()).as(run.stderr()).isZero();
      assertThat(new String(run.stdout(), StandardCharsets.UTF_8)).isEqualTo("state: normal\n");
    }
  }

  private static String read(String name) throws IOException {
    return Files.readString(SAMPLE.resolve(name), StandardCharsets.UTF_8);
  }

  /** The report without what depends on the machine's compiler. */
  private static JsonNode machineFree(String json) throws IOException {
    ObjectNode report = (ObjectNode) new ObjectMapper().readTree(json);
    report.remove("flash");
    ((ObjectNode) report.get("verification")).remove("compiler");
    return report;
  }
}
