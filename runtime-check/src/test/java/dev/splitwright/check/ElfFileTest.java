package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;

import dev.splitwright.check.HandBuiltElf.Section;
import java.io.ByteArrayOutputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The ELF reader on files built by hand from the gABI layout (all four class and byte order
 * combinations, the extended section numbering escape) and on broken input: every prefix of a
 * real object, foreign files and random corruption must give an IllegalArgumentException, never
 * an index exception.
 */
class ElfFileTest {

  private static final long ALLOC = 0x2;
  private static final long WRITE = 0x1;
  private static final long EXEC = 0x4;
  private static final int EM_ARM = 40;

  /**
   * .text 12, .rodata 8, .data 4, .bss 64 (no file space), .comment and an unallocated .text.unused
   * (neither counts), a symbol table with a defined function, a defined object and an undefined
   * function. Section indices: .text 1, .rodata 2, .data 3, .bss 4, .comment 5, .text.unused 6,
   * .symtab 7, .strtab 8, .shstrtab 9.
   */
  private static byte[] sample(boolean is64, ByteOrder order) {
    byte[] strings = "\0classify\0weights\0helper\0".getBytes(StandardCharsets.US_ASCII);
    ByteArrayOutputStream symbols = new ByteArrayOutputStream();
    symbols.writeBytes(HandBuiltElf.symbol(is64, order, 0, 0, 0, 0, 0));
    // st_info = binding << 4 | type (gABI): 0x12 global function, 0x01 local object.
    symbols.writeBytes(HandBuiltElf.symbol(is64, order, 1, 0, 12, 0x12, 1));
    symbols.writeBytes(HandBuiltElf.symbol(is64, order, 10, 0, 8, 0x01, 2));
    symbols.writeBytes(HandBuiltElf.symbol(is64, order, 18, 0, 0, 0x12, 0));
    byte[] table = symbols.toByteArray();
    return HandBuiltElf.build(
        is64,
        order,
        EM_ARM,
        List.of(
            Section.progbits(".text", ALLOC | EXEC, 12),
            Section.progbits(".rodata", ALLOC, 8),
            Section.progbits(".data", ALLOC | WRITE, 4),
            Section.nobits(".bss", ALLOC | WRITE, 64),
            Section.progbits(".comment", 0x30, 5),
            Section.progbits(".text.unused", 0, 6),
            new Section(".symtab", 2, 0, table, table.length, 8, is64 ? 24 : 16),
            new Section(".strtab", 3, 0, strings, strings.length, 0, 0)));
  }

  @ParameterizedTest
  @CsvSource({"false, BIG_ENDIAN", "false, LITTLE_ENDIAN", "true, BIG_ENDIAN",
      "true, LITTLE_ENDIAN"})
  void readsHandBuiltFileOfEveryClassAndByteOrder(boolean is64, String orderName) {
    ByteOrder order =
        orderName.equals("BIG_ENDIAN") ? ByteOrder.BIG_ENDIAN : ByteOrder.LITTLE_ENDIAN;

    ElfFile elf = ElfFile.parse(sample(is64, order));

    assertThat(elf.is64Bit()).isEqualTo(is64);
    assertThat(elf.byteOrder()).isEqualTo(order);
    assertThat(elf.machine()).isEqualTo(EM_ARM);
    assertThat(elf.type()).isEqualTo(1);
    assertThat(elf.sections()).hasSize(10);
    assertThat(elf.sectionSizes())
        .containsExactly(
            Map.entry(".text", 12L),
            Map.entry(".rodata", 8L),
            Map.entry(".data", 4L),
            Map.entry(".bss", 64L),
            Map.entry(".comment", 5L),
            Map.entry(".text.unused", 6L),
            Map.entry(".symtab", (is64 ? 24L : 16L) * 4),
            Map.entry(".strtab", 25L),
            // Worked by hand: 1 + ".text\0" 6 + ".rodata\0" 8 + ".data\0" 6 + ".bss\0" 5
            // + ".comment\0" 9 + ".text.unused\0" 13 + ".symtab\0" 8 + ".strtab\0" 8
            // + ".shstrtab\0" 10 = 74.
            Map.entry(".shstrtab", 74L));
    ElfSection bss = elf.section(".bss").orElseThrow();
    assertThat(bss.hasFileContents()).isFalse();
    assertThat(bss.isAllocated()).isTrue();
    // Worked by hand: .text 12 + .rodata 8 + .data 4; .bss is RAM only, .comment and the
    // unallocated .text.unused are not loaded at all.
    assertThat(elf.flashBytes()).isEqualTo(24);
    assertThat(elf.symbols())
        .containsExactly(
            new ElfSymbol("classify", 0, 12, ElfSymbol.STT_FUNC, 1, 1),
            new ElfSymbol("weights", 0, 8, ElfSymbol.STT_OBJECT, 0, 2),
            new ElfSymbol("helper", 0, 0, ElfSymbol.STT_FUNC, 1, 0));
    assertThat(elf.functions()).extracting(ElfSymbol::name).containsExactly("classify");
    assertThat(elf.objects()).extracting(ElfSymbol::name).containsExactly("weights");
  }

  @Test
  void followsExtendedSectionCountAndNameTableIndex() {
    boolean is64 = false;
    ByteOrder order = ByteOrder.BIG_ENDIAN;
    byte[] bytes = sample(is64, order);
    ByteBuffer buffer = ByteBuffer.wrap(bytes).order(order);
    int shoff = buffer.getInt(HandBuiltElf.shoffOffset(is64));
    // gABI: e_shnum 0 means the count is in section 0's sh_size; e_shstrndx SHN_XINDEX (0xffff)
    // means the index is in section 0's sh_link (ELF32 offsets 20 and 24).
    buffer.putShort(HandBuiltElf.shnumOffset(is64), (short) 0);
    buffer.putShort(HandBuiltElf.shstrndxOffset(is64), (short) 0xffff);
    buffer.putInt(shoff + 20, 10);
    buffer.putInt(shoff + 24, 9);

    ElfFile elf = ElfFile.parse(bytes);

    assertThat(elf.sections()).hasSize(10);
    assertThat(elf.sections().get(9).name()).isEqualTo(".shstrtab");
    assertThat(elf.flashBytes()).isEqualTo(24);
  }

  @Test
  void fileWithoutSectionTableHasNoSections() {
    byte[] bytes = sample(true, ByteOrder.LITTLE_ENDIAN);
    ByteBuffer.wrap(bytes).order(ByteOrder.LITTLE_ENDIAN)
        .putLong(HandBuiltElf.shoffOffset(true), 0);

    ElfFile elf = ElfFile.parse(bytes);

    assertThat(elf.sections()).isEmpty();
    assertThat(elf.symbols()).isEmpty();
    assertThat(elf.flashBytes()).isZero();
  }

  @Test
  void rejectsEveryProperPrefixOfACompiledObject() throws Exception {
    byte[] object =
        CCompiler.find("cc", List.of("-Os"), Duration.ofSeconds(60))
            .compileObjects(Map.of("f.c", "int f(int x) { return x * 3; }\nint g = 4;\n"))
            .bytes("f.c");
    ElfFile.parse(object);

    // gcc writes the section header table last, so every cut loses part of it.
    for (int length = 0; length < object.length; length++) {
      byte[] prefix = Arrays.copyOf(object, length);
      assertThatIllegalArgumentException()
          .as("prefix of %d of %d bytes", length, object.length)
          .isThrownBy(() -> ElfFile.parse(prefix))
          .withMessageStartingWith("malformed ELF file at offset ");
    }
  }

  @Test
  void rejectsFilesThatAreNotElf() {
    assertThatIllegalArgumentException()
        .isThrownBy(() -> ElfFile.parse(new byte[0]))
        .withMessage(
            "malformed ELF file at offset 0: not an ELF file: it does not start with 0x7f 'E' 'L'"
                + " 'F'");
    // A class file starts with 0xCAFEBABE (JVMS §4.1).
    byte[] classFile = {(byte) 0xCA, (byte) 0xFE, (byte) 0xBA, (byte) 0xBE, 0, 0, 0, 61,
        0, 0, 0, 0, 0, 0, 0, 0, 0, 0};
    assertThatIllegalArgumentException()
        .isThrownBy(() -> ElfFile.parse(classFile))
        .withMessageContaining("not an ELF file");
  }

  @Test
  void rejectsUnknownClassAndByteOrder() {
    byte[] badClass = sample(false, ByteOrder.LITTLE_ENDIAN);
    badClass[4] = 3;
    assertThatIllegalArgumentException()
        .isThrownBy(() -> ElfFile.parse(badClass))
        .withMessage("malformed ELF file at offset 4: EI_CLASS is 3, expected 1 or 2");
    byte[] badOrder = sample(false, ByteOrder.LITTLE_ENDIAN);
    badOrder[5] = 0;
    assertThatIllegalArgumentException()
        .isThrownBy(() -> ElfFile.parse(badOrder))
        .withMessage("malformed ELF file at offset 5: EI_DATA is 0, expected 1 or 2");
  }

  @Test
  void rejectsSectionNameOutsideNameTable() {
    byte[] bytes = sample(false, ByteOrder.BIG_ENDIAN);
    ByteBuffer buffer = ByteBuffer.wrap(bytes);
    int shoff = buffer.getInt(HandBuiltElf.shoffOffset(false));
    buffer.putInt(shoff + 40, 5000); // sh_name of section 1

    assertThatIllegalArgumentException()
        .isThrownBy(() -> ElfFile.parse(bytes))
        .withMessageContaining("sh_name 5000 of section 1 lies outside the section name table");
  }

  @Test
  void rejectsSymbolTableLinkedToANonStringSection() {
    byte[] bytes = sample(true, ByteOrder.LITTLE_ENDIAN);
    ByteBuffer buffer = ByteBuffer.wrap(bytes).order(ByteOrder.LITTLE_ENDIAN);
    long shoff = buffer.getLong(HandBuiltElf.shoffOffset(true));
    buffer.putInt((int) shoff + 7 * 64 + 40, 1); // sh_link of .symtab -> .text

    assertThatIllegalArgumentException()
        .isThrownBy(() -> ElfFile.parse(bytes))
        .withMessageContaining(".symtab links to .text of type 1, expected a string table");
  }

  @Test
  void randomCorruptionGivesAnElfOrAnIllegalArgumentException() {
    Random random = new Random(20261202L);
    for (boolean is64 : new boolean[] {false, true}) {
      byte[] original = sample(is64, ByteOrder.BIG_ENDIAN);
      for (int round = 0; round < 3000; round++) {
        byte[] bytes = original.clone();
        for (int flips = 1 + random.nextInt(4); flips > 0; flips--) {
          bytes[random.nextInt(bytes.length)] = (byte) random.nextInt(256);
        }
        try {
          ElfFile elf = ElfFile.parse(bytes);
          assertThat(elf.flashBytes()).isNotNegative();
        } catch (IllegalArgumentException expected) {
          assertThat(expected).hasMessageStartingWith("malformed ELF file at offset ");
        }
      }
    }
  }
}
