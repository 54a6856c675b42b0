package dev.splitwright.check;

import java.util.Map;

/** Defines classes from an immutable map of class files; parent-first like any class loader. */
final class ByteMapClassLoader extends ClassLoader {

  static {
    registerAsParallelCapable();
  }

  private final Map<String, byte[]> classes;

  ByteMapClassLoader(ClassLoader parent, Map<String, byte[]> classes) {
    super("splitwright-check", parent);
    this.classes = classes;
  }

  @Override
  protected Class<?> findClass(String name) throws ClassNotFoundException {
    byte[] bytes = classes.get(name);
    if (bytes == null) {
      throw new ClassNotFoundException(name);
    }
    return defineClass(name, bytes, 0, bytes.length);
  }
}
