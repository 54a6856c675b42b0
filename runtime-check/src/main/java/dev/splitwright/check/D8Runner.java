package dev.splitwright.check;

import com.android.tools.r8.ByteDataView;
import com.android.tools.r8.CompilationFailedException;
import com.android.tools.r8.CompilationMode;
import com.android.tools.r8.D8;
import com.android.tools.r8.D8Command;
import com.android.tools.r8.DexFilePerClassFileConsumer;
import com.android.tools.r8.Diagnostic;
import com.android.tools.r8.DiagnosticsHandler;
import com.android.tools.r8.origin.Origin;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;

/**
 * The only class that names D8's types. {@link Dexer} reaches it only when asked for DEX bytes, so
 * the JVM loads D8 (a large jar) only then and never during a command that does not dex.
 */
final class D8Runner {

  private D8Runner() {}

  /**
   * Runs D8 once over all {@code classFiles} (class files by binary name) in release mode and
   * returns one DEX file per class, by class descriptor.
   *
   * @throws IllegalArgumentException if D8 reports an error, with D8's messages
   */
  static Map<String, byte[]> dexEach(Map<String, byte[]> classFiles, int minApi) {
    Collector collector = new Collector();
    Messages messages = new Messages();
    try {
      D8Command.Builder builder =
          D8Command.builder(messages)
              .setMode(CompilationMode.RELEASE)
              .setMinApiLevel(minApi)
              .setProgramConsumer(collector);
      classFiles.forEach(
          (name, bytes) -> builder.addClassProgramData(bytes, new ClassOrigin(name)));
      D8.run(builder.build());
    } catch (CompilationFailedException e) {
      throw new IllegalArgumentException(
          "D8 could not dex " + classFiles.keySet() + ": " + messages.errors(), e);
    }
    return collector.files();
  }

  /** Takes one DEX file per class; D8 may call from several threads. */
  private static final class Collector implements DexFilePerClassFileConsumer {

    private final Map<String, byte[]> files = new TreeMap<>();

    @Override
    public synchronized void accept(
        String primaryClassDescriptor,
        ByteDataView data,
        Set<String> descriptors,
        DiagnosticsHandler handler) {
      files.put(primaryClassDescriptor, data.copyByteData());
    }

    @Override
    public void finished(DiagnosticsHandler handler) {}

    synchronized Map<String, byte[]> files() {
      return new TreeMap<>(files);
    }
  }

  /** Keeps D8's errors for the exception message instead of letting D8 print them. */
  private static final class Messages implements DiagnosticsHandler {

    private final List<String> errors = new ArrayList<>();

    @Override
    public synchronized void error(Diagnostic diagnostic) {
      errors.add(diagnostic.getOrigin() + ": " + diagnostic.getDiagnosticMessage());
    }

    // Warnings and notes do not change the bytes measured, so they are dropped, not printed.
    @Override
    public void warning(Diagnostic diagnostic) {}

    @Override
    public void info(Diagnostic diagnostic) {}

    synchronized List<String> errors() {
      return List.copyOf(errors);
    }
  }

  /** Names the class in D8's messages. */
  private static final class ClassOrigin extends Origin {

    private final String binaryClassName;

    ClassOrigin(String binaryClassName) {
      super(Origin.root());
      this.binaryClassName = binaryClassName;
    }

    @Override
    public String part() {
      return binaryClassName;
    }
  }
}
