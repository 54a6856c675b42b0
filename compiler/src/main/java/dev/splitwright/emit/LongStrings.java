package dev.splitwright.emit;

import com.palantir.javapoet.CodeBlock;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes text of any length as a Java expression of {@code String} constants. One constant holds
 * at most 65,535 bytes of modified UTF-8 (JVM Specification §4.4.7, {@code CONSTANT_Utf8_info}
 * length is a u2), and javac folds {@code "a" + "b"} into one constant, so longer text is cut into
 * constants joined at run time with {@code String.concat}, which keeps the class inside java.lang
 * (a non-constant {@code +} would compile to an invokedynamic into java.lang.invoke).
 */
final class LongStrings {
  /**
   * Most bytes of one constant. The spec allows 65,535, but javac also refuses a constant string
   * of 65,535 or more chars ("constant string too long"; measured, see LongStringsTest).
   */
  static final int MAX_CONSTANT_BYTES = 65534;
  /**
   * Columns of one literal, quotes and escapes included: with the {@code + } and a continuation
   * indent in front and {@code , n);} after it, a line stays within 100 columns.
   */
  private static final int LITERAL_COLUMNS = 66;

  private LongStrings() {}

  /** An expression whose value is {@code text}. */
  static CodeBlock expression(String text) {
    return expression(text, MAX_CONSTANT_BYTES);
  }

  static CodeBlock expression(String text, int maxConstantBytes) {
    List<String> constants = split(text, maxConstantBytes);
    if (constants.size() == 1) {
      return lines(constants.get(0));
    }
    CodeBlock.Builder out = CodeBlock.builder().add("($L)", lines(constants.get(0)));
    for (int i = 1; i < constants.size(); i++) {
      out.add("\n.concat($L)", lines(constants.get(i)));
    }
    return out.build();
  }

  /** Cuts {@code text} into pieces of at most {@code maxBytes} bytes of modified UTF-8 each. */
  static List<String> split(String text, int maxBytes) {
    List<String> out = new ArrayList<>();
    int start = 0;
    int bytes = 0;
    for (int i = 0; i < text.length(); i++) {
      int size = modifiedUtf8Bytes(text.charAt(i));
      if (bytes + size > maxBytes) {
        out.add(text.substring(start, i));
        start = i;
        bytes = 0;
      }
      bytes += size;
    }
    out.add(text.substring(start));
    return out;
  }

  /**
   * Bytes one char takes in a class file's modified UTF-8 (JVMS §4.4.7): NUL and U+0080-U+07FF
   * two, U+0800 and up three (each half of a surrogate pair on its own).
   */
  static int modifiedUtf8Bytes(char c) {
    if (c != 0 && c < 0x80) {
      return 1;
    }
    return c < 0x800 ? 2 : 3;
  }

  /** Bytes of {@code text} in modified UTF-8. */
  static long modifiedUtf8Bytes(String text) {
    long n = 0;
    for (int i = 0; i < text.length(); i++) {
      n += modifiedUtf8Bytes(text.charAt(i));
    }
    return n;
  }

  /**
   * One constant written as literals of at most {@link #LITERAL_COLUMNS} joined by {@code +}, each
   * on a line of its own when there are several. javac folds them into one constant (JLS §15.29),
   * so the class file is the same as with one long literal.
   */
  static CodeBlock lines(String constant) {
    List<String> pieces = new ArrayList<>();
    StringBuilder piece = new StringBuilder();
    int columns = 2;
    for (int i = 0; i < constant.length(); i++) {
      char c = constant.charAt(i);
      int width = JavaText.stringLiteral(String.valueOf(c)).length() - 2;
      boolean pair = Character.isLowSurrogate(c) && i > 0
          && Character.isHighSurrogate(constant.charAt(i - 1));
      if (columns + width > LITERAL_COLUMNS && piece.length() > 0 && !pair) {
        pieces.add(piece.toString());
        piece.setLength(0);
        columns = 2;
      }
      piece.append(c);
      columns += width;
    }
    pieces.add(piece.toString());
    if (pieces.size() == 1) {
      return CodeBlock.of("$L", JavaText.stringLiteral(constant));
    }
    CodeBlock.Builder out = CodeBlock.builder();
    for (String p : pieces) {
      out.add(out.isEmpty() ? "\n$L" : "\n+ $L", JavaText.stringLiteral(p));
    }
    return out.build();
  }
}
