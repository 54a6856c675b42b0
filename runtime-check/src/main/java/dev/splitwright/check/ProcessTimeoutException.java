package dev.splitwright.check;

import java.time.Duration;
import java.util.Objects;

/**
 * A native process (a C compiler or a built program) did not finish within its time limit; it was
 * killed together with every process it had started.
 */
public final class ProcessTimeoutException extends Exception {

  private static final long serialVersionUID = 1L;

  private final String command;
  private final Duration limit;

  ProcessTimeoutException(String command, Duration limit) {
    super(
        "\"" + command + "\" did not finish within " + limit.toMillis()
            + " ms and was killed with the processes it started");
    this.command = Objects.requireNonNull(command, "command");
    this.limit = limit;
  }

  /** The command as shown in the message: program name and arguments, no temporary paths. */
  public String command() {
    return command;
  }

  /** The time limit that was exceeded. */
  public Duration limit() {
    return limit;
  }
}
