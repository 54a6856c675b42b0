package dev.splitwright.onchip;

/**
 * Instructions per classify call measured on the emulated core (qemu's {@code -icount} clock read
 * through SysTick), each to within {@link BareMetalHarness#COUNT_RESOLUTION}. The emulator counts
 * instructions, not cycles: a Cortex-M0+ takes about one to three cycles per instruction.
 *
 * @param calls classify calls measured
 * @param best the fewest instructions of one call
 * @param worst the most instructions of one call
 * @param mean instructions per call on average
 */
public record InstructionCounts(int calls, long best, long worst, double mean) {

  public InstructionCounts {
    if (calls <= 0 || best < 0 || worst < best || mean < best || mean > worst) {
      throw new IllegalArgumentException("inconsistent counts: calls " + calls + ", best " + best
          + ", worst " + worst + ", mean " + mean);
    }
  }

  /** The counts of each call. */
  static InstructionCounts of(long[] perCall) {
    long best = Long.MAX_VALUE;
    long worst = 0;
    long sum = 0;
    for (long n : perCall) {
      best = Math.min(best, n);
      worst = Math.max(worst, n);
      sum += n;
    }
    return new InstructionCounts(perCall.length, best, worst, (double) sum / perCall.length);
  }
}
