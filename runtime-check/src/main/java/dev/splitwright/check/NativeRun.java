package dev.splitwright.check;

import java.time.Duration;
import java.util.Arrays;
import java.util.Objects;

/**
 * How one run of a built program ended.
 *
 * @param exitCode the exit status; a program killed by signal N reports 128 + N (e.g. 139 for a
 *     segmentation fault)
 * @param stdout everything written to standard output, byte for byte
 * @param stderr standard error decoded as UTF-8, for messages from sanitizers and the like
 * @param elapsed wall-clock time from start to exit, process start-up included
 */
public record NativeRun(int exitCode, byte[] stdout, String stderr, Duration elapsed) {

  public NativeRun {
    stdout = Objects.requireNonNull(stdout, "stdout").clone();
    Objects.requireNonNull(stderr, "stderr");
    Objects.requireNonNull(elapsed, "elapsed");
    if (elapsed.isNegative()) {
      throw new IllegalArgumentException("elapsed must be >= 0, but it is " + elapsed);
    }
  }

  /** A copy of standard output. */
  @Override
  public byte[] stdout() {
    return stdout.clone();
  }

  /** Whether the program exited with status 0. */
  public boolean succeeded() {
    return exitCode == 0;
  }

  /** Standard output read as little-endian 32-bit integers (see {@link LittleEndian}). */
  public int[] stdoutInt32s() {
    return LittleEndian.unpackInts(stdout);
  }

  @Override
  public boolean equals(Object other) {
    return other instanceof NativeRun run
        && exitCode == run.exitCode
        && Arrays.equals(stdout, run.stdout)
        && stderr.equals(run.stderr)
        && elapsed.equals(run.elapsed);
  }

  @Override
  public int hashCode() {
    return Objects.hash(exitCode, Arrays.hashCode(stdout), stderr, elapsed);
  }

  @Override
  public String toString() {
    return "NativeRun[exitCode=" + exitCode + ", stdout=" + stdout.length + " bytes, stderr="
        + stderr.length() + " chars, elapsed=" + elapsed + "]";
  }
}
