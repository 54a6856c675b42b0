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
  /** Characters per source line of a literal, for readable diffs. */
  private static final int LINE_CHARS = 100;

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

  /** One constant written as literals of {@link #LINE_CHARS} joined by {@code +}. */
  private static CodeBlock lines(String constant) {
    if (constant.length() <= LINE_CHARS) {
      return CodeBlock.of("$L", JavaText.stringLiteral(constant));
    }
    CodeBlock.Builder out = CodeBlock.builder();
    for (int i = 0; i < constant.length(); i += LINE_CHARS) {
      String piece = constant.substring(i, Math.min(constant.length(), i + LINE_CHARS));
      out.add(i == 0 ? "$L" : "\n+ $L", JavaText.stringLiteral(piece));
    }
    return out.build();
  }
}
