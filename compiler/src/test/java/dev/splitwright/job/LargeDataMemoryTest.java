package dev.splitwright.job;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Wide and long data train and compile within a 1 GiB heap, in a child JVM so the limit is real:
 * the test JVM itself runs with surefire's -Xmx3g, and this machine's default heap (a quarter of
 * its RAM, HotSpot's ergonomics) is larger still. Columns are primitive float arrays (4 bytes a
 * cell) and training keeps per feature one sorted copy of row indices, values and labels (12 bytes
 * a cell), so 1,000,000 rows of 20 features need a few hundred MiB, not gigabytes.
 */
class LargeDataMemoryTest {
  private static final String HEAP = "-Xmx1g";

  @TempDir Path dir;

  @Test
  void trainsAndVerifiesTwoHundredFeaturesWithinOneGibibyte() throws Exception {
    Map<String, String> m = runChild(5_000, 200, 0);
    assertThat(m).containsEntry("rows", "5000").containsEntry("features", "200")
        .containsEntry("passed", "true").containsEntry("mismatches", "0");
  }

  @Test
  void trainsAndVerifiesAMillionRowsWithinOneGibibyte() throws Exception {
    Map<String, String> m = runChild(1_000_000, 18, 2);
    assertThat(m).containsEntry("rows", "1000000").containsEntry("features", "20")
        .containsEntry("passed", "true").containsEntry("mismatches", "0");
    // The loaded table alone is 80 MB of floats plus 4 MB of labels; training adds its sorted
    // copies. A cell stored as an object (16 bytes or more) would need several times this.
    assertThat(Long.parseLong(m.get("trainSampledPeakMiB"))).isLessThan(700);
  }

  private Map<String, String> runChild(int rows, int numeric, int categorical) throws Exception {
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    Path log = dir.resolve("child.out");
    Process child = new ProcessBuilder(java, HEAP, "-cp", System.getProperty("java.class.path"),
        LargeDataRun.class.getName(), dir.toString(), Integer.toString(rows),
        Integer.toString(numeric), Integer.toString(categorical))
        .redirectErrorStream(true)
        .redirectOutput(log.toFile())
        .start();
    boolean done = child.waitFor(10, TimeUnit.MINUTES);
    if (!done) {
      child.destroyForcibly();
    }
    String output = read(log);
    System.out.printf("%d x %d (%s):%n%s", rows, numeric + categorical, HEAP, output);
    assertThat(done).as("child finished in time").isTrue();
    assertThat(child.exitValue()).as(output).isZero();
    Map<String, String> values = new LinkedHashMap<>();
    for (String line : output.split("\n")) {
      int eq = line.indexOf('=');
      if (eq > 0) {
        values.put(line.substring(0, eq), line.substring(eq + 1).trim());
      }
    }
    return values;
  }

  private static String read(Path log) throws IOException {
    List<String> lines = Files.readAllLines(log, StandardCharsets.UTF_8);
    return String.join("\n", lines) + "\n";
  }
}
