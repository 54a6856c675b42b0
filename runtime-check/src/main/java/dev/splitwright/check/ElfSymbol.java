package dev.splitwright.check;

import java.util.Objects;

/**
 * One entry of an ELF symbol table (System V ABI, gABI chapter "Symbol Table").
 *
 * @param name name from the symbol table's linked string table, {@code ""} for unnamed symbols
 * @param value {@code st_value}: the offset inside its section in object files, an address in
 *     linked images; on ARM the lowest bit of a Thumb function's value is set
 * @param size {@code st_size} in bytes, 0 when unknown
 * @param type {@code ELF_ST_TYPE(st_info)}, e.g. {@link #STT_FUNC}
 * @param binding {@code ELF_ST_BIND(st_info)}: 0 local, 1 global, 2 weak
 * @param sectionIndex {@code st_shndx}, already resolved through {@code SHT_SYMTAB_SHNDX} when it
 *     was {@code SHN_XINDEX}; {@link #SHN_UNDEF} for undefined symbols
 */
public record ElfSymbol(
    String name, long value, long size, int type, int binding, int sectionIndex) {

  /** A data object such as a variable or array (gABI). */
  public static final int STT_OBJECT = 1;

  /** A function or other executable code (gABI). */
  public static final int STT_FUNC = 2;

  /** The symbol is referenced here but defined elsewhere (gABI). */
  public static final int SHN_UNDEF = 0;

  public ElfSymbol {
    Objects.requireNonNull(name, "name");
    if (value < 0 || size < 0 || type < 0 || type > 15 || binding < 0 || binding > 15
        || sectionIndex < 0) {
      throw new IllegalArgumentException(
          "symbol \"" + name + "\" has a field out of range: value " + value + ", size " + size
              + ", type " + type + ", binding " + binding + ", section " + sectionIndex);
    }
  }

  /** Whether the symbol names a function ({@link #STT_FUNC}). */
  public boolean isFunction() {
    return type == STT_FUNC;
  }

  /** Whether the symbol names a data object ({@link #STT_OBJECT}). */
  public boolean isObject() {
    return type == STT_OBJECT;
  }

  /** Whether this file defines the symbol, i.e. its section index is not {@link #SHN_UNDEF}. */
  public boolean isDefined() {
    return sectionIndex != SHN_UNDEF;
  }
}
