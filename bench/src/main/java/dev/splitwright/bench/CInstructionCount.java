package dev.splitwright.bench;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CEmitter;
import dev.splitwright.cgen.CSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.DecisionTree;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.TimeUnit;

/**
 * Counts the machine instructions an emitted C classifier executes, with valgrind's callgrind
 * tool: the classifier and a small driver are built by the host C compiler as separate objects
 * (so the call is never inlined), the driver calls {@code <base>_classify} once per input row, and
 * callgrind collects only while that function runs ({@code --toggle-collect}, from its first
 * instruction to its return, callees included). The driver's own loop, its file reading and the
 * C library are therefore never counted and nothing needs subtracting. Callgrind simulates the
 * program instruction by instruction, so the count depends only on the binary and its input,
 * never on the machine's load.
 */
final class CInstructionCount {
  private static final long TIMEOUT_MINUTES = 10;

  private final Path workDirectory;
  private final String compiler;

  /**
   * @param workDirectory where sources, objects, inputs and callgrind files are written
   * @param compiler the host C compiler command, e.g. {@code gcc}
   */
  CInstructionCount(Path workDirectory, String compiler) {
    this.workDirectory = Objects.requireNonNull(workDirectory, "workDirectory");
    this.compiler = Objects.requireNonNull(compiler, "compiler");
  }

  /** One measurement: instructions inside the classify function over all rows, and the rows. */
  record Count(long instructions, int rows) {
    double perClassification() {
      return (double) instructions / rows;
    }
  }

  /** Why the count cannot be taken here (a missing tool), or empty if it can. */
  static Optional<String> missingTool(String compiler) {
    for (List<String> probe : List.of(List.of("valgrind", "--version"),
        List.of(compiler, "--version"))) {
      try {
        Process p = new ProcessBuilder(probe).redirectErrorStream(true)
            .redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
        if (!p.waitFor(1, TimeUnit.MINUTES) || p.exitValue() != 0) {
          return Optional.of("'" + String.join(" ", probe) + "' failed");
        }
      } catch (IOException e) {
        return Optional.of(probe.get(0) + " not found (Debian: apt-get install "
            + (probe.get(0).equals("valgrind") ? "valgrind" : "gcc") + ")");
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        return Optional.of("interrupted");
      }
    }
    return Optional.empty();
  }

  /**
   * Emits {@code tree} with {@code options}, builds it with {@code flags}, runs it over {@code
   * rows} under callgrind and returns the instructions counted. The driver's sum of the returned
   * classes is checked against the tree's own predictions, so a count is never of a wrong build.
   *
   * @param cell a name for this measurement's files (lower case letters, digits, dashes)
   */
  Count count(String cell, DecisionTree tree, CEmitOptions options, String flags,
      float[][] rows) {
    try {
      Path dir = Files.createDirectories(workDirectory.resolve(cell));
      CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
      Files.writeString(dir.resolve(source.headerName()), source.headerText(),
          StandardCharsets.US_ASCII);
      Files.writeString(dir.resolve(source.sourceName()), source.sourceText(),
          StandardCharsets.US_ASCII);
      Files.writeString(dir.resolve("driver.c"), driver(options, source.headerName()),
          StandardCharsets.US_ASCII);
      Path inputs = dir.resolve("inputs.bin");
      Files.write(inputs, rawFloats(rows, tree.schema().featureCount()));
      List<String> cflags = List.of(flags.trim().split("\\s+"));
      compile(dir, cflags, source.sourceName(), "classifier.o");
      compile(dir, cflags, "driver.c", "driver.o");
      run(dir, List.of(compiler, "-o", "driver", "driver.o", "classifier.o"));
      Path out = dir.resolve("callgrind.out");
      Files.deleteIfExists(out);
      String printed = run(dir, List.of("valgrind", "--tool=callgrind", "--quiet",
          "--callgrind-out-file=" + out.getFileName(),
          "--toggle-collect=" + options.baseName() + "_classify",
          "./driver", inputs.getFileName().toString(), Integer.toString(rows.length))).trim();
      long expected = 0;
      for (float[] row : rows) {
        expected += tree.predict(row);
      }
      if (!printed.equals(Long.toString(expected))) {
        throw new IllegalStateException(cell + ": the C classifier's classes sum to '" + printed
            + "', the model's to " + expected);
      }
      long instructions = totalInstructions(Files.readAllLines(out, StandardCharsets.UTF_8));
      if (instructions <= 0) {
        throw new IllegalStateException(cell + ": callgrind counted no instruction in "
            + options.baseName() + "_classify (was the function renamed or inlined?)");
      }
      return new Count(instructions, rows.length);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /**
   * The event total of a callgrind output file: its {@code summary:} line (or {@code totals:},
   * which newer versions write instead), whose first number is the first event, {@code Ir}
   * (callgrind manual, "Callgrind Format Specification").
   */
  static long totalInstructions(List<String> callgrindOut) {
    for (String line : callgrindOut) {
      if (line.startsWith("summary:") || line.startsWith("totals:")) {
        String[] parts = line.substring(line.indexOf(':') + 1).trim().split("\\s+");
        return Long.parseLong(parts[0]);
      }
    }
    throw new IllegalStateException("no summary or totals line in the callgrind output");
  }

  /** The rows as consecutive little-endian IEEE 754 singles, NaN payloads kept. */
  private static byte[] rawFloats(float[][] rows, int features) {
    ByteBuffer buffer = ByteBuffer.allocate(rows.length * features * Float.BYTES)
        .order(ByteOrder.LITTLE_ENDIAN);
    for (float[] row : rows) {
      for (int f = 0; f < features; f++) {
        buffer.putInt(Float.floatToRawIntBits(row[f]));
      }
    }
    return buffer.array();
  }

  private static String driver(CEmitOptions options, String header) {
    String count = options.macroPrefix() + "_FEATURE_COUNT";
    return String.join("\n",
        "/* Calls the classifier once per row of a file of little-endian floats. */",
        "#include <stdio.h>",
        "#include <stdlib.h>",
        "#include \"" + header + "\"",
        "",
        "int main(int argc, char **argv)",
        "{",
        "    long rows, r;",
        "    float *x;",
        "    unsigned long sum = 0;",
        "    FILE *in;",
        "    if (argc != 3) {",
        "        return 2;",
        "    }",
        "    rows = strtol(argv[2], NULL, 10);",
        "    x = malloc((size_t)rows * " + count + " * sizeof(float));",
        "    in = fopen(argv[1], \"rb\");",
        "    if (x == NULL || in == NULL",
        "            || fread(x, sizeof(float) * " + count + ", (size_t)rows, in)"
            + " != (size_t)rows) {",
        "        return 3;",
        "    }",
        "    fclose(in);",
        "    for (r = 0; r < rows; r++) {",
        "        sum += (unsigned long)" + options.baseName() + "_classify(x + r * " + count
            + ");",
        "    }",
        "    printf(\"%lu\\n\", sum);",
        "    free(x);",
        "    return 0;",
        "}",
        "");
  }

  private void compile(Path dir, List<String> flags, String source, String object) {
    List<String> command = new ArrayList<>();
    command.add(compiler);
    command.add("-std=c99");
    command.addAll(flags);
    command.addAll(List.of("-c", source, "-o", object));
    run(dir, command);
  }

  /** Runs {@code command} in {@code dir}; returns its standard output, fails on a non-zero exit. */
  private static String run(Path dir, List<String> command) {
    try {
      Path log = Files.createTempFile(dir, "stderr", ".txt");
      Process p = new ProcessBuilder(command).directory(dir.toFile())
          .redirectError(log.toFile()).start();
      String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
      if (!p.waitFor(TIMEOUT_MINUTES, TimeUnit.MINUTES)) {
        p.destroyForcibly();
        throw new IllegalStateException("timed out: " + String.join(" ", command));
      }
      String err = Files.readString(log, StandardCharsets.UTF_8);
      Files.delete(log);
      if (p.exitValue() != 0) {
        throw new IllegalStateException(String.format(Locale.ROOT, "'%s' exited with %d: %s",
            String.join(" ", command), p.exitValue(), err.strip()));
      }
      return out;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted: " + String.join(" ", command), e);
    }
  }
}
