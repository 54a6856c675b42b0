package dev.splitwright.data;

import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.Objects;

/**
 * Decodes strict UTF-8 from a byte stream, dropping a leading byte order mark, while hashing the
 * raw bytes and counting lines, so that a bad byte can be reported with its line. A plain {@code
 * InputStreamReader} cannot say where the bad byte was: it decodes ahead in blocks.
 *
 * <p>Characters before a bad byte are delivered first; the read that would return the bad byte
 * throws {@link MalformedUtf8Exception}.
 */
final class Utf8FileReader extends Reader {
  private static final int BUFFER = 1 << 16;

  private final InputStream in;
  private final MessageDigest digest;
  private final CharsetDecoder decoder =
      StandardCharsets.UTF_8
          .newDecoder()
          .onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT);
  private final ByteBuffer bytes = ByteBuffer.allocate(BUFFER);
  private final CharBuffer chars = CharBuffer.allocate(BUFFER);

  /** File offset of {@code bytes.array()[0]}. */
  private long bufferStart;

  private long bytesRead;
  private boolean endOfInput;
  private boolean flushed;
  private boolean atStart = true;
  private long lineBreaks;
  private boolean lastWasCr;
  private MalformedUtf8Exception pending;

  /**
   * @param digest updated with every byte read, or {@code null} for none
   */
  Utf8FileReader(InputStream in, MessageDigest digest) {
    this.in = Objects.requireNonNull(in, "in");
    this.digest = digest;
    bytes.flip();
    chars.flip();
  }

  @Override
  public int read(char[] cbuf, int off, int len) throws IOException {
    Objects.checkFromIndexSize(off, len, cbuf.length);
    if (len == 0) {
      return 0;
    }
    if (!chars.hasRemaining() && !fill()) {
      return -1;
    }
    int n = Math.min(len, chars.remaining());
    chars.get(cbuf, off, n);
    return n;
  }

  /** Decodes the next block of characters; false at the end of the input. */
  private boolean fill() throws IOException {
    if (pending != null) {
      throw pending;
    }
    if (flushed) {
      // The parser may read again after the end (it does when the last line has no line break);
      // a flushed decoder must not be called again (CharsetDecoder's state machine).
      return false;
    }
    chars.clear();
    CoderResult error = null;
    while (chars.position() == 0) {
      CoderResult result = decoder.decode(bytes, chars, endOfInput);
      if (result.isError()) {
        error = result;
        break;
      }
      if (chars.position() > 0) {
        break;
      }
      if (endOfInput) {
        if (!flushed) {
          decoder.flush(chars);
          flushed = true;
        }
        break;
      }
      readMoreBytes();
    }
    chars.flip();
    if (atStart && chars.hasRemaining()) {
      atStart = false;
      if (chars.get(chars.position()) == '\uFEFF') {
        chars.get();
      }
    }
    countLineBreaks();
    if (error != null) {
      int bad = bytes.get(bytes.position()) & 0xFF;
      pending = new MalformedUtf8Exception(lineBreaks + 1, bufferStart + bytes.position(), bad);
      if (!chars.hasRemaining()) {
        throw pending;
      }
    }
    return chars.hasRemaining();
  }

  private void readMoreBytes() throws IOException {
    bufferStart += bytes.position();
    bytes.compact();
    int n = in.read(bytes.array(), bytes.position(), bytes.remaining());
    if (n < 0) {
      endOfInput = true;
    } else {
      if (digest != null) {
        digest.update(bytes.array(), bytes.position(), n);
      }
      bytes.position(bytes.position() + n);
      bytesRead += n;
    }
    bytes.flip();
  }

  /** Counts CR, LF and CRLF each as one line break, across block boundaries. */
  private void countLineBreaks() {
    char[] a = chars.array();
    for (int i = chars.position(); i < chars.limit(); i++) {
      char c = a[i];
      if (c == '\r') {
        lineBreaks++;
      } else if (c == '\n' && !lastWasCr) {
        lineBreaks++;
      }
      lastWasCr = c == '\r';
    }
  }

  /** Reads and hashes whatever the parser left unread, so the digest covers the whole file. */
  void drain() throws IOException {
    byte[] scratch = new byte[BUFFER];
    int n;
    while ((n = in.read(scratch)) >= 0) {
      if (digest != null) {
        digest.update(scratch, 0, n);
      }
      bytesRead += n;
    }
    endOfInput = true;
  }

  /** Bytes read from the stream so far. */
  long bytesRead() {
    return bytesRead;
  }

  @Override
  public void close() throws IOException {
    in.close();
  }
}
