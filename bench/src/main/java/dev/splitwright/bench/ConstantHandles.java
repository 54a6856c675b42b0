package dev.splitwright.bench;

import java.lang.invoke.MethodHandle;
import java.util.EnumMap;
import java.util.Map;
import java.util.Objects;

/**
 * Static final method handles for classifiers loaded at run time. HotSpot treats a static final
 * field as a constant, so {@code invokeExact} on it compiles to a direct, inlinable call, as if the
 * benchmark had called the generated class by name; a handle in an ordinary field would add an
 * indirect call per prediction. Each holder class reads its handle once, when first used, from what
 * {@link #offer} left; the benchmark's setup offers the handle before the first call.
 *
 * <p>This only works once per JVM, which JMH's forks give: each trial runs in a fresh JVM. With
 * {@code -f 0}, {@link #check} fails instead of measuring the wrong classifier.
 */
final class ConstantHandles {
  /** Which holder a handle is for. */
  enum Slot {
    BRANCHES,
    TABLE,
    FLAT,
    /** The flat class's {@code classifyAll}. */
    FLAT_ALL,
    TRIVIAL
  }

  private static final Map<Slot, MethodHandle> OFFERED = new EnumMap<>(Slot.class);

  private ConstantHandles() {}

  static synchronized void offer(Slot slot, MethodHandle handle) {
    OFFERED.put(slot, Objects.requireNonNull(handle, "handle"));
  }

  private static synchronized MethodHandle take(Slot slot) {
    MethodHandle handle = OFFERED.get(slot);
    if (handle == null) {
      throw new IllegalStateException("no classifier offered for " + slot + " before first use");
    }
    return handle;
  }

  /** Fails unless the holder of {@code slot} holds {@code expected} (initializing it if needed). */
  static void check(Slot slot, MethodHandle expected) {
    MethodHandle held = switch (slot) {
      case BRANCHES -> Branches.CLASSIFY;
      case TABLE -> Table.CLASSIFY;
      case FLAT -> Flat.CLASSIFY;
      case FLAT_ALL -> FlatAll.CLASSIFY_ALL;
      case TRIVIAL -> Trivial.CLASSIFY;
    };
    if (held != expected) {
      throw new IllegalStateException("the constant handle for " + slot + " was fixed by an"
          + " earlier trial in this JVM; run with forks (-f 1 or more), not -f 0");
    }
  }

  static final class Branches {
    static final MethodHandle CLASSIFY = take(Slot.BRANCHES);

    private Branches() {}
  }

  static final class Table {
    static final MethodHandle CLASSIFY = take(Slot.TABLE);

    private Table() {}
  }

  static final class Flat {
    static final MethodHandle CLASSIFY = take(Slot.FLAT);

    private Flat() {}
  }

  static final class FlatAll {
    static final MethodHandle CLASSIFY_ALL = take(Slot.FLAT_ALL);

    private FlatAll() {}
  }

  static final class Trivial {
    static final MethodHandle CLASSIFY = take(Slot.TRIVIAL);

    private Trivial() {}
  }
}
