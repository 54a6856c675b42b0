package dev.splitwright.check;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Set;
import java.util.TreeSet;
import javax.tools.Diagnostic;
import javax.tools.DiagnosticCollector;
import javax.tools.JavaCompiler;
import javax.tools.JavaFileObject;
import javax.tools.StandardJavaFileManager;
import javax.tools.StandardLocation;
import javax.tools.ToolProvider;

/**
 * Compiles Java sources with the JDK's own javac, entirely in memory: sources are strings and class
 * files end up in a {@link CompiledClasses}; nothing touches the disk.
 *
 * <p>One javac instance and one standard file manager serve every call. Each javac run still has a
 * fixed cost of a few milliseconds, and {@code --release} adds roughly 20 ms more because javac
 * opens the description of that release's API anew for every run; so when speed matters, compile
 * many classes in one {@link #compile(List)} call (50 small classes with {@code --release 17},
 * measured on a busy shared 2-core machine: 0.5-4 ms per class in one batch, 19-56 ms per class one
 * at a time).
 *
 * <p>The class path is empty unless the options set one, so sources see only the JDK and the other
 * sources of the same batch; this matches {@link CompiledClasses#load(String)}, whose loader sees
 * only the platform classes.
 *
 * <p>Thread safety: instances may be shared between threads. Calls are serialized because the
 * standard file manager is not thread-safe; use one instance per thread to compile in parallel.
 */
public final class InMemoryCompiler implements AutoCloseable {

  private final JavaCompiler javac;
  private final StandardJavaFileManager sharedFiles;
  private final List<String> options;
  private final List<String> javacOptions;
  private int calls;

  private InMemoryCompiler(JavaCompiler javac, StandardJavaFileManager sharedFiles,
      List<String> options, List<String> javacOptions) {
    this.javac = javac;
    this.sharedFiles = sharedFiles;
    this.options = options;
    this.javacOptions = javacOptions;
  }

  /**
   * Creates a compiler that passes {@code options} to javac on every call, e.g. {@code
   * List.of("--release", "17", "-Xlint:all", "-Werror")}.
   *
   * @throws IllegalArgumentException if javac does not accept an option
   * @throws IllegalStateException if the running Java has no compiler (a JRE, not a JDK)
   */
  public static InMemoryCompiler create(List<String> options) {
    List<String> copy = List.copyOf(Objects.requireNonNull(options, "options"));
    JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
    if (javac == null) {
      throw new IllegalStateException("no system Java compiler: run on a JDK, not a JRE");
    }
    StandardJavaFileManager files =
        javac.getStandardFileManager(null, Locale.ROOT, StandardCharsets.UTF_8);
    try {
      files.setLocation(StandardLocation.CLASS_PATH, List.of());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    // getTask parses the options, so a bad one fails here instead of at the first compile; in
    // the form javac will get, so that the running release does not open ct.sym here either.
    List<String> javacOptions = runningRelease(copy);
    javac.getTask(null, new MemoryFileManager(files), null, javacOptions, null, List.of());
    return new InMemoryCompiler(javac, files, copy, javacOptions);
  }

  /**
   * {@code options} with {@code --release N} turned into {@code -source N -target N} when N is the
   * running JDK's own version: the same modules and the same class files (JLS and JVMS version N),
   * but javac then reads them from the running JDK instead of opening {@code lib/ct.sym} anew on
   * every call, which costs tens of milliseconds a call. Any other release is passed as given.
   */
  static List<String> runningRelease(List<String> options) {
    int at = options.indexOf("--release");
    String running = Integer.toString(Runtime.version().feature());
    if (at < 0 || at + 1 >= options.size() || !options.get(at + 1).equals(running)) {
      return options;
    }
    List<String> same = new ArrayList<>(options.subList(0, at));
    same.addAll(List.of("-source", running, "-target", running));
    same.addAll(options.subList(at + 2, options.size()));
    return List.copyOf(same);
  }

  /** The javac options as given (see {@link #runningRelease} for how javac gets them). */
  public List<String> options() {
    return options;
  }

  /**
   * Compiles a batch of independent or mutually referring sources in one javac run.
   *
   * <p>Warnings of a successful compilation are dropped; pass {@code -Werror} to make them fail.
   *
   * @return the class files of all classes declared, nested ones included
   * @throws CompilationException if javac reports an error (with {@code -Werror}: any warning)
   * @throws IllegalArgumentException if {@code sources} is empty or names a class twice
   */
  public synchronized CompiledClasses compile(List<SourceFile> sources)
      throws CompilationException {
    List<SourceFile> batch = List.copyOf(Objects.requireNonNull(sources, "sources"));
    if (batch.isEmpty()) {
      throw new IllegalArgumentException("sources is empty");
    }
    Set<String> seen = new TreeSet<>();
    List<JavaFileObject> units = new ArrayList<>(batch.size());
    for (SourceFile file : batch) {
      if (!seen.add(file.binaryClassName())) {
        throw new IllegalArgumentException(
            "sources names class " + file.binaryClassName() + " more than once");
      }
      units.add(MemoryFileManager.source(file));
    }
    DiagnosticCollector<JavaFileObject> collector = new DiagnosticCollector<>();
    MemoryFileManager files = new MemoryFileManager(sharedFiles);
    calls++;
    boolean ok = javac.getTask(null, files, collector, javacOptions, null, units).call();
    if (!ok) {
      List<CompileDiagnostic> diagnostics =
          collector.getDiagnostics().stream().map(InMemoryCompiler::toRecord).toList();
      throw new CompilationException(diagnostics, batch);
    }
    return CompiledClasses.of(files.classBytes());
  }

  /** How many times {@link #compile} has run javac, failed runs included. */
  public synchronized int calls() {
    return calls;
  }

  /** Compiles a single source; see {@link #compile(List)}. */
  public CompiledClasses compileOne(String binaryClassName, String source)
      throws CompilationException {
    return compile(List.of(new SourceFile(binaryClassName, source)));
  }

  /** Releases the JDK class library files the shared file manager keeps open. */
  @Override
  public synchronized void close() {
    try {
      sharedFiles.close();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private static CompileDiagnostic toRecord(Diagnostic<? extends JavaFileObject> d) {
    JavaFileObject source = d.getSource();
    String message = d.getMessage(Locale.ROOT);
    if (!(source instanceof MemoryFileManager.MemorySource memory)) {
      // Not one of ours (none is expected with an empty class path): keep its name in the text.
      String prefix = source == null ? "" : source.getName() + ": ";
      return new CompileDiagnostic(d.getKind(), "", 0, 0, prefix + message);
    }
    long line = d.getLineNumber() == Diagnostic.NOPOS ? 0 : d.getLineNumber();
    long column = d.getColumnNumber() == Diagnostic.NOPOS ? 0 : d.getColumnNumber();
    return new CompileDiagnostic(
        d.getKind(), memory.file().binaryClassName(), line, column, message);
  }
}
