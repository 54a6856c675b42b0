package dev.splitwright.check;

import java.util.Collections;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.StringJoiner;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * The class files of one compilation, by binary name ({@code demo.Pump}, {@code demo.Pump$Leaf}).
 * Immutable: byte arrays are copied on the way in and out.
 */
public final class CompiledClasses {

  private final SortedMap<String, byte[]> classes;

  private CompiledClasses(SortedMap<String, byte[]> classes) {
    this.classes = Collections.unmodifiableSortedMap(classes);
  }

  /**
   * Wraps class files produced elsewhere.
   *
   * @throws IllegalArgumentException if {@code classes} is empty
   */
  public static CompiledClasses of(Map<String, byte[]> classes) {
    Objects.requireNonNull(classes, "classes");
    if (classes.isEmpty()) {
      throw new IllegalArgumentException("classes is empty");
    }
    SortedMap<String, byte[]> copy = new TreeMap<>();
    for (Map.Entry<String, byte[]> entry : classes.entrySet()) {
      String name = Objects.requireNonNull(entry.getKey(), "class name");
      copy.put(name, Objects.requireNonNull(entry.getValue(), name).clone());
    }
    return new CompiledClasses(copy);
  }

  /** Binary names in sorted order. */
  public SortedSet<String> names() {
    return Collections.unmodifiableSortedSet(new TreeSet<>(classes.keySet()));
  }

  /** A copy of the class file of {@code name}. */
  public byte[] bytes(String name) {
    return find(name).clone();
  }

  /** Length in bytes of the class file of {@code name}. */
  public int size(String name) {
    return find(name).length;
  }

  /**
   * Creates a new class loader that defines these classes from their bytes and delegates
   * everything else to {@code parent}. Each call gives a loader with its own copies of the classes
   * and their static state.
   */
  public ClassLoader newLoader(ClassLoader parent) {
    return new ByteMapClassLoader(Objects.requireNonNull(parent, "parent"), classes);
  }

  /**
   * Creates a new class loader over the platform class loader, so classes on the application class
   * path (this project, test libraries) are invisible to the loaded code.
   */
  public ClassLoader newLoader() {
    return newLoader(ClassLoader.getPlatformClassLoader());
  }

  /**
   * Loads {@code name} in a fresh {@link #newLoader()}; two calls give two distinct classes. The
   * class is initialized on first use, not here.
   *
   * @throws IllegalArgumentException if {@code name} is not one of {@link #names()}
   * @throws LinkageError if the JVM rejects the class file
   */
  public Class<?> load(String name) {
    find(name);
    try {
      return Class.forName(name, false, newLoader());
    } catch (ClassNotFoundException e) {
      throw new IllegalStateException("class " + name + " could not be defined", e);
    }
  }

  private byte[] find(String name) {
    byte[] bytes = classes.get(Objects.requireNonNull(name, "name"));
    if (bytes == null) {
      throw new IllegalArgumentException(
          "no class named " + name + "; compiled classes are " + classes.keySet());
    }
    return bytes;
  }

  @Override
  public String toString() {
    StringJoiner joined = new StringJoiner(", ", "CompiledClasses[", "]");
    classes.forEach((name, bytes) -> joined.add(name + "=" + bytes.length + " bytes"));
    return joined.toString();
  }
}
