package dev.splitwright.check;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A program built by {@link CCompiler#buildExecutable}, living in its own temporary directory
 * until {@link #close()} deletes it.
 *
 * <p>Runs may happen from several threads at once; {@link #close()} must come after all of them.
 */
public final class NativeExecutable implements AutoCloseable {

  private final TempDirectory directory;
  private final Path path;
  private final String diagnostics;
  private boolean closed;

  NativeExecutable(TempDirectory directory, Path path, String diagnostics) {
    this.directory = directory;
    this.path = path;
    this.diagnostics = diagnostics;
  }

  /** The executable file; valid until {@link #close()}. */
  public Path path() {
    return path;
  }

  /** What the compiler wrote to standard error although it succeeded, e.g. warnings. */
  public String diagnostics() {
    return diagnostics;
  }

  /**
   * Runs the program with {@code stdin} as its standard input, in its own directory.
   *
   * @throws ProcessTimeoutException if it runs longer than {@code limit}; it is killed then
   */
  public NativeRun run(List<String> args, byte[] stdin, Duration limit)
      throws ProcessTimeoutException {
    Objects.requireNonNull(stdin, "stdin");
    return start(args, stdin.clone(), null, limit);
  }

  /**
   * Runs the program with the contents of {@code stdinFile} as its standard input.
   *
   * @throws ProcessTimeoutException if it runs longer than {@code limit}; it is killed then
   */
  public NativeRun run(List<String> args, Path stdinFile, Duration limit)
      throws ProcessTimeoutException {
    Objects.requireNonNull(stdinFile, "stdinFile");
    if (!Files.isRegularFile(stdinFile)) {
      throw new IllegalArgumentException("stdinFile " + stdinFile + " is not a regular file");
    }
    return start(args, null, stdinFile, limit);
  }

  /**
   * Parses the executable's sections and symbols.
   *
   * @throws IOException if it cannot be read
   */
  public ElfFile elf() throws IOException {
    checkOpen();
    return ElfFile.read(path);
  }

  /** Deletes the program and its directory. */
  @Override
  public void close() {
    closed = true;
    directory.close();
  }

  private NativeRun start(List<String> args, byte[] stdin, Path stdinFile, Duration limit)
      throws ProcessTimeoutException {
    Objects.requireNonNull(args, "args");
    Objects.requireNonNull(limit, "limit");
    checkOpen();
    List<String> command = new ArrayList<>();
    command.add(path.toString());
    args.forEach(a -> command.add(Objects.requireNonNull(a, "argument")));
    ProcessBuilder builder = new ProcessBuilder(command).directory(directory.path().toFile());
    if (stdinFile != null) {
      builder.redirectInput(stdinFile.toFile());
    }
    List<String> shown = new ArrayList<>(command);
    shown.set(0, path.getFileName().toString());
    ProcessOutcome outcome =
        ProcessRunner.run(builder, ProcessRunner.display(shown), stdin, limit);
    return new NativeRun(
        outcome.exitCode(),
        outcome.stdout(),
        new String(outcome.stderr(), StandardCharsets.UTF_8),
        outcome.elapsed());
  }

  private void checkOpen() {
    if (closed) {
      throw new IllegalStateException("executable " + path.getFileName() + " was closed");
    }
  }
}
