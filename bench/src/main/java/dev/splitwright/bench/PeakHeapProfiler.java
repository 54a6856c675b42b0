package dev.splitwright.bench;

import com.sun.management.GarbageCollectionNotificationInfo;
import java.lang.management.GarbageCollectorMXBean;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.lang.management.MemoryUsage;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import javax.management.ListenerNotFoundException;
import javax.management.Notification;
import javax.management.NotificationEmitter;
import javax.management.NotificationListener;
import javax.management.openmbean.CompositeData;
import org.openjdk.jmh.infra.BenchmarkParams;
import org.openjdk.jmh.infra.IterationParams;
import org.openjdk.jmh.profile.InternalProfiler;
import org.openjdk.jmh.results.AggregationPolicy;
import org.openjdk.jmh.results.IterationResult;
import org.openjdk.jmh.results.Result;
import org.openjdk.jmh.results.ScalarResult;

/**
 * A JMH profiler ({@code -prof dev.splitwright.bench.PeakHeapProfiler}) that reports the most heap
 * in use at any moment of an iteration, in MiB. Heap use only grows between collections, so its
 * peaks are just before a collection: the profiler adds up every heap pool's use before each
 * collection (from the JVM's collection notifications) and takes the largest total, or the use at
 * the end of the iteration if that is larger. A full collection before the iteration starts clears
 * the garbage of setup. Summing each pool's own peak would overstate, since pools peak at different
 * times.
 *
 * <p>The figure includes garbage not yet collected, so it depends on {@code -Xmx} and the
 * collector; it is the heap the run actually occupied, not the least it could run in.
 */
public final class PeakHeapProfiler implements InternalProfiler {
  private static final double MIB = 1024.0 * 1024.0;

  private final Set<String> heapPools = new TreeSet<>();
  private final List<NotificationEmitter> emitters = new ArrayList<>();
  private final NotificationListener listener = this::onCollection;
  private volatile long peakBytes;

  public PeakHeapProfiler() {
    for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
      if (pool.getType() == MemoryType.HEAP) {
        heapPools.add(pool.getName());
      }
    }
  }

  @Override
  public String getDescription() {
    return "Peak heap in use during each iteration (before each GC, and at the end), MiB";
  }

  @Override
  public void beforeIteration(BenchmarkParams benchmarkParams, IterationParams iterationParams) {
    System.gc();
    peakBytes = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed();
    for (GarbageCollectorMXBean gc : ManagementFactory.getGarbageCollectorMXBeans()) {
      if (gc instanceof NotificationEmitter emitter) {
        emitter.addNotificationListener(listener, null, null);
        emitters.add(emitter);
      }
    }
  }

  @Override
  public Collection<? extends Result<?>> afterIteration(BenchmarkParams benchmarkParams,
      IterationParams iterationParams, IterationResult result) {
    raisePeak(ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed());
    for (NotificationEmitter emitter : emitters) {
      try {
        emitter.removeNotificationListener(listener);
      } catch (ListenerNotFoundException e) {
        // Already gone: nothing to undo.
      }
    }
    emitters.clear();
    return List.of(new ScalarResult("heap.peak", peakBytes / MIB, "MiB", AggregationPolicy.MAX));
  }

  /** The peak so far, in bytes. */
  long peakBytes() {
    return peakBytes;
  }

  private void onCollection(Notification notification, Object handback) {
    if (!GarbageCollectionNotificationInfo.GARBAGE_COLLECTION_NOTIFICATION
        .equals(notification.getType())) {
      return;
    }
    GarbageCollectionNotificationInfo info =
        GarbageCollectionNotificationInfo.from((CompositeData) notification.getUserData());
    long before = 0;
    for (Map.Entry<String, MemoryUsage> pool : info.getGcInfo().getMemoryUsageBeforeGc()
        .entrySet()) {
      if (heapPools.contains(pool.getKey())) {
        before += pool.getValue().getUsed();
      }
    }
    raisePeak(before);
  }

  private synchronized void raisePeak(long bytes) {
    if (bytes > peakBytes) {
      peakBytes = bytes;
    }
  }
}
