package dev.splitwright.data;

import java.io.IOException;

/** Thrown through the CSV parser when the file holds bytes that are not UTF-8. */
final class MalformedUtf8Exception extends IOException {
  private static final long serialVersionUID = 1L;

  private final long line;
  private final long byteOffset;
  private final int badByte;

  MalformedUtf8Exception(long line, long byteOffset, int badByte) {
    super("invalid UTF-8 at line " + line + ", byte offset " + byteOffset);
    this.line = line;
    this.byteOffset = byteOffset;
    this.badByte = badByte;
  }

  /** 1-based line holding the first bad byte. */
  long line() {
    return line;
  }

  /** 0-based offset of the first bad byte from the start of the file. */
  long byteOffset() {
    return byteOffset;
  }

  /** The first bad byte, 0..255. */
  int badByte() {
    return badByte;
  }
}
