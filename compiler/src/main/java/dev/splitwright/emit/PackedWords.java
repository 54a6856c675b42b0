package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import javax.lang.model.element.Modifier;

/**
 * Writes 32-bit words, such as the bits of float thresholds, as exactly five symbols each: base 90
 * over the symbols of {@link PackedInts}, least significant first (90^5 > 2^32). Float bits are
 * spread over the whole range, where a {@link PackedInts} number would take six symbols.
 */
final class PackedWords {
  static final int BASE = 2 * PackedInts.BASE;
  static final int SYMBOLS = 5;
  /**
   * Fewest words for which a separate word stream pays: its decoder costs about 300 class-file
   * bytes (code, line numbers, stack map, constants; measured on the demo model) and each word
   * saves one byte against {@link PackedInts}.
   */
  static final int WORTHWHILE = 300;

  private final StringBuilder text = new StringBuilder();
  private int count;

  PackedWords add(int word) {
    long rest = Integer.toUnsignedLong(word);
    for (int i = 0; i < SYMBOLS; i++) {
      text.append(PackedInts.symbol((int) (rest % BASE)));
      rest /= BASE;
    }
    count++;
    return this;
  }

  PackedWords addFloat(float value) {
    return add(Float.floatToRawIntBits(value));
  }

  /** Appends the bits of a double as two words, high word first. */
  PackedWords addDouble(double value) {
    long bits = Double.doubleToRawLongBits(value);
    return add((int) (bits >>> 32)).add((int) bits);
  }

  int count() {
    return count;
  }

  String text() {
    return text.toString();
  }

  /** The decoder: {@code private static int[] words(String data, int count)}. */
  static MethodSpec wordsMethod() {
    return MethodSpec.methodBuilder("words")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(ArrayTypeName.of(TypeName.INT))
        .addParameter(String.class, "data")
        .addParameter(TypeName.INT, "count")
        .addJavadoc("Decodes {@code count} 32-bit words of $L base-$L digits each, least "
            + "significant first.\n\n@param data the digits, one character each\n"
            + "@param count how many words\n@return the words\n", SYMBOLS, BASE)
        .addStatement("int[] out = new int[count]")
        .addStatement("int at = 0")
        .beginControlFlow("for (int i = 0; i < count; i++)")
        .addStatement("int value = 0")
        .beginControlFlow("for (int k = 0, scale = 1; k < $L; k++, scale *= $L)", SYMBOLS, BASE)
        .addStatement("int digit = data.charAt(at++) - $L", (int) PackedInts.symbol(0))
        .addStatement("value += (digit > 57 ? digit - 1 : digit) * scale")
        .endControlFlow()
        .addStatement("out[i] = value")
        .endControlFlow()
        .addStatement("return out")
        .build();
  }
}
