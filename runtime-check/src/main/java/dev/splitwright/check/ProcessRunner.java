package dev.splitwright.check;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.time.Duration;
import java.util.List;
import java.util.Objects;
import java.util.concurrent.CancellationException;
import java.util.concurrent.TimeUnit;

/**
 * Runs one native process to completion under a time limit. Standard output and error are drained
 * by their own threads while standard input is fed by a third, so a process that fills one pipe
 * while we wait on another cannot deadlock. On timeout the whole process tree is killed.
 */
final class ProcessRunner {

  /** How long to wait for a killed process and its pipes to close; SIGKILL is normally instant. */
  private static final Duration GRACE = Duration.ofSeconds(5);

  private ProcessRunner() {}

  /**
   * Starts {@code builder} and waits for it.
   *
   * @param display the command as shown in messages
   * @param stdin bytes to feed to standard input, or {@code null} for none (standard input is
   *     closed at once unless the builder redirects it)
   */
  static ProcessOutcome run(ProcessBuilder builder, String display, byte[] stdin, Duration limit)
      throws ProcessTimeoutException {
    Objects.requireNonNull(limit, "limit");
    if (limit.isNegative() || limit.isZero()) {
      throw new IllegalArgumentException("time limit must be positive, but it is " + limit);
    }
    long start = System.nanoTime();
    long deadline = start + limit.toNanos();
    Process process;
    try {
      process = builder.start();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot start \"" + display + "\"", e);
    }
    Drain out = new Drain(process.getInputStream(), "stdout");
    Drain err = new Drain(process.getErrorStream(), "stderr");
    Thread feeder = feed(process, stdin);
    try {
      boolean exited = process.waitFor(remaining(deadline), TimeUnit.NANOSECONDS);
      // A process may exit while a child it started still holds the pipes open.
      if (!exited || !out.await(deadline) || !err.await(deadline)) {
        destroyTree(process);
        out.await(System.nanoTime() + GRACE.toNanos());
        err.await(System.nanoTime() + GRACE.toNanos());
        throw new ProcessTimeoutException(display, limit);
      }
      feeder.join(TimeUnit.NANOSECONDS.toMillis(GRACE.toNanos()));
    } catch (InterruptedException e) {
      destroyTree(process);
      Thread.currentThread().interrupt();
      CancellationException cancelled =
          new CancellationException("interrupted while waiting for \"" + display + "\"");
      cancelled.initCause(e);
      throw cancelled;
    }
    out.rethrow();
    err.rethrow();
    return new ProcessOutcome(
        process.exitValue(), out.bytes(), err.bytes(), Duration.ofNanos(System.nanoTime() - start));
  }

  /** Quote-free rendering of a command line for messages. */
  static String display(List<String> command) {
    return String.join(" ", command);
  }

  private static long remaining(long deadline) {
    return Math.max(0, deadline - System.nanoTime());
  }

  private static Thread feed(Process process, byte[] stdin) {
    Thread feeder =
        new Thread(
            () -> {
              try (OutputStream in = process.getOutputStream()) {
                if (stdin != null) {
                  in.write(stdin);
                }
              } catch (IOException e) {
                // The program exited or closed its input without reading everything: its
                // exit status and output tell the caller what happened.
              }
            },
            "splitwright-process-stdin");
    feeder.setDaemon(true);
    feeder.start();
    return feeder;
  }

  /**
   * Kills the process and all its descendants. The descendants are listed first, because once the
   * parent is dead its children are re-parented and no longer reachable from it.
   */
  private static void destroyTree(Process process) {
    List<ProcessHandle> descendants = process.descendants().toList();
    process.destroyForcibly();
    for (ProcessHandle child : descendants) {
      child.descendants().forEach(ProcessHandle::destroyForcibly);
      child.destroyForcibly();
    }
    try {
      process.waitFor(GRACE.toMillis(), TimeUnit.MILLISECONDS);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }

  /** Copies one output pipe into memory on its own thread. */
  private static final class Drain {

    private final ByteArrayOutputStream buffer = new ByteArrayOutputStream();
    private final Thread thread;
    private volatile IOException failure;

    Drain(InputStream source, String name) {
      thread =
          new Thread(
              () -> {
                try (source) {
                  source.transferTo(buffer);
                } catch (IOException e) {
                  failure = e;
                }
              },
              "splitwright-process-" + name);
      thread.setDaemon(true);
      thread.start();
    }

    boolean await(long deadline) throws InterruptedException {
      long millis = TimeUnit.NANOSECONDS.toMillis(remaining(deadline));
      thread.join(Math.max(1, millis));
      return !thread.isAlive();
    }

    void rethrow() {
      if (failure != null) {
        throw new UncheckedIOException("cannot read process output", failure);
      }
    }

    byte[] bytes() {
      return buffer.toByteArray();
    }
  }
}
