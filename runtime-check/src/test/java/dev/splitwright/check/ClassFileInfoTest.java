package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.catchThrowable;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** Checks the parser against facts stated in the JVM Specification, Java SE 17 edition (JVMS). */
class ClassFileInfoTest {

  private static final String CONSTANTS =
      """
      package demo;

      interface Constants {
        int small();

        static int one() {
          return 1;
        }

        static int medium() {
          return 1234567;
        }

        static long big() {
          return 1234567890123L;
        }
      }
      """;

  private static InMemoryCompiler release17;

  @BeforeAll
  static void openCompiler() {
    release17 = InMemoryCompiler.create(List.of("--release", "17"));
  }

  @AfterAll
  static void closeCompiler() {
    release17.close();
  }

  @Test
  void readsMagicAndTheVersionOfTheRequestedRelease() throws Exception {
    byte[] bytes = release17.compileOne("demo.Constants", CONSTANTS).bytes("demo.Constants");

    ClassFileInfo info = ClassFileInfo.parse(bytes);

    // JVMS §4.1: magic 0xCAFEBABE; table 4.1-A: Java SE 17 is major version 61.
    assertThat(Arrays.copyOf(bytes, 4)).containsExactly(0xCA, 0xFE, 0xBA, 0xBE);
    assertThat(info.majorVersion()).isEqualTo(61);
    assertThat(info.minorVersion()).isZero();
    assertThat(info.className()).isEqualTo("demo/Constants");
    assertThat(info.superClassName()).contains("java/lang/Object");
    // Table 4.1-B: ACC_INTERFACE 0x0200 | ACC_ABSTRACT 0x0400 for a package-private interface.
    assertThat(info.accessFlags()).isEqualTo(0x0600);
    try (InMemoryCompiler release11 = InMemoryCompiler.create(List.of("--release", "11"))) {
      byte[] old = release11.compileOne("demo.Constants", CONSTANTS).bytes("demo.Constants");
      // Table 4.1-A: Java SE 11 is major version 55.
      assertThat(ClassFileInfo.parse(old).majorVersion()).isEqualTo(55);
    }
  }

  @Test
  void codeLengthsMatchTheOpcodeSizesOfKnownBodies() throws Exception {
    ClassFileInfo info =
        ClassFileInfo.parse(
            release17.compileOne("demo.Constants", CONSTANTS).bytes("demo.Constants"));

    // JVMS §6.5 instruction formats: iconst_1, ireturn and lreturn are 1 byte; ldc is 2 (one-byte
    // index); ldc2_w is 3 (two-byte index). An abstract method has no Code attribute (§4.7.3).
    assertThat(info.methods())
        .containsExactly(
            new MethodSize("small", "()I", 0),
            new MethodSize("one", "()I", 2),
            new MethodSize("medium", "()I", 3),
            new MethodSize("big", "()J", 4));
    assertThat(info.maxCodeLength()).isEqualTo(4);
    assertThat(info.totalCodeLength()).isEqualTo(9);
  }

  @Test
  void longConstantTakesTwoPoolSlotsAndIntConstantOne() throws Exception {
    String template =
        """
        package demo;

        final class Constant {
          static %s value() {
            return %s;
          }
        }
        """;
    ClassFileInfo withInt =
        ClassFileInfo.parse(
            release17
                .compileOne("demo.Constant", template.formatted("int", "1234567"))
                .bytes("demo.Constant"));
    ClassFileInfo withLong =
        ClassFileInfo.parse(
            release17
                .compileOne("demo.Constant", template.formatted("long", "1234567890123L"))
                .bytes("demo.Constant"));

    // Each class holds one constant; otherwise the pools differ only in "()I" versus "()J", one
    // Utf8 entry each. §4.4.4: CONSTANT_Integer takes one index; §4.4.5: CONSTANT_Long takes two.
    assertThat(withLong.constantPoolCount() - withInt.constantPoolCount()).isEqualTo(1);
    // §6.5: ldc + ireturn = 3 bytes, ldc2_w + lreturn = 4 bytes.
    assertThat(withInt.methods()).contains(new MethodSize("value", "()I", 3));
    assertThat(withLong.methods()).contains(new MethodSize("value", "()J", 4));
  }

  @Test
  void referencedClassesComeFromClassEntriesAndDescriptors() throws Exception {
    String source =
        """
        package demo;

        final class Refs {
          private String[] labels;

          static int biggest(int a, int b) {
            return Math.max(a, b);
          }

          static int length(StringBuilder[] parts) {
            return parts.length;
          }

          static Object grid() {
            return new Integer[2][3];
          }

          static boolean isLongGrid(Object value) {
            return value instanceof long[][];
          }
        }
        """;

    ClassFileInfo info =
        ClassFileInfo.parse(release17.compileOne("demo.Refs", source).bytes("demo.Refs"));

    // Math (method owner) and Object (super class) are CONSTANT_Class entries; String and
    // StringBuilder appear only inside descriptors; Integer comes from the array class entry
    // "[[Ljava/lang/Integer;" used by multianewarray (§6.5), and "[[J" adds nothing.
    assertThat(info.referencedClasses())
        .containsExactly(
            "demo/Refs",
            "java/lang/Integer",
            "java/lang/Math",
            "java/lang/Object",
            "java/lang/String",
            "java/lang/StringBuilder");
  }

  @Test
  void debugAttributesAccountForTheSizeOfADefaultBuildOverGNone() throws Exception {
    String source =
        """
        package demo;

        final class Debugged {
          static int scaled(int value, int factor) {
            int product = value * factor;
            return product + 1;
          }
        }
        """;
    ClassFileInfo none;
    byte[] noneBytes;
    try (InMemoryCompiler bare = InMemoryCompiler.create(List.of("--release", "17", "-g:none"))) {
      noneBytes = bare.compileOne("demo.Debugged", source).bytes("demo.Debugged");
      none = ClassFileInfo.parse(noneBytes);
    }
    byte[] defaultBytes = release17.compileOne("demo.Debugged", source).bytes("demo.Debugged");
    ClassFileInfo standard = ClassFileInfo.parse(defaultBytes);
    ClassFileInfo all;
    try (InMemoryCompiler full = InMemoryCompiler.create(List.of("--release", "17", "-g"))) {
      all = ClassFileInfo.parse(full.compileOne("demo.Debugged", source).bytes("demo.Debugged"));
    }

    assertThat(none.lineNumberTableBytes()).isZero();
    assertThat(none.debugAttributeBytes()).isZero();
    assertThat(standard.lineNumberTableBytes()).isPositive();
    // javac's documentation: without -g only line numbers and the source file are generated.
    // §4.7.10: a SourceFile attribute is 6 header bytes plus a u2 index.
    assertThat(standard.debugAttributeBytes())
        .isEqualTo(standard.lineNumberTableBytes() + 6 + 2);
    // -g adds LocalVariableTable (value, factor, product) and leaves the line numbers alone.
    assertThat(all.lineNumberTableBytes()).isEqualTo(standard.lineNumberTableBytes());
    assertThat(all.debugAttributeBytes()).isGreaterThan(standard.debugAttributeBytes());

    // Besides the attributes themselves, the default build's pool holds three more Utf8 entries:
    // the two attribute names (§4.7: attribute_name_index) and the file name (§4.7.10). A Utf8
    // entry is tag u1 + length u2 + its bytes (§4.4.7).
    int extraPoolBytes =
        utf8Size("LineNumberTable") + utf8Size("SourceFile") + utf8Size("Debugged.java");
    assertThat(standard.constantPoolCount() - none.constantPoolCount()).isEqualTo(3);
    assertThat(defaultBytes.length - noneBytes.length)
        .isEqualTo(standard.debugAttributeBytes() + extraPoolBytes);
  }

  @Test
  void rejectsBadMagicAtOffsetZero() throws Exception {
    byte[] bytes = constantsClass();
    bytes[3] = (byte) 0xBF;

    assertThatIllegalArgumentException()
        .isThrownBy(() -> ClassFileInfo.parse(bytes))
        .withMessage("malformed class file at offset 0: magic is 0xCAFEBABF, expected 0xCAFEBABE");
  }

  @Test
  void rejectsEveryTruncationWithTheOffsetWhereBytesRanOut() throws Exception {
    byte[] bytes = constantsClass();

    for (int length = 0; length < bytes.length; length++) {
      byte[] prefix = Arrays.copyOf(bytes, length);

      Throwable thrown = catchThrowable(() -> ClassFileInfo.parse(prefix));

      assertThat(thrown)
          .as("prefix of %d bytes", length)
          .isInstanceOf(IllegalArgumentException.class);
      int offset = offsetIn(thrown.getMessage());
      assertThat(offset).as(thrown.getMessage()).isBetween(0, length);
    }
  }

  @Test
  void rejectsUnknownConstantTagAtItsOffset() throws Exception {
    byte[] bytes = constantsClass();
    // §4.1: magic u4, minor u2, major u2, constant_pool_count u2, so entry #1 starts at offset 10.
    // Tag 2 is unassigned in table 4.4-B.
    bytes[10] = 2;

    assertThatIllegalArgumentException()
        .isThrownBy(() -> ClassFileInfo.parse(bytes))
        .withMessage("malformed class file at offset 10: constant #1 has unknown tag 2");
  }

  @Test
  void rejectsBytesAfterTheLastAttribute() throws Exception {
    byte[] valid = constantsClass();
    byte[] bytes = Arrays.copyOf(valid, valid.length + 1);

    assertThatIllegalArgumentException()
        .isThrownBy(() -> ClassFileInfo.parse(bytes))
        .withMessage(
            "malformed class file at offset %d: 1 bytes after the last class attribute",
            bytes.length - 1);
  }

  private static byte[] constantsClass() throws CompilationException {
    return release17.compileOne("demo.Constants", CONSTANTS).bytes("demo.Constants");
  }

  private static int utf8Size(String text) {
    return 1 + 2 + text.getBytes(StandardCharsets.UTF_8).length;
  }

  private static int offsetIn(String message) {
    String prefix = "malformed class file at offset ";
    assertThat(message).startsWith(prefix);
    return Integer.parseInt(message.substring(prefix.length(), message.indexOf(':')));
  }
}
