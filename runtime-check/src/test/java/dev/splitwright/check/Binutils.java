package dev.splitwright.check;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Runs GNU binutils' {@code size -A}, {@code nm -S} and {@code readelf -A} (or their {@code
 * arm-none-eabi-} twins) on an object file and parses their text output: the outside reference the
 * ELF reader and the Cortex-M images are checked against.
 */
final class Binutils {

  /** One row of {@code size -A}: section name and size in bytes. */
  record SizeRow(String name, long size) {}

  /** One row of {@code nm -S} that has a size: symbol name, value and size. */
  record NmRow(String name, long value, long size, char kind) {}

  // size -A (System V format): "section size addr", one section per line, then "Total N".
  private static final Pattern SIZE_ROW = Pattern.compile("(\\S+)\\s+(\\d+)\\s+(\\d+)");
  // nm -S: "value size kind name" for symbols with a size, "value kind name" otherwise.
  private static final Pattern NM_ROW =
      Pattern.compile("([0-9a-f]+) ([0-9a-f]+) (\\S) (\\S+)");

  private Binutils() {}

  static List<SizeRow> sizeA(String tool, Path object) throws IOException, InterruptedException {
    List<SizeRow> rows = new ArrayList<>();
    for (String line : run(List.of(tool, "-A", "-d", object.toString()))) {
      Matcher m = SIZE_ROW.matcher(line.strip());
      if (m.matches()) {
        rows.add(new SizeRow(m.group(1), Long.parseLong(m.group(2))));
      }
    }
    return rows;
  }

  static List<NmRow> nmSized(String tool, Path object) throws IOException, InterruptedException {
    List<NmRow> rows = new ArrayList<>();
    for (String line : run(List.of(tool, "-S", object.toString()))) {
      Matcher m = NM_ROW.matcher(line.strip());
      if (m.matches()) {
        rows.add(
            new NmRow(
                m.group(4),
                Long.parseUnsignedLong(m.group(1), 16),
                Long.parseUnsignedLong(m.group(2), 16),
                m.group(3).charAt(0)));
      }
    }
    return rows;
  }

  /** The lines of {@code readelf -A}: the ARM build attributes, e.g. {@code Tag_CPU_arch: v7}. */
  static List<String> readelfAttributes(String tool, Path file)
      throws IOException, InterruptedException {
    return run(List.of(tool, "-A", file.toString())).stream().map(String::strip).toList();
  }

  private static List<String> run(List<String> command) throws IOException, InterruptedException {
    ProcessBuilder builder = new ProcessBuilder(command).redirectErrorStream(true);
    builder.environment().put("LC_ALL", "C");
    Process process = builder.start();
    String output = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    if (!process.waitFor(30, TimeUnit.SECONDS)) {
      process.destroyForcibly();
      throw new IllegalStateException(command + " did not finish in 30 s");
    }
    if (process.exitValue() != 0) {
      throw new IllegalStateException(command + " failed:\n" + output);
    }
    return output.lines().toList();
  }
}
