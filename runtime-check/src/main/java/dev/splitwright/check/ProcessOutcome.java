package dev.splitwright.check;

import java.time.Duration;
import java.util.Objects;

/** What a finished process left behind: its status, both outputs and its wall-clock time. */
record ProcessOutcome(int exitCode, byte[] stdout, byte[] stderr, Duration elapsed) {

  ProcessOutcome {
    Objects.requireNonNull(stdout, "stdout");
    Objects.requireNonNull(stderr, "stderr");
    Objects.requireNonNull(elapsed, "elapsed");
  }
}
