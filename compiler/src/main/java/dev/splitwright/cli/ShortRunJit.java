package dev.splitwright.cli;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.management.JMException;
import javax.management.ObjectName;

/**
 * Leaves HotSpot's optimising compiler (C2) out of a short run. A compile on a small CSV spends
 * most of its time in javac and the emitter, code the JIT meets cold: on the project's 2-core
 * machine, {@code -XX:+CITime} counted 3.7 s of C2 work in a 4-second README demo run, which C1's
 * code never earns back. The quick compiler (C1) still compiles everything hot. Applied through
 * the DiagnosticCommand MBean's {@code compilerDirectivesAdd} (HotSpot's compiler directives, JDK
 * 9 on), so it needs no JVM flag; on a JVM without it nothing changes.
 *
 * <p>Only a real process asks for it ({@link #allow}, from {@link Main#main}): tests that call
 * the command line in-process keep their JVM's C2.
 */
final class ShortRunJit {
  /** A CSV up to this size is a short run; larger training sets earn C2's time back. */
  static final long SMALL_CSV_BYTES = 1L << 20;
  /** Every method: no C2 compilation. */
  static final String NO_C2 = "[{match: \"*.*\", c2: {Exclude: true}}]";

  private static volatile boolean allowed;

  private ShortRunJit() {}

  /** Lets {@link #forData} apply the directive: called by the process entry only. */
  static void allow() {
    allowed = true;
  }

  /**
   * Applies {@link #NO_C2} when allowed and {@code csv} is a small file, on a thread of its own:
   * the platform MBean server takes a tenth of a second to start, which the job need not wait
   * for. Never fails.
   */
  static void forData(Path csv) {
    try {
      if (!allowed || Files.size(csv) > SMALL_CSV_BYTES) {
        return;
      }
    } catch (IOException e) {
      return; // the job reports the file
    }
    Thread thread = new Thread(() -> {
      try {
        add(NO_C2);
      } catch (IOException | RuntimeException e) {
        // Only a speed-up: a refusal changes nothing.
      }
    }, "splitwright-jit-directive");
    thread.setDaemon(true);
    thread.start();
  }

  /**
   * Adds {@code directives} (HotSpot's JSON form) to the compiler's directive stack.
   *
   * @return whether HotSpot took them
   */
  static boolean add(String directives) throws IOException {
    Path file = Files.createTempFile("splitwright-jit", ".json");
    try {
      Files.writeString(file, directives);
      String reply = String.valueOf(diagnostics("compilerDirectivesAdd", file.toString()));
      // "1 compiler directives added" on success (HotSpot's DirectivesParser).
      return reply.matches("(?s)\\s*[1-9][0-9]* compiler directives added.*");
    } finally {
      Files.deleteIfExists(file);
    }
  }

  /** Pops the directives added last; for tests. */
  static void removeLast() {
    diagnostics("compilerDirectivesRemove");
  }

  private static Object diagnostics(String operation, String... arguments) {
    try {
      return ManagementFactory.getPlatformMBeanServer().invoke(
          new ObjectName("com.sun.management:type=DiagnosticCommand"), operation,
          new Object[] {arguments}, new String[] {String[].class.getName()});
    } catch (JMException e) {
      throw new IllegalStateException("HotSpot's DiagnosticCommand " + operation + ": " + e, e);
    }
  }
}
