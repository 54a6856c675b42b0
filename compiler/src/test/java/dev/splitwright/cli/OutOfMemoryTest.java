package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Past the heap, the command line still ends with one line and exit 2, and writes nothing. Runs
 * {@link Main} in a child JVM with a 32 MB heap, since an out-of-memory error in this test JVM
 * would disturb every other test.
 */
class OutOfMemoryTest {
  @TempDir Path dir;

  @Test
  void runningOutOfHeapIsOneLineAndWritesNothing() throws IOException, InterruptedException {
    // 600000 rows x 7 cells at about 30 bytes a cell need some 120 MB, far past 32 MB.
    Path csv = dir.resolve("big.csv");
    try (Writer w = Files.newBufferedWriter(csv, StandardCharsets.UTF_8)) {
      w.write("a,b,c,d,e,f,label\n");
      for (int i = 0; i < 600_000; i++) {
        w.write(i % 97 + "," + i % 89 + "," + i % 83 + "," + i % 79 + "," + i % 73 + ","
            + i % 71 + (i % 3 == 0 ? ",x\n" : ",y\n"));
      }
    }
    Path out = dir.resolve("out");
    Path java = Path.of(System.getProperty("java.home"), "bin", "java");
    Process process = new ProcessBuilder(List.of(java.toString(), "-Xmx32m", "-cp",
        System.getProperty("java.class.path"), Main.class.getName(), "compile", "--data",
        csv.toString(), "--class", "C", "--out", out.toString()))
        .redirectOutput(ProcessBuilder.Redirect.DISCARD)
        .start();
    String err = new String(process.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
    assertThat(process.waitFor(120, TimeUnit.SECONDS)).isTrue();

    assertThat(process.exitValue()).as(err).isEqualTo(2);
    assertThat(err.strip().split("\n")).hasSize(1);
    assertThat(err).startsWith("error: out of memory (Java heap limit ")
        .contains("run java with a larger -Xmx");
    BadInputTableTest.assertNoStackTrace(err);
    assertThat(out).doesNotExist();
  }
}
