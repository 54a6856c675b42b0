package dev.splitwright.check;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.net.URI;
import java.util.Map;
import java.util.TreeMap;
import javax.tools.FileObject;
import javax.tools.ForwardingJavaFileManager;
import javax.tools.JavaFileObject;
import javax.tools.SimpleJavaFileObject;
import javax.tools.StandardJavaFileManager;
import javax.tools.StandardLocation;

/**
 * Serves sources from strings and keeps class output in byte arrays; everything else (the JDK's
 * own classes) comes from the shared standard file manager. One instance per compilation.
 */
final class MemoryFileManager extends ForwardingJavaFileManager<StandardJavaFileManager> {

  private final Map<String, ClassOutput> outputs = new TreeMap<>();

  MemoryFileManager(StandardJavaFileManager shared) {
    super(shared);
  }

  static JavaFileObject source(SourceFile file) {
    return new MemorySource(file);
  }

  @Override
  public JavaFileObject getJavaFileForOutput(
      Location location, String className, JavaFileObject.Kind kind, FileObject sibling)
      throws IOException {
    if (location != StandardLocation.CLASS_OUTPUT || kind != JavaFileObject.Kind.CLASS) {
      throw new IOException(
          "only class files are kept in memory, not " + kind + " " + className + " for "
              + location.getName());
    }
    ClassOutput output = new ClassOutput(className);
    outputs.put(className, output);
    return output;
  }

  // The standard manager rejects file objects it did not create.
  @Override
  public boolean isSameFile(FileObject a, FileObject b) {
    if (isOurs(a) || isOurs(b)) {
      return a == b;
    }
    return super.isSameFile(a, b);
  }

  // The standard manager is shared across compilations; InMemoryCompiler closes it.
  @Override
  public void close() {}

  Map<String, byte[]> classBytes() {
    Map<String, byte[]> bytes = new TreeMap<>();
    outputs.forEach((name, output) -> bytes.put(name, output.bytes.toByteArray()));
    return bytes;
  }

  private static boolean isOurs(FileObject file) {
    return file instanceof MemorySource || file instanceof ClassOutput;
  }

  private static URI uri(String scheme, String binaryName, JavaFileObject.Kind kind) {
    return URI.create(scheme + ":///" + binaryName.replace('.', '/') + kind.extension);
  }

  /** A source; its URI path ends in the class name so javac's file-name check works. */
  static final class MemorySource extends SimpleJavaFileObject {
    private final SourceFile file;

    MemorySource(SourceFile file) {
      super(uri("string", file.binaryClassName(), Kind.SOURCE), Kind.SOURCE);
      this.file = file;
    }

    SourceFile file() {
      return file;
    }

    @Override
    public CharSequence getCharContent(boolean ignoreEncodingErrors) {
      return file.source();
    }
  }

  private static final class ClassOutput extends SimpleJavaFileObject {
    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();

    ClassOutput(String binaryName) {
      super(uri("bytes", binaryName, Kind.CLASS), Kind.CLASS);
    }

    @Override
    public OutputStream openOutputStream() {
      return bytes;
    }
  }
}
