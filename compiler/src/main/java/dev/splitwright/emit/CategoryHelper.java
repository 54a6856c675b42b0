package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.FieldSpec;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import java.util.Locale;
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
        .addParameter(TypeName.BOOLEAN, "missingLeft");
    return m.beginControlFlow("if ($L)", validCode(kind))
        .addStatement("return ((mask >>> $L) & 1L) != 0L", code(kind))
        .endControlFlow()
        .addStatement("return missingLeft")
        .build();
  }

  /** {@code inSet(v, k, masks, missingLeft)} for more than 64 categories. */
  static MethodSpec wide(InputKind kind) {
    MethodSpec.Builder m = start(kind).addParameter(ArrayTypeName.of(TypeName.LONG), "masks")
        .addParameter(TypeName.BOOLEAN, "missingLeft");
    return m.beginControlFlow("if ($L)", validCode(kind))
        .addStatement("int code = $L", code(kind))
        .addStatement("return ((masks[code >>> 6] >>> (code & 63)) & 1L) != 0L")
        .endControlFlow()
        .addStatement("return missingLeft")
        .build();
  }

  private static MethodSpec.Builder start(InputKind kind) {
    TypeName valueType = switch (kind) {
      case FLOAT -> TypeName.FLOAT;
      case DOUBLE -> TypeName.DOUBLE;
      case INT -> TypeName.INT;
    };
    return MethodSpec.methodBuilder("inSet")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.BOOLEAN)
        .addParameter(valueType, "v")
        .addParameter(TypeName.INT, "k");
  }

  /** The code as an int; a cast of an int would be a javac -Xlint "redundant cast" warning. */
  private static String code(InputKind kind) {
    return kind == InputKind.INT ? "v" : "(int) v";
  }

  private static String validCode(InputKind kind) {
    // NaN fails "v >= 0", so it is missing; so are fractions and codes past the table.
    return kind == InputKind.INT ? "v >= 0 && v < k" : "v >= 0 && v < k && v == (int) v";
  }

  /** A {@code long[]} bit set of the codes, 64 codes a word. */
  static FieldSpec maskField(String name, int k, int[] codes) {
    long[] words = new long[(k + 63) / 64];
    for (int code : codes) {
      words[code >>> 6] |= 1L << (code & 63);
    }
    CodeBlock.Builder init = CodeBlock.builder().add("{");
    for (int i = 0; i < words.length; i++) {
      init.add(i == 0 ? "$L" : ",$W$L", String.format(Locale.ROOT, "0x%xL", words[i]));
    }
    return FieldSpec.builder(ArrayTypeName.of(TypeName.LONG), name,
            Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL)
        .initializer(init.add("}").build())
        .build();
  }
}
