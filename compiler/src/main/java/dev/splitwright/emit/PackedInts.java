package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import javax.lang.model.element.Modifier;

/**
 * Writes non-negative numbers as printable ASCII for a {@code String} constant that the emitted
 * class decodes once at initialisation with {@link #unpackMethod()}.
 *
 * <p>Each number is a run of base-45 digits, least significant first; a digit of 45 or more means
 * "more digits follow". The 90 digit symbols are {@code '#'} to {@code '}'} without the backslash,
 * so no symbol needs an escape in source and each costs one byte in the class file (modified
 * UTF-8, JVM Specification §4.4.7, encodes {@code \u0001}-{@code \u007f} in one byte). Numbers
 * below 45 take one symbol, 32-bit words at most six.
 */
final class PackedInts {
  static final int BASE = 45;
  private static final int FIRST_SYMBOL = '#';

  private final StringBuilder text = new StringBuilder();
  private int count;

  /** Appends {@code value} read as an unsigned 32-bit number (so any bit pattern fits). */
  PackedInts add(int value) {
    long rest = Integer.toUnsignedLong(value);
    while (rest >= BASE) {
      text.append(symbol(BASE + (int) (rest % BASE)));
      rest /= BASE;
    }
    text.append(symbol((int) rest));
    count++;
    return this;
  }

  /** Appends a signed number so that small magnitudes stay short (zigzag: 0, -1, 1, -2 ...). */
  PackedInts addSigned(int value) {
    return add((value << 1) ^ (value >> 31));
  }

  /** Appends the bits of a float: the decoder gives them back to {@code Float.intBitsToFloat}. */
  PackedInts addFloat(float value) {
    return add(Float.floatToRawIntBits(value));
  }

  /** Appends the bits of a double as two numbers, high word first. */
  PackedInts addDouble(double value) {
    long bits = Double.doubleToRawLongBits(value);
    return add((int) (bits >>> 32)).add((int) bits);
  }

  /** How many numbers were added: the decoder's {@code count} argument. */
  int count() {
    return count;
  }

  String text() {
    return text.toString();
  }

  static char symbol(int digit) {
    if (digit < 0 || digit >= 2 * BASE) {
      throw new IllegalArgumentException("digit out of range: " + digit);
    }
    // Skip the backslash ('\\' = FIRST_SYMBOL + 57), the only symbol in the range needing escape.
    return (char) (FIRST_SYMBOL + digit + (digit >= 57 ? 1 : 0));
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
        .beginControlFlow("if (digit > 57)")
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
