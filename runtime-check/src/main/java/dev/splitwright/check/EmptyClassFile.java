package dev.splitwright.check;

import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.Objects;
import javax.lang.model.SourceVersion;

/**
 * Writes the smallest class file of a public final class: no fields, no methods (not even a
 * constructor), no attributes. Laid out as JVM Specification (SE 17) section 4.1 "The ClassFile
 * Structure" describes; the version is 52 (Java 8) so every dexer accepts it. Writing it by hand
 * avoids starting javac just to measure a DEX file's fixed cost.
 */
final class EmptyClassFile {

  private static final int MAGIC = 0xCAFEBABE;
  private static final int JAVA_8 = 52;
  private static final int CONSTANT_UTF8 = 1;
  private static final int CONSTANT_CLASS = 7;
  private static final int ACC_PUBLIC_FINAL_SUPER = 0x0001 | 0x0010 | 0x0020;

  private EmptyClassFile() {}

  /**
   * The class file of {@code public final class <binaryClassName> {}} without its default
   * constructor.
   *
   * @throws IllegalArgumentException if {@code binaryClassName} is not a qualified Java name
   */
  static byte[] of(String binaryClassName) {
    Objects.requireNonNull(binaryClassName, "binaryClassName");
    if (!SourceVersion.isName(binaryClassName)) {
      throw new IllegalArgumentException(
          "binaryClassName \"" + binaryClassName + "\" is not a qualified Java name");
    }
    ByteArrayOutputStream buffer = new ByteArrayOutputStream();
    try (DataOutputStream out = new DataOutputStream(buffer)) {
      out.writeInt(MAGIC);
      out.writeShort(0);
      out.writeShort(JAVA_8);
      out.writeShort(5); // constant_pool_count: entries 1 to 4
      out.writeByte(CONSTANT_CLASS);
      out.writeShort(2);
      // writeUTF writes a u2 length and modified UTF-8, exactly CONSTANT_Utf8_info (JVMS 4.4.7).
      out.writeByte(CONSTANT_UTF8);
      out.writeUTF(binaryClassName.replace('.', '/'));
      out.writeByte(CONSTANT_CLASS);
      out.writeShort(4);
      out.writeByte(CONSTANT_UTF8);
      out.writeUTF("java/lang/Object");
      out.writeShort(ACC_PUBLIC_FINAL_SUPER);
      out.writeShort(1); // this_class
      out.writeShort(3); // super_class
      out.writeShort(0); // interfaces_count
      out.writeShort(0); // fields_count
      out.writeShort(0); // methods_count
      out.writeShort(0); // attributes_count
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return buffer.toByteArray();
  }
}
