package dev.splitwright.check;

import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.SortedSet;
import java.util.TreeSet;

/**
 * Facts read from a class file by hand, following the Java SE 17 JVM Specification chapter 4: the
 * version, the size of the constant pool, the bytecode size of each method, the classes referred
 * to, and how many bytes debug attributes take. Class names are in internal form ({@code
 * java/lang/Object}).
 */
public final class ClassFileInfo {

  private final int minorVersion;
  private final int majorVersion;
  private final int constantPoolCount;
  private final int accessFlags;
  private final String className;
  private final Optional<String> superClassName;
  private final List<String> interfaces;
  private final int fieldCount;
  private final List<MethodSize> methods;
  private final SortedSet<String> referencedClasses;
  private final int lineNumberTableBytes;
  private final int debugAttributeBytes;

  ClassFileInfo(
      int minorVersion,
      int majorVersion,
      int constantPoolCount,
      int accessFlags,
      String className,
      Optional<String> superClassName,
      List<String> interfaces,
      int fieldCount,
      List<MethodSize> methods,
      SortedSet<String> referencedClasses,
      int lineNumberTableBytes,
      int debugAttributeBytes) {
    this.minorVersion = minorVersion;
    this.majorVersion = majorVersion;
    this.constantPoolCount = constantPoolCount;
    this.accessFlags = accessFlags;
    this.className = Objects.requireNonNull(className, "className");
    this.superClassName = Objects.requireNonNull(superClassName, "superClassName");
    this.interfaces = List.copyOf(interfaces);
    this.fieldCount = fieldCount;
    this.methods = List.copyOf(methods);
    this.referencedClasses = Collections.unmodifiableSortedSet(new TreeSet<>(referencedClasses));
    this.lineNumberTableBytes = lineNumberTableBytes;
    this.debugAttributeBytes = debugAttributeBytes;
  }

  /**
   * Parses a class file.
   *
   * @throws IllegalArgumentException naming the byte offset of the first malformed item, if the
   *     bytes are truncated, do not start with {@code 0xCAFEBABE}, hold an unknown constant tag, a
   *     constant pool index of the wrong kind, an attribute whose length disagrees with its
   *     contents, or bytes after the last attribute
   */
  public static ClassFileInfo parse(byte[] classFile) {
    return new ClassFileParser(Objects.requireNonNull(classFile, "classFile")).parse();
  }

  public int minorVersion() {
    return minorVersion;
  }

  /** 61 for Java 17 (JVMS §4.1, table 4.1-A). */
  public int majorVersion() {
    return majorVersion;
  }

  /**
   * The {@code constant_pool_count} item: one more than the highest index, so Long and Double
   * entries count twice (JVMS §4.4.5).
   */
  public int constantPoolCount() {
    return constantPoolCount;
  }

  /** The class's {@code access_flags} (JVMS §4.1, table 4.1-B). */
  public int accessFlags() {
    return accessFlags;
  }

  /** This class, e.g. {@code demo/Pump$Leaf}. */
  public String className() {
    return className;
  }

  /** The direct superclass; empty only for {@code java/lang/Object} and {@code module-info}. */
  public Optional<String> superClassName() {
    return superClassName;
  }

  /** Direct superinterfaces in declaration order. */
  public List<String> interfaces() {
    return interfaces;
  }

  public int fieldCount() {
    return fieldCount;
  }

  /** Methods in class-file order, constructors ({@code <init>}) and synthetic ones included. */
  public List<MethodSize> methods() {
    return methods;
  }

  /** Largest {@code code_length} of any method, 0 if there is no code. */
  public int maxCodeLength() {
    return methods.stream().mapToInt(MethodSize::codeLength).max().orElse(0);
  }

  /** Sum of all methods' {@code code_length}. */
  public int totalCodeLength() {
    return methods.stream().mapToInt(MethodSize::codeLength).sum();
  }

  /**
   * Every class named by a {@code CONSTANT_Class} entry (this class included) or inside a field or
   * method descriptor (of members, {@code NameAndType} and {@code MethodType} entries). Array
   * types are reduced to their element class; primitive arrays contribute nothing.
   */
  public SortedSet<String> referencedClasses() {
    return referencedClasses;
  }

  /** Bytes of all {@code LineNumberTable} attributes including their 6-byte headers (§4.7.12). */
  public int lineNumberTableBytes() {
    return lineNumberTableBytes;
  }

  /**
   * Bytes of the attributes {@code javac -g:none} leaves out: {@code LineNumberTable}, {@code
   * LocalVariableTable}, {@code LocalVariableTypeTable} (inside {@code Code}) and {@code
   * SourceFile} (on the class), headers included. The constant pool entries naming them are not
   * counted.
   */
  public int debugAttributeBytes() {
    return debugAttributeBytes;
  }
}
