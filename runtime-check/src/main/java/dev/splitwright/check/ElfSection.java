package dev.splitwright.check;

import java.util.Objects;

/**
 * One entry of an ELF section header table (System V ABI, gABI chapter "Sections").
 *
 * @param index position in the section header table; 0 is the reserved null section
 * @param name name from the section name string table, or {@code ""} when the file has none
 * @param type {@code sh_type}, e.g. {@link #SHT_PROGBITS} or {@link #SHT_NOBITS}
 * @param flags {@code sh_flags}, e.g. {@link #SHF_ALLOC}
 * @param address {@code sh_addr}: 0 in object files, the load address in linked images
 * @param offset {@code sh_offset}: where the contents start in the file
 * @param size {@code sh_size} in bytes; a {@link #SHT_NOBITS} section has this size in memory but
 *     none in the file
 * @param link {@code sh_link}, e.g. the string table of a symbol table
 * @param info {@code sh_info}
 * @param entrySize {@code sh_entsize}: size of one entry of a table section, else 0
 */
public record ElfSection(
    int index,
    String name,
    long type,
    long flags,
    long address,
    long offset,
    long size,
    long link,
    long info,
    long entrySize) {

  /** Program-defined contents such as code and constants (gABI). */
  public static final long SHT_PROGBITS = 1;

  /** Symbol table (gABI). */
  public static final long SHT_SYMTAB = 2;

  /** String table (gABI). */
  public static final long SHT_STRTAB = 3;

  /** Occupies memory but no file space, e.g. {@code .bss} (gABI). */
  public static final long SHT_NOBITS = 8;

  /** Extended section indices of the symbols of one symbol table (gABI). */
  public static final long SHT_SYMTAB_SHNDX = 18;

  /** Occupies memory while the program runs (gABI). */
  public static final long SHF_ALLOC = 0x2;

  public ElfSection {
    Objects.requireNonNull(name, "name");
    if (index < 0 || type < 0 || flags < 0 || address < 0 || offset < 0 || size < 0
        || link < 0 || info < 0 || entrySize < 0) {
      throw new IllegalArgumentException(
          "index and header fields must be >= 0, but section " + index + " \"" + name
              + "\" has a negative one");
    }
  }

  /** Whether the section takes memory at run time ({@link #SHF_ALLOC}). */
  public boolean isAllocated() {
    return (flags & SHF_ALLOC) != 0;
  }

  /** Whether the section's bytes are stored in the file; false only for {@link #SHT_NOBITS}. */
  public boolean hasFileContents() {
    return type != SHT_NOBITS;
  }

  /**
   * Whether the section counts toward flash (read-only memory) on a microcontroller: an allocated
   * section named {@code .text}, {@code .rodata} or {@code .data}, or one of their
   * {@code -ffunction-sections}/{@code -fdata-sections} children ({@code .text.*} and so on).
   *
   * <p>{@code .data} counts because its initial values are stored in flash and copied to RAM at
   * start-up. {@code .bss} does not: it is zero-filled RAM with no image to store. Unwind tables
   * ({@code .eh_frame}, {@code .ARM.exidx}) do not either: they depend on unwinding options, not on
   * the code being measured.
   */
  public boolean isFlash() {
    return isAllocated()
        && (isNamed(".text") || isNamed(".rodata") || isNamed(".data"));
  }

  private boolean isNamed(String base) {
    return name.equals(base) || name.startsWith(base + ".");
  }
}
