package dev.splitwright.train;

import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.ForkJoinTask;

/**
 * Runs work over a range of features in two shares at once, the caller's and one in the common
 * fork-join pool, when there is a second core and the work is large enough to pay for the hand-over
 * (tens of microseconds). Each share gets contiguous features and its own share index, so that it
 * can keep its own scratch buffers; results are kept per feature and combined by the caller in
 * feature order, so the outcome never depends on which share finishes first.
 */
final class TwoShares {
  /** Below this many cells (rows times features) one share does it all. */
  static final long MIN_CELLS = 1L << 17;

  private static final boolean SECOND_CORE = Runtime.getRuntime().availableProcessors() >= 2
      && ForkJoinPool.getCommonPoolParallelism() >= 1;

  /** Work on features {@code [from, to)}, as share {@code share} (0 or 1). */
  @FunctionalInterface
  interface Share {
    void run(int from, int to, int share);
  }

  private TwoShares() {}

  /** Whether {@code cells} of work are split in two. */
  static boolean splits(long cells) {
    return SECOND_CORE && cells >= MIN_CELLS;
  }

  /**
   * Runs {@code work} over {@code [0, features)}: in two shares if {@link #splits} says so, else
   * as share 0 alone. Returns when both shares are done; an exception in either is rethrown.
   */
  static void run(int features, long cells, Share work) {
    if (features < 2 || !splits(cells)) {
      work.run(0, features, 0);
      return;
    }
    int mid = features / 2;
    ForkJoinTask<?> second = ForkJoinTask.adapt(() -> work.run(mid, features, 1)).fork();
    try {
      work.run(0, mid, 0);
    } finally {
      // Not started yet (a busy pool): the caller runs it; otherwise waits for it.
      if (second.tryUnfork()) {
        second.invoke();
      } else {
        second.join();
      }
    }
  }
}
