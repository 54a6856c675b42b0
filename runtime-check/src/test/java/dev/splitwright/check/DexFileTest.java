package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.catchThrowable;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Checks the parser on DEX files written by D8 and on broken copies of them, against the AOSP page
 * "Dalvik executable format" (source.android.com/docs/core/runtime/dex-format).
 */
class DexFileTest {

  /** A string constant needing every MUTF-8 form: NUL, two bytes, three bytes, a surrogate pair. */
  private static final String AWKWARD = "a\u0000\u00b5\u20ac\ud834\udd1e";

  private static final String LABELS =
      """
      package demo;

      public final class Labels {
        private Labels() {}

        public static String name(int label) {
          return label == 0 ? "idle" : "a\\u0000\\u00b5\\u20ac\\ud834\\udd1e";
        }
      }
      """;

  private static byte[] dex;

  @BeforeAll
  static void dexOneClass() throws Exception {
    try (InMemoryCompiler javac = InMemoryCompiler.create(List.of("--release", "17"))) {
      dex = Dexer.forMinApi(21).dex(javac.compileOne("demo.Labels", LABELS)).bytes("Ldemo/Labels;");
    }
  }

  @Test
  void readsHeaderStringsTypesAndClasses() {
    DexFile file = DexFile.parse(dex);

    assertThat(file.version()).isEqualTo(35);
    assertThat(file.fileSize()).isEqualTo(dex.length);
    assertThat(file.classDescriptors()).containsExactly("Ldemo/Labels;");
    assertThat(file.typeDescriptors())
        .contains("Ldemo/Labels;", "Ljava/lang/Object;", "Ljava/lang/String;", "I");
    assertThat(file.strings()).contains("idle", "Ldemo/Labels;");
    assertThat(file.bytes()).isEqualTo(dex);
    // header_item: checksum at 8 (uint, little-endian), signature the 20 bytes at 12.
    ByteBuffer header = ByteBuffer.wrap(dex).order(ByteOrder.LITTLE_ENDIAN);
    assertThat(file.checksum()).isEqualTo(Integer.toUnsignedLong(header.getInt(8)));
    assertThat(file.signature()).isEqualTo(Arrays.copyOfRange(dex, 12, 32));
  }

  /**
   * The Java string javac read from the source must come back: "MUTF-8 (Modified UTF-8) Encoding"
   * writes NUL as two bytes and each surrogate of a pair as its own three bytes.
   */
  @Test
  void decodesModifiedUtf8() {
    assertThat(DexFile.parse(dex).strings()).contains(AWKWARD);
  }

  @Test
  void typesAreStringsAndStringsAreSorted() {
    DexFile file = DexFile.parse(dex);

    assertThat(file.strings()).containsAll(file.typeDescriptors());
    // string_ids "must be sorted by string contents, using UTF-16 code point values"; types are
    // sorted by string index, so their descriptors come out sorted too.
    assertThat(file.typeDescriptors()).isSorted();
  }

  @Test
  void changedBytesFailTheChecksumAndTheSignature() {
    byte[] changed = dex.clone();
    changed[changed.length - 1] ^= 1;
    DexFile file = DexFile.parse(changed);

    assertThat(DexFile.parse(dex).verifyChecksum()).isTrue();
    assertThat(DexFile.parse(dex).verifySignature()).isTrue();
    assertThat(file.verifyChecksum()).isFalse();
    assertThat(file.verifySignature()).isFalse();

    // The checksum covers the signature (it starts at offset 12), the signature does not.
    byte[] signatureChanged = dex.clone();
    signatureChanged[20] ^= 1;
    assertThat(DexFile.parse(signatureChanged).verifyChecksum()).isFalse();
    assertThat(DexFile.parse(signatureChanged).verifySignature()).isFalse();
  }

  @Test
  void everyTruncationFailsWithAnOffset() {
    for (int length = 0; length < dex.length; length++) {
      byte[] prefix = Arrays.copyOf(dex, length);
      assertThatIllegalArgumentException()
          .as("prefix of %d of %d bytes", length, dex.length)
          .isThrownBy(() -> DexFile.parse(prefix))
          .withMessageContaining("offset");
    }
  }

  @Test
  void rejectsWrongMagicAndVersion() {
    byte[] classFile = EmptyClassFile.of("demo.Empty");
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(Arrays.copyOf(classFile, 0x70)))
        .withMessageContaining("offset 0")
        .withMessageContaining("not a DEX file");

    byte[] version034 = dex.clone();
    version034[6] = '4';
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(version034))
        .withMessageContaining("offset 5")
        .withMessageContaining("034");

    byte[] noTerminator = dex.clone();
    noTerminator[7] = 'x';
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(noTerminator))
        .withMessageContaining("not a DEX file");
  }

  @Test
  void rejectsHeaderFieldsThatDisagreeWithTheFile() {
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(withInt(0x20, dex.length + 1)))
        .withMessageContaining("offset 32")
        .withMessageContaining("file_size");
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(withInt(0x24, 0x78)))
        .withMessageContaining("header_size");
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(withInt(0x28, 0x78563412)))
        .withMessageContaining("reverse-endian");
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(withInt(0x3C, dex.length - 2)))
        .withMessageContaining("string_ids");
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(withInt(0x38, -1)))
        .withMessageContaining("string_ids_size");
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(withInt(0x60, 1000)))
        .withMessageContaining("class_defs");
  }

  @Test
  void rejectsIndicesPastTheirTables() {
    ByteBuffer header = ByteBuffer.wrap(dex).order(ByteOrder.LITTLE_ENDIAN);
    int classDefs = header.getInt(0x64);
    int typeIds = header.getInt(0x44);

    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(withInt(classDefs, 100_000)))
        .withMessageContaining("offset " + classDefs)
        .withMessageContaining("class_idx 100000");
    assertThatIllegalArgumentException()
        .isThrownBy(() -> DexFile.parse(withInt(typeIds, 100_000)))
        .withMessageContaining("offset " + typeIds)
        .withMessageContaining("descriptor_idx 100000");
  }

  /** Seeded random damage: the parser either reads the file or names the offset, nothing else. */
  @Test
  void randomDamageFailsOnlyWithIllegalArgument() {
    SplittableRandom random = new SplittableRandom(20261202);
    for (int trial = 0; trial < 2000; trial++) {
      byte[] damaged = dex.clone();
      int flips = 1 + random.nextInt(4);
      for (int f = 0; f < flips; f++) {
        // Spare file_size, or almost every trial would stop at the first check.
        int at = random.nextInt(0x24, damaged.length);
        damaged[at] = (byte) random.nextInt(256);
      }
      Throwable thrown = catchThrowable(() -> DexFile.parse(damaged));
      if (thrown != null) {
        assertThat(thrown).as("trial %d", trial).isInstanceOf(IllegalArgumentException.class);
        assertThat(thrown.getMessage()).contains("offset");
      }
    }
  }

  private static byte[] withInt(int offset, int value) {
    byte[] copy = dex.clone();
    ByteBuffer.wrap(copy).order(ByteOrder.LITTLE_ENDIAN).putInt(offset, value);
    return copy;
  }
}
