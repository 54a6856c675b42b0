package dev.splitwright.check;

import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;

/**
 * Reads the fixed-size items of an ELF file in the file's own byte order and checks every access
 * against the file's length, so a truncated or corrupt file fails with the offset of the bad item
 * instead of an index exception.
 */
final class ElfReader extends BoundedBytes {

  private final ByteOrder order;

  ElfReader(byte[] bytes, ByteOrder order) {
    super(bytes, "ELF");
    this.order = order;
  }

  int u16(long offset, String item) {
    need(offset, 2, item);
    return (int) unsigned(offset, 2);
  }

  long u32(long offset, String item) {
    need(offset, 4, item);
    return unsigned(offset, 4);
  }

  /** A 64-bit field; values of 2^63 and above make no sense for offsets or sizes, so they fail. */
  long u64(long offset, String item) {
    need(offset, 8, item);
    long value = unsigned(offset, 8);
    if (value < 0) {
      throw error(offset, item + " is " + Long.toUnsignedString(value) + ", beyond 2^63 - 1");
    }
    return value;
  }

  /** An address-sized field: 4 bytes in ELF32, 8 in ELF64. */
  long word(long offset, boolean is64, String item) {
    return is64 ? u64(offset, item) : u32(offset, item);
  }

  /** A NUL-terminated string starting at {@code start} that must end before {@code end}. */
  String string(long start, long end, String item) {
    need(start, 0, item);
    for (long i = start; i < end; i++) {
      need(i, 1, item);
      if (bytes[(int) i] == 0) {
        return new String(bytes, (int) start, (int) (i - start), StandardCharsets.UTF_8);
      }
    }
    throw error(start, item + " has no terminating NUL before offset " + end);
  }

  static IllegalArgumentException error(long offset, String message) {
    return malformed("ELF", offset, message);
  }

  private long unsigned(long offset, int size) {
    int at = (int) offset;
    long value = 0;
    for (int i = 0; i < size; i++) {
      int index = order == ByteOrder.LITTLE_ENDIAN ? at + size - 1 - i : at + i;
      value = (value << 8) | (bytes[index] & 0xFF);
    }
    return value;
  }
}
