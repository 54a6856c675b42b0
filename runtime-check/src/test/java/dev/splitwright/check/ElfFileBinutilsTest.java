package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.ByteOrder;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Cross-checks the hand-written ELF reader with GNU binutils (outside reference): section sizes
 * with {@code size -A}, symbol values and sizes with {@code nm -S}, on objects the host C compiler
 * and, when installed, the ARM cross compiler build.
 */
class ElfFileBinutilsTest {

  private static final Duration LIMIT = Duration.ofSeconds(60);

  // Functions, constant tables, initialised and zeroed data, a string literal and a switch that
  // -O2 turns into a jump table, so .text.*, .rodata.*, .data.* and .bss.* all appear.
  private static final String TABLES =
      """
      #include <stdint.h>

      const int32_t table[5] = {1, 2, 3, 4, 5};
      const float limits[3] = {0.5f, 1.5f, 2.5f};
      int32_t counter = 7;
      int32_t zeros[10];
      static int32_t hidden = 3;
      static const char label[] = "splitwright";

      int32_t pick(int32_t x) { return table[x % 5] + counter + hidden++; }

      int32_t bucket(const float *v) {
        int32_t b = 0;
        while (b < 3 && v[0] > limits[b]) {
          b++;
        }
        return b + zeros[b];
      }

      const char *name(int32_t which) { return which ? label : "none"; }
      """;

  private static final String SWITCH =
      """
      #include <stdint.h>

      int32_t decode(int32_t op, int32_t a, int32_t b) {
        switch (op) {
          case 0: return a + b;
          case 1: return a - b;
          case 2: return a * b;
          case 3: return a ^ b;
          case 4: return a | b;
          case 5: return a & b;
          case 6: return a << (b & 31);
          case 7: return b ? a / b : 0;
          default: return -1;
        }
      }
      """;

  private static final Pattern FLASH_NAME = Pattern.compile("\\.(text|rodata|data)(\\..*)?");

  @TempDir Path dir;

  @ParameterizedTest
  @ValueSource(strings = {"-Os", "-O2"})
  void hostObjectsMatchSizeAndNm(String optimization) throws Exception {
    CCompiler cc =
        CCompiler.find(
            "cc", List.of("-std=c99", optimization, "-ffunction-sections", "-fdata-sections"),
            LIMIT);

    ObjectFiles objects = cc.compileObjects(Map.of("tables.c", TABLES, "switch.c", SWITCH));

    assertThat(objects.sourceNames()).containsExactly("switch.c", "tables.c");
    for (String source : objects.sourceNames()) {
      ElfFile elf = compareWithBinutils(objects.bytes(source), "size", "nm");
      assertThat(elf.type()).as("e_type of a relocatable object (gABI)").isEqualTo(1);
    }
    ElfFile tables = objects.elf("tables.c");
    // Worked by hand from the C source: 5 int32 = 20 bytes, 10 int32 = 40 bytes.
    assertThat(tables.section(".rodata.table").orElseThrow().size()).isEqualTo(20);
    assertThat(tables.section(".bss.zeros").orElseThrow().size()).isEqualTo(40);
    assertThat(tables.section(".bss.zeros").orElseThrow().isFlash()).isFalse();
    assertThat(tables.section(".data.counter").orElseThrow().isFlash()).isTrue();
    assertThat(names(tables.functions())).contains("pick", "bucket", "name");
    assertThat(names(tables.objects())).contains("table", "limits", "counter", "zeros", "hidden");
  }

  @Test
  void armCortexM4ObjectMatchesArmSizeAndNm() throws Exception {
    ElfFile elf = compileForArm(List.of("-mcpu=cortex-m4", "-mthumb"));

    // e_machine 40 is EM_ARM (gABI machine table).
    assertThat(elf.is64Bit()).isFalse();
    assertThat(elf.byteOrder()).isEqualTo(ByteOrder.LITTLE_ENDIAN);
    assertThat(elf.machine()).isEqualTo(40);
  }

  @Test
  void bigEndianArmObjectMatchesArmSizeAndNm() throws Exception {
    ElfFile elf = compileForArm(List.of("-mcpu=cortex-m3", "-mthumb", "-mbig-endian"));

    assertThat(elf.is64Bit()).isFalse();
    assertThat(elf.byteOrder()).isEqualTo(ByteOrder.BIG_ENDIAN);
    assertThat(elf.machine()).isEqualTo(40);
  }

  private ElfFile compileForArm(List<String> target) throws Exception {
    List<String> flags = new ArrayList<>(target);
    flags.addAll(List.of("-std=c99", "-Os", "-ffunction-sections", "-fdata-sections"));
    CCompiler cc = armCompiler(flags);
    ObjectFiles objects = cc.compileObjects(Map.of("tables.c", TABLES, "switch.c", SWITCH));
    compareWithBinutils(objects.bytes("switch.c"), "arm-none-eabi-size", "arm-none-eabi-nm");
    return compareWithBinutils(
        objects.bytes("tables.c"), "arm-none-eabi-size", "arm-none-eabi-nm");
  }

  private static CCompiler armCompiler(List<String> flags) {
    try {
      return CCompiler.find("arm-none-eabi-gcc", flags, LIMIT);
    } catch (CCompilerNotFoundException e) {
      return Assumptions.abort(
          "arm-none-eabi-gcc is not on PATH; install gcc-arm-none-eabi, libnewlib-arm-none-eabi"
              + " and binutils-arm-none-eabi to run this check");
    }
  }

  private ElfFile compareWithBinutils(byte[] object, String size, String nm) throws Exception {
    Path file = Files.createTempFile(dir, "object", ".o");
    Files.write(file, object);
    ElfFile elf = ElfFile.parse(object);

    // size -A lists the sections BFD shows (not symbol, string or relocation tables), in header
    // table order; every one must be ours with the same size.
    List<Binutils.SizeRow> expected = Binutils.sizeA(size, file);
    Set<String> listed = expected.stream().map(Binutils.SizeRow::name).collect(Collectors.toSet());
    List<Binutils.SizeRow> actual =
        elf.sections().stream()
            .filter(s -> listed.contains(s.name()))
            .map(s -> new Binutils.SizeRow(s.name(), s.size()))
            .toList();
    assertThat(actual).as("sections of %s by %s -A", file.getFileName(), size)
        .isEqualTo(expected);
    assertThat(expected).as("size -A output").isNotEmpty();

    long flashBySize =
        expected.stream()
            .filter(r -> FLASH_NAME.matcher(r.name()).matches())
            .mapToLong(Binutils.SizeRow::size)
            .sum();
    assertThat(elf.flashBytes()).isEqualTo(flashBySize).isPositive();

    // nm -S prints a size for every defined symbol that has one. On ARM, BFD clears the Thumb
    // bit of function values (ELF for the ARM Architecture, "Symbol Values"), so compare without
    // it there.
    Map<String, Binutils.NmRow> byNm = new TreeMap<>();
    for (Binutils.NmRow row : Binutils.nmSized(nm, file)) {
      byNm.put(row.name(), row);
    }
    Map<String, Binutils.NmRow> ours = new TreeMap<>();
    for (ElfSymbol s : elf.symbols()) {
      if ((s.isFunction() || s.isObject()) && s.isDefined() && s.size() > 0) {
        long value = elf.machine() == 40 && s.isFunction() ? s.value() & ~1L : s.value();
        ours.put(s.name(), new Binutils.NmRow(s.name(), value, s.size(), '?'));
      }
    }
    assertThat(ours.keySet()).as("sized symbols per %s -S", nm).isEqualTo(byNm.keySet());
    ours.forEach(
        (name, row) -> {
          assertThat(row.size()).as("size of %s", name).isEqualTo(byNm.get(name).size());
          assertThat(row.value()).as("value of %s", name).isEqualTo(byNm.get(name).value());
        });
    return elf;
  }

  private static List<String> names(List<ElfSymbol> symbols) {
    return symbols.stream().map(ElfSymbol::name).toList();
  }
}
