package dev.splitwright.check;

import java.io.ByteArrayInputStream;
import java.io.DataInputStream;
import java.io.IOException;
import java.io.UTFDataFormatException;
import java.io.UncheckedIOException;

/**
 * Reads the big-endian items of a class file (JVMS §4: u1, u2, u4, modified UTF-8) and knows its
 * offset, so every malformation is reported with the offset where the bad item starts.
 */
final class ClassFileReader {

  private final ByteArrayInputStream bytes;
  private final DataInputStream in;
  private final int length;

  ClassFileReader(byte[] classFile) {
    this.bytes = new ByteArrayInputStream(classFile);
    this.in = new DataInputStream(bytes);
    this.length = classFile.length;
  }

  int offset() {
    return length - bytes.available();
  }

  int remaining() {
    return bytes.available();
  }

  int u1(String item) {
    need(1, item);
    try {
      return in.readUnsignedByte();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  int u2(String item) {
    need(2, item);
    try {
      return in.readUnsignedShort();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  long u4(String item) {
    need(4, item);
    try {
      return in.readInt() & 0xFFFF_FFFFL;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** A CONSTANT_Utf8 body: u2 length, then that many bytes of modified UTF-8 (JVMS §4.4.7). */
  String utf8(String item) {
    int start = offset();
    bytes.mark(0);
    need(u2(item + " length"), item);
    bytes.reset();
    try {
      return in.readUTF();
    } catch (UTFDataFormatException e) {
      throw error(start, item + " is not valid modified UTF-8: " + e.getMessage());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  void skip(long count, String item) {
    need(count, item);
    long skipped = bytes.skip(count);
    if (skipped != count) {
      throw new IllegalStateException("skipped " + skipped + " of " + count + " bytes");
    }
  }

  IllegalArgumentException error(int at, String message) {
    return new IllegalArgumentException("malformed class file at offset " + at + ": " + message);
  }

  private void need(long count, String item) {
    if (remaining() < count) {
      throw error(
          offset(),
          "truncated: " + item + " needs " + count + " bytes but " + remaining() + " remain");
    }
  }
}
