package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Before the first large {@link CartTrainer#train} of a JVM, grows one tree on an evenly spaced
 * sample of the same rows, with the same options, and throws it away. On a cold JVM the JIT
 * otherwise compiles the trainer's loops in the middle of their first million-row passes, from
 * profiles that have never seen a loop end or a rare branch taken, and then throws that code away
 * again and again (HotSpot's "unstable_if" traps): measured on the bench's 1,000,000 x 20 set, the
 * sample costs about 0.15 s and saves about 0.5 s. The sample's tree has no effect on the real one.
 */
final class JitPrimer {
  /** Rows times features from which priming pays for itself. */
  static final long MIN_CELLS = 1L << 22;
  static final int SAMPLE_ROWS = 5000;

  private static final AtomicBoolean PRIMED = new AtomicBoolean();

  private JitPrimer() {}

  /** Primes once per JVM, on the first call whose data has at least {@link #MIN_CELLS} cells. */
  static void primeFor(Dataset data, TrainingOptions options) {
    long cells = (long) data.rows() * data.featureCount();
    if (cells < MIN_CELLS || !PRIMED.compareAndSet(false, true)) {
      return;
    }
    new TreeGrower(sample(data), options).grow();
  }

  /** {@link #SAMPLE_ROWS} rows spread evenly over {@code data}, in order. */
  static Dataset sample(Dataset data) {
    int[] rows = new int[Math.min(SAMPLE_ROWS, data.rows())];
    for (int i = 0; i < rows.length; i++) {
      rows[i] = (int) ((long) i * data.rows() / rows.length);
    }
    return data.subset(rows);
  }
}
