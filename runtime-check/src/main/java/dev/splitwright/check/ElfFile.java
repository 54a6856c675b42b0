package dev.splitwright.check;

import java.io.IOException;
import java.nio.ByteOrder;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * The sections and symbols of an ELF object file or linked image, read by hand from the section
 * header table as the System V ABI describes it (gABI chapters "ELF Header", "Sections" and "Symbol
 * Table"). ELF32 and ELF64, little- and big-endian. Program headers are not read: sizes come from
 * sections, which object files always have.
 */
public final class ElfFile {

  private static final int SHN_LORESERVE = 0xff00;
  private static final int SHN_XINDEX = 0xffff;

  private final boolean is64;
  private final ByteOrder byteOrder;
  private final int type;
  private final int machine;
  private final List<ElfSection> sections;
  private final List<ElfSymbol> symbols;

  private ElfFile(
      boolean is64,
      ByteOrder byteOrder,
      int type,
      int machine,
      List<ElfSection> sections,
      List<ElfSymbol> symbols) {
    this.is64 = is64;
    this.byteOrder = byteOrder;
    this.type = type;
    this.machine = machine;
    this.sections = List.copyOf(sections);
    this.symbols = List.copyOf(symbols);
  }

  /**
   * Parses an ELF file held in memory.
   *
   * @throws IllegalArgumentException if the bytes are not an ELF file, are truncated, or a header
   *     points outside the file; the message names the offset
   */
  public static ElfFile parse(byte[] bytes) {
    Objects.requireNonNull(bytes, "bytes");
    if (bytes.length < 16
        || bytes[0] != 0x7f || bytes[1] != 'E' || bytes[2] != 'L' || bytes[3] != 'F') {
      throw ElfReader.error(0, "not an ELF file: it does not start with 0x7f 'E' 'L' 'F'");
    }
    boolean is64 = switch (bytes[4]) {
      case 1 -> false;
      case 2 -> true;
      default -> throw ElfReader.error(4, "EI_CLASS is " + bytes[4] + ", expected 1 or 2");
    };
    ByteOrder order = switch (bytes[5]) {
      case 1 -> ByteOrder.LITTLE_ENDIAN;
      case 2 -> ByteOrder.BIG_ENDIAN;
      default -> throw ElfReader.error(5, "EI_DATA is " + bytes[5] + ", expected 1 or 2");
    };
    if (bytes[6] != 1) {
      throw ElfReader.error(6, "EI_VERSION is " + bytes[6] + ", expected 1");
    }
    ElfReader in = new ElfReader(bytes, order);
    in.need(0, is64 ? 64 : 52, "ELF header");
    int type = in.u16(16, "e_type");
    int machine = in.u16(18, "e_machine");
    List<ElfSection> sections = readSections(in, is64);
    List<ElfSymbol> symbols = readSymbols(in, is64, sections);
    return new ElfFile(is64, order, type, machine, sections, symbols);
  }

  /**
   * Reads and parses an ELF file.
   *
   * @throws IOException if the file cannot be read
   * @throws IllegalArgumentException if it is not a well-formed ELF file
   */
  public static ElfFile read(Path file) throws IOException {
    return parse(Files.readAllBytes(Objects.requireNonNull(file, "file")));
  }

  /** Whether the file is ELF64 (else ELF32). */
  public boolean is64Bit() {
    return is64;
  }

  /** The byte order of every multi-byte field. */
  public ByteOrder byteOrder() {
    return byteOrder;
  }

  /** {@code e_type}: 1 relocatable object, 2 executable, 3 shared object. */
  public int type() {
    return type;
  }

  /** {@code e_machine}, e.g. 40 for ARM, 62 for x86-64 (gABI). */
  public int machine() {
    return machine;
  }

  /** Every section in header table order, the null section at index 0 included. */
  public List<ElfSection> sections() {
    return sections;
  }

  /** The first section of that name, if any. */
  public Optional<ElfSection> section(String name) {
    Objects.requireNonNull(name, "name");
    return sections.stream().filter(s -> s.name().equals(name)).findFirst();
  }

  /**
   * Size of each named section in header table order; sections sharing a name (e.g. several
   * {@code .group}) are added up. The null section and the unnamed are left out.
   */
  public Map<String, Long> sectionSizes() {
    Map<String, Long> sizes = new LinkedHashMap<>();
    for (ElfSection s : sections) {
      if (!s.name().isEmpty()) {
        sizes.merge(s.name(), s.size(), Long::sum);
      }
    }
    return Collections.unmodifiableMap(sizes);
  }

  /**
   * Bytes the sections would take in flash: the sum of the sizes of the sections for which {@link
   * ElfSection#isFlash()} holds ({@code .text*}, {@code .rodata*}, {@code .data*}, but not {@code
   * .bss*}, which takes RAM only).
   */
  public long flashBytes() {
    return sections.stream().filter(ElfSection::isFlash).mapToLong(ElfSection::size).sum();
  }

  /** Every symbol of the symbol tables ({@code SHT_SYMTAB}), without each table's null entry. */
  public List<ElfSymbol> symbols() {
    return symbols;
  }

  /** The functions this file defines. */
  public List<ElfSymbol> functions() {
    return symbols.stream().filter(s -> s.isFunction() && s.isDefined()).toList();
  }

  /** The data objects this file defines (variables, arrays, tables). */
  public List<ElfSymbol> objects() {
    return symbols.stream().filter(s -> s.isObject() && s.isDefined()).toList();
  }

  private static List<ElfSection> readSections(ElfReader in, boolean is64) {
    long shoff = in.word(is64 ? 40 : 32, is64, "e_shoff");
    int shentsize = in.u16(is64 ? 58 : 46, "e_shentsize");
    long shnum = in.u16(is64 ? 60 : 48, "e_shnum");
    int shstrndx = in.u16(is64 ? 62 : 50, "e_shstrndx");
    if (shoff == 0) {
      return List.of();
    }
    int minimum = is64 ? 64 : 40;
    if (shentsize < minimum) {
      throw ElfReader.error(
          is64 ? 58 : 46, "e_shentsize is " + shentsize + ", less than " + minimum);
    }
    // gABI: with 0xff00 sections or more, e_shnum is 0 and e_shstrndx is SHN_XINDEX; the real
    // values are in sh_size and sh_link of the null section.
    in.need(shoff, shentsize, "section header 0");
    if (shnum == 0) {
      shnum = in.word(shoff + (is64 ? 32 : 20), is64, "sh_size of section 0 (section count)");
    }
    long stringsIndex = shstrndx;
    if (shstrndx == SHN_XINDEX) {
      stringsIndex = in.u32(shoff + (is64 ? 40 : 24), "sh_link of section 0 (e_shstrndx)");
    }
    // Checked before anything is allocated, so a corrupt count cannot ask for a huge list.
    if (shnum > Integer.MAX_VALUE / shentsize) {
      throw ElfReader.error(shoff, "section count " + shnum + " is too large");
    }
    in.need(shoff, shnum * shentsize, "section header table of " + shnum + " entries");
    if (stringsIndex >= shnum && stringsIndex != 0) {
      throw ElfReader.error(
          is64 ? 62 : 50,
          "e_shstrndx is " + stringsIndex + " but there are only " + shnum + " sections");
    }
    List<long[]> headers = new ArrayList<>();
    for (int i = 0; i < shnum; i++) {
      long at = shoff + (long) i * shentsize;
      String item = "section header " + i;
      long[] h = {
        in.u32(at, item + " sh_name"),
        in.u32(at + 4, item + " sh_type"),
        in.word(at + 8, is64, item + " sh_flags"),
        in.word(at + (is64 ? 16 : 12), is64, item + " sh_addr"),
        in.word(at + (is64 ? 24 : 16), is64, item + " sh_offset"),
        in.word(at + (is64 ? 32 : 20), is64, item + " sh_size"),
        in.u32(at + (is64 ? 40 : 24), item + " sh_link"),
        in.u32(at + (is64 ? 44 : 28), item + " sh_info"),
        in.word(at + (is64 ? 56 : 36), is64, item + " sh_entsize"),
      };
      // The null section's size and link may hold the extended count and index, not contents.
      if (i > 0 && h[1] != ElfSection.SHT_NOBITS && h[1] != 0) {
        in.need(h[4], h[5], "contents of section " + i);
      }
      headers.add(h);
    }
    long namesStart = 0;
    long namesEnd = 0;
    if (stringsIndex != 0) {
      long[] names = headers.get((int) stringsIndex);
      namesStart = names[4];
      namesEnd = names[4] + names[5];
    }
    List<ElfSection> sections = new ArrayList<>();
    for (int i = 0; i < headers.size(); i++) {
      long[] h = headers.get(i);
      String name = "";
      if (stringsIndex != 0 && i > 0) {
        if (h[0] >= namesEnd - namesStart) {
          throw ElfReader.error(
              shoff + (long) i * shentsize,
              "sh_name " + h[0] + " of section " + i + " lies outside the section name table");
        }
        name = in.string(namesStart + h[0], namesEnd, "name of section " + i);
      }
      sections.add(new ElfSection(i, name, h[1], h[2], h[3], h[4], h[5], h[6], h[7], h[8]));
    }
    return sections;
  }

  private static List<ElfSymbol> readSymbols(
      ElfReader in, boolean is64, List<ElfSection> sections) {
    List<ElfSymbol> symbols = new ArrayList<>();
    int minimum = is64 ? 24 : 16;
    for (ElfSection table : sections) {
      if (table.type() != ElfSection.SHT_SYMTAB) {
        continue;
      }
      long entsize = table.entrySize();
      if (entsize < minimum || table.size() % entsize != 0) {
        throw ElfReader.error(
            table.offset(),
            "symbol table " + table.name() + " has entry size " + entsize + " and size "
                + table.size() + "; expected entries of at least " + minimum + " bytes");
      }
      ElfSection strings = linkedSection(table, sections, "string table");
      Optional<ElfSection> extended =
          sections.stream()
              .filter(
                  s -> s.type() == ElfSection.SHT_SYMTAB_SHNDX && s.link() == table.index())
              .findFirst();
      long count = table.size() / entsize;
      for (long i = 1; i < count; i++) {
        long at = table.offset() + i * entsize;
        String item = "symbol " + i + " of " + table.name();
        long nameOffset = in.u32(at, item + " st_name");
        long value;
        long size;
        int info;
        int shndx;
        if (is64) {
          info = in.u8(at + 4, item + " st_info");
          shndx = in.u16(at + 6, item + " st_shndx");
          value = in.u64(at + 8, item + " st_value");
          size = in.u64(at + 16, item + " st_size");
        } else {
          value = in.u32(at + 4, item + " st_value");
          size = in.u32(at + 8, item + " st_size");
          info = in.u8(at + 12, item + " st_info");
          shndx = in.u16(at + 14, item + " st_shndx");
        }
        boolean ordinary = shndx < SHN_LORESERVE;
        if (shndx == SHN_XINDEX && extended.isPresent()) {
          long index = in.u32(extended.get().offset() + 4 * i, item + " extended section index");
          ordinary = true;
          shndx = (int) Math.min(index, Integer.MAX_VALUE);
        }
        if (ordinary && shndx >= sections.size()) {
          throw ElfReader.error(
              at, item + " refers to section " + shndx + " but there are " + sections.size());
        }
        if (nameOffset >= strings.size() && nameOffset != 0) {
          throw ElfReader.error(at, item + " st_name " + nameOffset + " lies outside its strings");
        }
        String name =
            strings.size() == 0
                ? ""
                : in.string(
                    strings.offset() + nameOffset,
                    strings.offset() + strings.size(),
                    "name of " + item);
        symbols.add(new ElfSymbol(name, value, size, info & 0xf, info >>> 4, shndx));
      }
    }
    return symbols;
  }

  private static ElfSection linkedSection(
      ElfSection table, List<ElfSection> sections, String what) {
    if (table.link() == 0 || table.link() >= sections.size()) {
      throw ElfReader.error(
          table.offset(),
          table.name() + " links to section " + table.link() + ", which is no " + what);
    }
    ElfSection linked = sections.get((int) table.link());
    if (linked.type() != ElfSection.SHT_STRTAB) {
      throw ElfReader.error(
          linked.offset(),
          table.name() + " links to " + linked.name() + " of type " + linked.type()
              + ", expected a " + what);
    }
    return linked;
  }
}
