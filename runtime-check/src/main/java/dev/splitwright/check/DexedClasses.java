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
 * One DEX file per class, by class descriptor ({@code Ldemo/Pump;}, {@code Ldemo/Pump$Leaf;}).
 * Immutable: byte arrays are copied on the way in and out.
 */
public final class DexedClasses {

  private final SortedMap<String, byte[]> files;

  private DexedClasses(SortedMap<String, byte[]> files) {
    this.files = Collections.unmodifiableSortedMap(files);
  }

  static DexedClasses of(Map<String, byte[]> files) {
    SortedMap<String, byte[]> copy = new TreeMap<>();
    files.forEach((descriptor, bytes) -> copy.put(descriptor, bytes.clone()));
    return new DexedClasses(copy);
  }

  /** Class descriptors in sorted order. */
  public SortedSet<String> descriptors() {
    return Collections.unmodifiableSortedSet(new TreeSet<>(files.keySet()));
  }

  /** A copy of the DEX file of the class {@code descriptor}. */
  public byte[] bytes(String descriptor) {
    return find(descriptor).clone();
  }

  /** Length in bytes of the DEX file of the class {@code descriptor}. */
  public int size(String descriptor) {
    return find(descriptor).length;
  }

  /** The DEX file of the class {@code descriptor}, parsed. */
  public DexFile parse(String descriptor) {
    return DexFile.parse(find(descriptor));
  }

  /** The descriptor of a binary class name: {@code demo.Pump} gives {@code Ldemo/Pump;}. */
  public static String descriptorOf(String binaryClassName) {
    return "L" + Objects.requireNonNull(binaryClassName, "binaryClassName").replace('.', '/') + ";";
  }

  private byte[] find(String descriptor) {
    byte[] bytes = files.get(Objects.requireNonNull(descriptor, "descriptor"));
    if (bytes == null) {
      throw new IllegalArgumentException(
          "no DEX file for " + descriptor + "; dexed classes are " + files.keySet());
    }
    return bytes;
  }

  @Override
  public String toString() {
    StringJoiner joined = new StringJoiner(", ", "DexedClasses[", "]");
    files.forEach((descriptor, bytes) -> joined.add(descriptor + "=" + bytes.length + " bytes"));
    return joined.toString();
  }
}
