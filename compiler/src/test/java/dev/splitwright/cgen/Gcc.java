package dev.splitwright.cgen;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/**
 * Runs the host's gcc and g++ and the programs they build, with plain {@link ProcessBuilder}. A
 * stand-in until the general C-compiler runner of runtime-check is merged.
 */
final class Gcc {
  /** The flags every emitted file must pass (the style guide's, plus -Wshadow and -O2). */
  static final List<String> STRICT = List.of("-std=c99", "-O2", "-ffp-contract=off", "-Wall",
      "-Wextra", "-Wpedantic", "-Wconversion", "-Wshadow", "-Werror");
  /** Undefined behaviour and bad memory accesses abort the harness instead of passing unseen. */
  static final List<String> SANITIZE = List.of("-fsanitize=address,undefined",
      "-fno-sanitize-recover=all");

  private Gcc() {}

  /** What a process printed and returned. */
  record Result(int exit, String output) {
    Result orFail(String what) {
      if (exit != 0) {
        throw new AssertionError(what + " failed with exit " + exit + ":\n" + output);
      }
      return this;
    }
  }

  static boolean available() {
    try {
      return run(Path.of("."), List.of("gcc", "--version")).exit() == 0
          && run(Path.of("."), List.of("g++", "--version")).exit() == 0;
    } catch (IOException e) {
      return false;
    }
  }

  /** Writes {@code files} (name, text pairs) into {@code dir}. */
  static void write(Path dir, String... nameAndText) throws IOException {
    for (int i = 0; i < nameAndText.length; i += 2) {
      Files.writeString(dir.resolve(nameAndText[i]), nameAndText[i + 1], StandardCharsets.UTF_8);
    }
  }

  static Result run(Path dir, List<String> command) throws IOException {
    ProcessBuilder builder = new ProcessBuilder(command).directory(dir.toFile())
        .redirectErrorStream(true);
    // Leak checking needs ptrace, which containers often forbid; the harness allocates nothing.
    builder.environment().put("ASAN_OPTIONS", "detect_leaks=0");
    Process process = builder.start();
    process.getOutputStream().close();
    byte[] output = process.getInputStream().readAllBytes();
    try {
      if (!process.waitFor(300, TimeUnit.SECONDS)) {
        process.destroyForcibly();
        throw new IOException("timed out: " + command);
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IOException("interrupted: " + command, e);
    }
    return new Result(process.exitValue(), new String(output, StandardCharsets.UTF_8));
  }

  /** {@code gcc <flags> <files> -o <output>} (or {@code -c} when output ends in .o). */
  static Result gcc(Path dir, List<String> flags, List<String> files, String output)
      throws IOException {
    List<String> command = new ArrayList<>(List.of("gcc"));
    command.addAll(flags);
    if (output.endsWith(".o")) {
      command.add("-c");
    }
    command.addAll(files);
    command.addAll(List.of("-o", output));
    return run(dir, command);
  }

  /**
   * Builds the classifier and its harness with {@link #STRICT} and {@link #SANITIZE}, runs it on
   * {@code input} and returns the output file's bytes.
   */
  static byte[] buildAndRun(Path dir, CSource source, CEmitOptions options, byte[] input)
      throws IOException {
    String harness = CHarness.fileName(options);
    write(dir, source.headerName(), source.headerText(), source.sourceName(),
        source.sourceText(), harness, CHarness.source(options));
    List<String> flags = new ArrayList<>(STRICT);
    flags.addAll(SANITIZE);
    gcc(dir, flags, List.of(source.sourceName(), harness), "harness")
        .orFail("gcc of " + (source.sourceText().length() < 20_000 ? "\n" + source.sourceText()
            : source.sourceName()));
    Files.write(dir.resolve("in.bin"), input);
    Files.deleteIfExists(dir.resolve("out.bin"));
    List<String> command = List.of(dir.resolve("harness").toString(), "in.bin", "out.bin");
    run(dir, command).orFail("harness");
    return Files.readAllBytes(dir.resolve("out.bin"));
  }
}
