package dev.splitwright.check;

/**
 * Reads the little-endian items of a DEX file and checks every access against the file's length,
 * so a truncated or corrupt file fails with the offset of the bad item instead of an index
 * exception.
 */
final class DexReader extends BoundedBytes {

  DexReader(byte[] bytes) {
    super(bytes, "DEX");
  }

  /**
   * A {@code uint} field used as a size or an offset. Values of 2^31 and above cannot index a Java
   * array, so they fail here rather than wrap around.
   */
  int u32(long offset, String item) {
    need(offset, 4, item);
    int at = (int) offset;
    long value =
        (bytes[at] & 0xFFL)
            | (bytes[at + 1] & 0xFFL) << 8
            | (bytes[at + 2] & 0xFFL) << 16
            | (bytes[at + 3] & 0xFFL) << 24;
    if (value > Integer.MAX_VALUE) {
      throw error(offset, item + " is " + value + ", beyond 2^31 - 1");
    }
    return (int) value;
  }

  /** A {@code uint} field whose every bit pattern is meaningful, such as the checksum. */
  long u32Raw(long offset, String item) {
    need(offset, 4, item);
    int at = (int) offset;
    return (bytes[at] & 0xFFL)
        | (bytes[at + 1] & 0xFFL) << 8
        | (bytes[at + 2] & 0xFFL) << 16
        | (bytes[at + 3] & 0xFFL) << 24;
  }

  byte[] slice(long offset, int length, String item) {
    need(offset, length, item);
    byte[] copy = new byte[length];
    System.arraycopy(bytes, (int) offset, copy, 0, length);
    return copy;
  }

  /**
   * A {@code string_data_item}: a ULEB128 count of UTF-16 code units, then MUTF-8 bytes ending in
   * one NUL byte (Dalvik executable format, "MUTF-8 (Modified UTF-8) Encoding" and
   * "string_data_item").
   */
  String mutf8String(long offset, String item) {
    long[] at = {offset};
    long units = uleb128(at, item + " length");
    StringBuilder text = new StringBuilder();
    while (true) {
      long start = at[0];
      int a = u8(start, item);
      at[0]++;
      char c;
      if (a == 0) {
        break;
      } else if (a < 0x80) {
        c = (char) a;
      } else if ((a & 0xE0) == 0xC0) {
        c = (char) ((a & 0x1F) << 6 | continuation(at, start, item));
      } else if ((a & 0xF0) == 0xE0) {
        int b = continuation(at, start, item);
        c = (char) ((a & 0x0F) << 12 | b << 6 | continuation(at, start, item));
      } else {
        throw error(start, item + " has byte 0x" + Integer.toHexString(a) + ", not MUTF-8");
      }
      text.append(c);
    }
    if (text.length() != units) {
      throw error(
          offset, item + " declares " + units + " UTF-16 units but holds " + text.length());
    }
    return text.toString();
  }

  static IllegalArgumentException error(long offset, String message) {
    return malformed("DEX", offset, message);
  }

  private int continuation(long[] at, long start, String item) {
    int b = u8(at[0], item);
    if ((b & 0xC0) != 0x80) {
      throw error(start, item + " has a MUTF-8 sequence cut short at offset " + at[0]);
    }
    at[0]++;
    return b & 0x3F;
  }

  /** An unsigned LEB128 value of at most 32 bits, i.e. at most five bytes; advances {@code at}. */
  private long uleb128(long[] at, String item) {
    long start = at[0];
    long value = 0;
    for (int i = 0; i < 5; i++) {
      int b = u8(at[0], item);
      at[0]++;
      value |= (long) (b & 0x7F) << (7 * i);
      if ((b & 0x80) == 0) {
        if (value > 0xFFFF_FFFFL) {
          throw error(start, item + " does not fit in 32 bits");
        }
        return value;
      }
    }
    throw error(start, item + " is a ULEB128 value longer than five bytes");
  }
}
