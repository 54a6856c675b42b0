package dev.splitwright.select;

import dev.splitwright.check.InMemoryCompiler;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;

/**
 * A second javac and a thread to run it on, so that a batch of candidates can be emitted and
 * compiled in two halves at once on a machine with two cores or more. One of each per JVM and set
 * of options: javac's compilers and file managers are costly to set up and not to be shared between
 * threads, so each is only ever used under its own lock ({@link InMemoryCompiler#compile}).
 */
final class SecondJavac {
  /** Whether a second thread can run beside the caller's. */
  static final boolean AVAILABLE = Runtime.getRuntime().availableProcessors() >= 2;

  private static final Map<List<String>, InMemoryCompiler> COMPILERS = new HashMap<>();
  private static final ExecutorService THREAD = Executors.newSingleThreadExecutor(task -> {
    Thread thread = new Thread(task, "splitwright-second-javac");
    thread.setDaemon(true);
    return thread;
  });

  private SecondJavac() {}

  /** The second compiler for {@code options}, made on first use. */
  static synchronized InMemoryCompiler compiler(List<String> options) {
    return COMPILERS.computeIfAbsent(List.copyOf(options), InMemoryCompiler::create);
  }

  /** The thread the second half runs on. */
  static ExecutorService thread() {
    return THREAD;
  }
}
