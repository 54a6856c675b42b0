package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import javax.lang.model.element.Modifier;

/**
 * 32-bit words, such as the bits of float thresholds, as {@link PackedText} of exactly five
 * symbols each: base 90, least significant first (90^5 > 2^32). Float bits are spread over the
 * whole range, where a {@link PackedInts} number would take six symbols.
 */
final class PackedWords extends PackedText {
  static final int BASE = SYMBOLS;
  static final int DIGITS = 5;
  /**
   * Fewest words for which a separate word stream pays: its decoder costs about 300 class-file
   * bytes (code, line numbers, stack map, constants; measured on the demo model) and each word
   * saves one byte against {@link PackedInts}.
   */
  static final int WORTHWHILE = 300;

  @Override
  void appendDigits(StringBuilder out, long unsigned) {
    long rest = unsigned;
    for (int i = 0; i < DIGITS; i++) {
      out.append(symbol((int) (rest % BASE)));
      rest /= BASE;
    }
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
            + "@param count how many words\n@return the words\n", DIGITS, BASE)
        .addStatement("int[] out = new int[count]")
        .addStatement("int at = 0")
        .beginControlFlow("for (int i = 0; i < count; i++)")
        .addStatement("int value = 0")
        .beginControlFlow("for (int k = 0, scale = 1; k < $L; k++, scale *= $L)", DIGITS, BASE)
        .addStatement("int digit = data.charAt(at++) - $L", FIRST_SYMBOL)
        .addStatement("value += (digit > $1L ? digit - 1 : digit) * scale", BACKSLASH_DIGIT)
        .endControlFlow()
        .addStatement("out[i] = value")
        .endControlFlow()
        .addStatement("return out")
        .build();
  }
}
