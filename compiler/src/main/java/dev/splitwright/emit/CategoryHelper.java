package dev.splitwright.emit;

import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import javax.lang.model.element.Modifier;

/**
 * The emitted set-membership test for categorical splits. A value that is not a whole code in
 * {@code [0, k)} counts as missing, exactly as {@code Feature.isMissing} decides in the model.
 */
final class CategoryHelper {
  private CategoryHelper() {}

  /** {@code inSet(v, k, mask, missingLeft)} for at most 64 categories. */
  static MethodSpec narrow(InputKind kind) {
    MethodSpec.Builder m = start(kind).addParameter(TypeName.LONG, "mask")
        .addParameter(TypeName.BOOLEAN, "missingLeft")
        .addJavadoc("Tells whether category code {@code v} goes left: whether its bit is set in "
            + "{@code mask}.\n\n@param v the category code as passed in\n"
            + "@param k the number of categories; other values count as missing\n"
            + "@param mask bit c set for each code c that goes left\n"
            + "@param missingLeft whether a missing code goes left\n"
            + "@return whether the input goes left\n");
    return m.beginControlFlow("if ($L)", validCode(kind, "k"))
        .addStatement("return ((mask >>> $L) & 1L) != 0L", code(kind))
        .endControlFlow()
        .addStatement("return missingLeft")
        .build();
  }

  /**
   * {@code inSet(v, at, missingLeft)} for a code set packed into {@code SETS}: {@code SETS[at]} is
   * the number of categories k, then come ceil(k / 32) words, code c being bit {@code c & 31} of
   * word {@code c >>> 5}.
   */
  static MethodSpec wide(InputKind kind) {
    return MethodSpec.methodBuilder("inSet")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.BOOLEAN)
        .addParameter(valueType(kind), "v")
        .addParameter(TypeName.INT, "at")
        .addParameter(TypeName.BOOLEAN, "missingLeft")
        .addJavadoc("Tells whether category code {@code v} goes left: whether it is in the code "
            + "set\nat {@code SETS[at]}.\n\n@param v the category code as passed in\n"
            + "@param at where the set starts in {@code SETS}: the number of categories, then the "
            + "bit words\n@param missingLeft whether a missing code goes left\n"
            + "@return whether the input goes left\n")
        .beginControlFlow("if ($L)", validCode(kind, "SETS[at]"))
        .addStatement("int code = $L", code(kind))
        .addStatement("return ((SETS[at + 1 + (code >>> 5)] >>> (code & 31)) & 1) != 0")
        .endControlFlow()
        .addStatement("return missingLeft")
        .build();
  }

  /** Packs a code set as {@link #wide} reads it: k, then the bit words. */
  static void pack(PackedInts out, int k, int[] codes) {
    int[] words = new int[(k + 31) / 32];
    for (int code : codes) {
      words[code >>> 5] |= 1 << (code & 31);
    }
    out.add(k);
    for (int word : words) {
      out.add(word);
    }
  }

  /**
   * The value type the helpers take. A double input is narrowed to float by the caller, because
   * the model decides on the float value: 2.9999999999 is code 3 once it is a float.
   */
  static TypeName valueType(InputKind kind) {
    return kind == InputKind.INT ? TypeName.INT : TypeName.FLOAT;
  }

  /** The value as an int code; a cast of an int is a lint warning (and -Werror an error). */
  private static String code(InputKind kind) {
    return kind == InputKind.INT ? "v" : "(int) v";
  }

  private static MethodSpec.Builder start(InputKind kind) {
    return MethodSpec.methodBuilder("inSet")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.BOOLEAN)
        .addParameter(valueType(kind), "v")
        .addParameter(TypeName.INT, "k");
  }

  private static String validCode(InputKind kind, String k) {
    // NaN fails "v >= 0", so it is missing; so are fractions and codes past the table.
    return kind == InputKind.INT ? "v >= 0 && v < " + k
        : "v >= 0 && v < " + k + " && v == (int) v";
  }
}
