package dev.splitwright.backend;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;

/**
 * GNU binutils' {@code size -A} as the outside reference for flash bytes: the sum of an object
 * file's {@code .text*}, {@code .rodata*} and {@code .data*} sections as that tool lists them.
 */
public final class BinutilsSize {
  private BinutilsSize() {}

  /** The flash bytes {@code size} ({@code size} or {@code arm-none-eabi-size}) lists. */
  public static long flashBytes(String size, Path object) throws IOException,
      InterruptedException {
    Process process = new ProcessBuilder(size, "-A", object.toString())
        .redirectErrorStream(true).start();
    String text = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertThat(process.waitFor(60, TimeUnit.SECONDS)).isTrue();
    assertThat(process.exitValue()).as(text).isZero();
    // One line per allocated section: "name size address".
    long total = 0;
    for (String line : text.lines().toList()) {
      String[] cols = line.trim().split("\\s+");
      if (cols.length == 3 && cols[1].matches("\\d+") && flashName(cols[0])) {
        total += Long.parseLong(cols[1]);
      }
    }
    return total;
  }

  private static boolean flashName(String name) {
    for (String base : List.of(".text", ".rodata", ".data")) {
      if (name.equals(base) || name.startsWith(base + ".")) {
        return true;
      }
    }
    return false;
  }
}
