package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import javax.lang.model.element.Modifier;

/**
 * Non-negative numbers as {@link PackedText}, decoded with {@link #unpackMethod()}: each number is
 * a run of base-45 digits, least significant first; a digit of 45 or more means "more digits
 * follow". Numbers below 45 take one symbol, 32-bit words at most six.
 */
final class PackedInts extends PackedText {
  static final int BASE = SYMBOLS / 2;

  @Override
  void appendDigits(StringBuilder out, long unsigned) {
    long rest = unsigned;
    while (rest >= BASE) {
      out.append(symbol(BASE + (int) (rest % BASE)));
      rest /= BASE;
    }
    out.append(symbol((int) rest));
  }

  /** Appends a signed number so that small magnitudes stay short (zigzag: 0, -1, 1, -2 ...). */
  PackedInts addSigned(int value) {
    add((value << 1) ^ (value >> 31));
    return this;
  }

  /** The decoder: {@code private static int[] unpack(String data, int count)}. */
  static MethodSpec unpackMethod() {
    return MethodSpec.methodBuilder("unpack")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(ArrayTypeName.of(TypeName.INT))
        .addParameter(String.class, "data")
        .addParameter(TypeName.INT, "count")
        .addJavadoc("Decodes {@code count} numbers written as base-$L digits, least significant "
            + "first;\na digit of $L or more means more digits follow.\n\n"
            + "@param data the digits, one character each\n@param count how many numbers\n"
            + "@return the numbers\n", BASE, BASE)
        .addStatement("int[] out = new int[count]")
        .addStatement("int at = 0")
        .beginControlFlow("for (int i = 0; i < count; i++)")
        .addStatement("int value = 0")
        .addStatement("int scale = 1")
        .addStatement("int digit = data.charAt(at++) - $L", FIRST_SYMBOL)
        .beginControlFlow("while (true)")
        .beginControlFlow("if (digit > $L)", BACKSLASH_DIGIT)
        .addComment("symbols above the backslash are shifted by one")
        .addStatement("digit--")
        .endControlFlow()
        .beginControlFlow("if (digit < $L)", BASE)
        .addStatement("out[i] = value + digit * scale")
        .addStatement("break")
        .endControlFlow()
        .addStatement("value += (digit - $L) * scale", BASE)
        .addStatement("scale *= $L", BASE)
        .addStatement("digit = data.charAt(at++) - $L", FIRST_SYMBOL)
        .endControlFlow()
        .endControlFlow()
        .addStatement("return out")
        .build();
  }
}
