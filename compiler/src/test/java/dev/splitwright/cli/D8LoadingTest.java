package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.demo.DemoFiles;
import java.io.File;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.lang.reflect.Method;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * D8 is a large jar whose loading takes seconds: only a run that asks for DEX sizes may load it.
 * Each run here starts the command line in a fresh class loader over the test class path, so the
 * classes this JVM already loaded for other tests do not count, and the loader records every
 * {@code com.android.tools} class it loads.
 */
class D8LoadingTest {

  /** A child-first view of the class path that records the D8 classes it loads. */
  private static final class RecordingLoader extends URLClassLoader {
    private final Set<String> d8Classes = new TreeSet<>();

    RecordingLoader() throws MalformedURLException {
      super(classPath(), ClassLoader.getPlatformClassLoader());
    }

    @Override
    protected Class<?> loadClass(String name, boolean resolve) throws ClassNotFoundException {
      Class<?> loaded = super.loadClass(name, resolve);
      if (name.startsWith("com.android.tools.")) {
        synchronized (d8Classes) {
          d8Classes.add(name);
        }
      }
      return loaded;
    }

    Set<String> d8Classes() {
      synchronized (d8Classes) {
        return new TreeSet<>(d8Classes);
      }
    }

    private static URL[] classPath() throws MalformedURLException {
      List<URL> urls = new ArrayList<>();
      // Surefire's class path, or its one manifest jar whose Class-Path the loader follows.
      for (String entry : System.getProperty("java.class.path").split(File.pathSeparator)) {
        urls.add(Path.of(entry).toUri().toURL());
      }
      return urls.toArray(new URL[0]);
    }
  }

  private static Set<String> d8ClassesLoadedBy(List<String> args) throws Exception {
    try (RecordingLoader loader = new RecordingLoader()) {
      Class<?> main = loader.loadClass("dev.splitwright.cli.Main");
      assertThat(main.getClassLoader()).isSameAs(loader);
      Method run = main.getMethod("run", String[].class, PrintWriter.class, PrintWriter.class);
      StringWriter err = new StringWriter();
      int exit = (int) run.invoke(null, args.toArray(new String[0]),
          new PrintWriter(new StringWriter()), new PrintWriter(err));
      assertThat(exit).as(err.toString()).isZero();
      return loader.d8Classes();
    }
  }

  private static List<String> pump(Path out, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", DemoFiles.pump().toString(),
        "--target", "state", "--max-depth", "3", "--class", "Fit", "--out", out.toString(),
        "--quiet"));
    args.addAll(List.of(extra));
    return args;
  }

  @Test
  void runsWithoutDexLoadNoD8Class(@TempDir Path dir) throws Exception {
    assertThat(d8ClassesLoadedBy(pump(dir.resolve("plain"), "--layout", "smallest"))).isEmpty();
    assertThat(d8ClassesLoadedBy(pump(dir.resolve("budget"), "--budget", "4KiB"))).isEmpty();
  }

  @Test
  void aRunWithDexSizeLoadsD8(@TempDir Path dir) throws Exception {
    // The control: the same harness does see D8 when it is used.
    assertThat(d8ClassesLoadedBy(pump(dir.resolve("dex"), "--dex-size")))
        .contains("com.android.tools.r8.D8");
  }
}
