package dev.splitwright.check;

import java.util.Objects;

/**
 * The C compiler exited with a non-zero status. The message is the first error line; {@link
 * #stderr()} has everything the compiler wrote.
 */
public final class CCompileException extends Exception {

  private static final long serialVersionUID = 1L;

  private final String command;
  private final int exitCode;
  private final String stderr;
  private final String firstErrorLine;

  CCompileException(String command, int exitCode, String stderr) {
    this(command, exitCode, stderr, firstErrorLine(command, exitCode, stderr));
  }

  private CCompileException(String command, int exitCode, String stderr, String firstError) {
    super(firstError);
    this.command = Objects.requireNonNull(command, "command");
    this.exitCode = exitCode;
    this.stderr = Objects.requireNonNull(stderr, "stderr");
    this.firstErrorLine = firstError;
  }

  /** The command as run, e.g. {@code cc -Os -c a.c b.c}, without temporary paths. */
  public String command() {
    return command;
  }

  /** The compiler's exit status. */
  public int exitCode() {
    return exitCode;
  }

  /** Everything the compiler wrote to standard error. */
  public String stderr() {
    return stderr;
  }

  /**
   * The first line of {@link #stderr()} that contains {@code error}, else its first non-blank line,
   * else a sentence saying the compiler failed silently.
   */
  public String firstErrorLine() {
    return firstErrorLine;
  }

  static String firstErrorLine(String command, int exitCode, String stderr) {
    return stderr
        .lines()
        .filter(line -> line.contains("error"))
        .findFirst()
        .or(() -> stderr.lines().filter(line -> !line.isBlank()).findFirst())
        .orElse(
            "\"" + command + "\" exited with status " + exitCode
                + " and wrote nothing to standard error");
  }
}
