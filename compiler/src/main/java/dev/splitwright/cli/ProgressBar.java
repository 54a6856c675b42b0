package dev.splitwright.cli;

import dev.splitwright.select.SearchProgress;
import dev.splitwright.select.SearchStats;
import java.io.PrintWriter;
import java.util.Locale;
import java.util.Objects;
import java.util.function.LongSupplier;

/**
 * A one-line progress bar, redrawn in place with a carriage return: stage, bar, steps done of
 * total and elapsed seconds. Drawn only when enabled (stderr is a terminal and not {@code
 * --quiet}), so logs of CI runs stay free of it; at most ten redraws a second.
 */
final class ProgressBar implements SearchProgress {
  private static final int BAR = 24;
  private static final long REDRAW_NANOS = 100_000_000L;

  private final PrintWriter err;
  private final boolean enabled;
  private final LongSupplier clock;
  private final long start;
  private long lastDraw = Long.MIN_VALUE;
  private int lastWidth;
  private SearchStats stats;

  ProgressBar(PrintWriter err, boolean enabled, LongSupplier nanoClock) {
    this.err = Objects.requireNonNull(err, "err");
    this.enabled = enabled;
    this.clock = Objects.requireNonNull(nanoClock, "nanoClock");
    this.start = nanoClock.getAsLong();
  }

  /** A bar on {@code err} if the process has a console and {@code quiet} is off. */
  static ProgressBar forTerminal(PrintWriter err, boolean quiet) {
    return new ProgressBar(err, !quiet && System.console() != null, System::nanoTime);
  }

  @Override
  public void update(String stage, int done, int total) {
    if (!enabled) {
      return;
    }
    long now = clock.getAsLong();
    if (done < total && lastDraw != Long.MIN_VALUE && now - lastDraw < REDRAW_NANOS) {
      return;
    }
    lastDraw = now;
    int filled = total <= 0 ? BAR : (int) ((long) BAR * done / total);
    String text = String.format(Locale.ROOT, "%-16s [%s%s] %d/%d  %.1f s", stage,
        "#".repeat(filled), "-".repeat(BAR - filled), done, total, (now - start) / 1e9);
    err.print("\r" + text + " ".repeat(Math.max(0, lastWidth - text.length())));
    err.flush();
    lastWidth = text.length();
  }

  @Override
  public void finished(SearchStats stats) {
    this.stats = stats;
    if (enabled && lastWidth > 0) {
      err.print("\r" + " ".repeat(lastWidth) + "\r");
      err.flush();
      lastWidth = 0;
    }
  }

  /** What the search reported when it finished, if it did. */
  SearchStats stats() {
    return stats;
  }
}
