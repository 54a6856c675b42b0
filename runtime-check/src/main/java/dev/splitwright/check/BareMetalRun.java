package dev.splitwright.check;

import java.time.Duration;
import java.util.Arrays;
import java.util.Objects;

/**
 * How one emulated run of a {@link BareMetalImage} ended.
 *
 * @param exitStatus the status the image passed to {@code sw_exit} or returned from {@code main},
 *     modulo 256; {@link #FAULT_STATUS} if the core took a fault; 1 also when the emulator itself
 *     failed, which {@link #console()} then explains
 * @param output the bytes the image wrote to {@code SW_OUTPUT}, empty if it wrote none
 * @param console what the emulator printed: the image's {@code sw_log} lines and the emulator's
 *     own messages
 * @param elapsed wall-clock time of the emulator process, start-up included
 */
public record BareMetalRun(int exitStatus, byte[] output, String console, Duration elapsed) {

  /** The exit status of an image whose core took a fault ({@code SW_FAULT_STATUS}). */
  public static final int FAULT_STATUS = 250;

  public BareMetalRun {
    output = Objects.requireNonNull(output, "output").clone();
    Objects.requireNonNull(console, "console");
    Objects.requireNonNull(elapsed, "elapsed");
    if (elapsed.isNegative()) {
      throw new IllegalArgumentException("elapsed must be >= 0, but it is " + elapsed);
    }
  }

  /** A copy of the output bytes. */
  @Override
  public byte[] output() {
    return output.clone();
  }

  /** Whether the image exited with status 0. */
  public boolean succeeded() {
    return exitStatus == 0;
  }

  /** Whether the core took a fault (HardFault and the like). */
  public boolean faulted() {
    return exitStatus == FAULT_STATUS;
  }

  /** The output read as little-endian 32-bit integers (see {@link LittleEndian}). */
  public int[] outputInts() {
    return LittleEndian.unpackInts(output);
  }

  @Override
  public boolean equals(Object other) {
    return other instanceof BareMetalRun run
        && exitStatus == run.exitStatus
        && Arrays.equals(output, run.output)
        && console.equals(run.console)
        && elapsed.equals(run.elapsed);
  }

  @Override
  public int hashCode() {
    return Objects.hash(exitStatus, Arrays.hashCode(output), console, elapsed);
  }

  @Override
  public String toString() {
    return "BareMetalRun[exitStatus=" + exitStatus + ", output=" + output.length
        + " bytes, console=" + console.length() + " chars, elapsed=" + elapsed + "]";
  }
}
