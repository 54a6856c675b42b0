package dev.splitwright.bench;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Collection;
import org.junit.jupiter.api.Test;
import org.openjdk.jmh.results.Result;

class PeakHeapProfilerTest {
  private static final int MIB = 1024 * 1024;

  /** Kept reachable so the allocation cannot be optimised away. */
  private static volatile long[] held;

  @Test
  void reportsAtLeastWhatTheIterationHeld() {
    PeakHeapProfiler profiler = new PeakHeapProfiler();
    profiler.beforeIteration(null, null);
    held = new long[64 * MIB / Long.BYTES];
    Collection<? extends Result<?>> results = profiler.afterIteration(null, null, null);

    assertThat(results).hasSize(1);
    Result<?> peak = results.iterator().next();
    assertThat(peak.getLabel()).isEqualTo("heap.peak");
    assertThat(peak.getScoreUnit()).isEqualTo("MiB");
    assertThat(peak.getScore()).isGreaterThanOrEqualTo(64.0);
    held = null;
  }

  @Test
  void catchesAPeakThatACollectionFreedBeforeTheEnd() throws InterruptedException {
    PeakHeapProfiler profiler = new PeakHeapProfiler();
    profiler.beforeIteration(null, null);
    held = new long[96 * MIB / Long.BYTES];
    held = null;
    System.gc();
    // Collection notifications arrive on a JMX thread, shortly after the collection.
    long deadline = System.nanoTime() + 10_000_000_000L;
    while (profiler.peakBytes() < 96L * MIB && System.nanoTime() < deadline) {
      Thread.sleep(20);
    }
    Result<?> peak = profiler.afterIteration(null, null, null).iterator().next();

    assertThat(peak.getScore()).isGreaterThanOrEqualTo(96.0);
  }
}
