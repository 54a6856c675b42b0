package dev.splitwright.check;

import java.util.Locale;

/**
 * A file's bytes with every access checked against its length, so that a truncated or corrupt file
 * fails with the offset of the bad item instead of an index exception. Shared by the readers of
 * binary formats ({@link ElfReader}, {@link DexReader}).
 */
abstract class BoundedBytes {
  /** The file, never written to. */
  final byte[] bytes;
  private final String format;

  BoundedBytes(byte[] bytes, String format) {
    this.bytes = bytes;
    this.format = format;
  }

  final int length() {
    return bytes.length;
  }

  /** Fails unless {@code length} bytes starting at {@code offset} lie inside the file. */
  final void need(long offset, long length, String item) {
    if (offset < 0 || length < 0 || offset > bytes.length || length > bytes.length - offset) {
      throw malformed(format, offset, String.format(Locale.ROOT,
          "truncated: %s needs %d bytes at offset %d but the file has %d bytes",
          item, length, offset, bytes.length));
    }
  }

  final int u8(long offset, String item) {
    need(offset, 1, item);
    return bytes[(int) offset] & 0xFF;
  }

  /** The exception for a malformed file of {@code format} (e.g. {@code ELF}) at {@code offset}. */
  static IllegalArgumentException malformed(String format, long offset, String message) {
    return new IllegalArgumentException(
        "malformed " + format + " file at offset " + offset + ": " + message);
  }
}
