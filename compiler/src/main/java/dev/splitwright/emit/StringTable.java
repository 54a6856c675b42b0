package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.FieldSpec;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import java.util.List;
import javax.lang.model.element.Modifier;

/**
 * A {@code private static final String[]} of user text (labels, feature names). Short tables are
 * written as an array initializer, which is readable but costs about seven bytes of static
 * initializer code per element (JVMS §6.5: {@code dup}, index, {@code ldc}, {@code aastore}), and
 * one element holds at most 65,535 bytes; so large tables, and tables with long text, are written
 * as one text plus packed lengths and cut apart once at class initialisation.
 */
final class StringTable {
  /** More elements than this are packed: 64 elements cost under 500 bytes of initializer. */
  static final int MAX_INITIALIZER_ELEMENTS = 64;
  /** Longer text is packed, so no single literal can exceed the constant limit. */
  static final int MAX_INITIALIZER_CHARS = 1000;

  private StringTable() {}

  static boolean packed(List<String> values) {
    return values.size() > MAX_INITIALIZER_ELEMENTS
        || values.stream().anyMatch(v -> v.length() > MAX_INITIALIZER_CHARS);
  }

  /** The field; when packed, {@code support} is told to emit the decoders. */
  static FieldSpec field(String name, List<String> values, SupportMethods support) {
    FieldSpec.Builder field = FieldSpec.builder(ArrayTypeName.of(String.class), name,
        Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL);
    if (!packed(values)) {
      // A zero-width wrap after the brace: a long first element may start the next line.
      CodeBlock.Builder init = CodeBlock.builder().add("{$Z");
      for (int i = 0; i < values.size(); i++) {
        init.add(i == 0 ? "$L" : ",$W$L", LongStrings.lines(values.get(i)));
      }
      return field.initializer(init.add("}").build()).build();
    }
    support.need(SupportMethods.Kind.STRINGS);
    StringBuilder text = new StringBuilder();
    PackedInts lengths = new PackedInts();
    for (String value : values) {
      text.append(value);
      lengths.add(value.length());
    }
    return field.initializer("strings($L,$W$L)", LongStrings.expression(text.toString()),
        unpack(lengths)).build();
  }

  /** {@code unpack("...", n)} for a packed stream. */
  static CodeBlock unpack(PackedInts numbers) {
    return CodeBlock.of("unpack($L, $L)", LongStrings.expression(numbers.text()),
        numbers.count());
  }

  /** {@code words("...", n)} for packed words. */
  static CodeBlock words(PackedWords words) {
    return CodeBlock.of("words($L, $L)", LongStrings.expression(words.text()), words.count());
  }

  /** The decoder: {@code private static String[] strings(String text, int[] lengths)}. */
  static MethodSpec stringsMethod() {
    return MethodSpec.methodBuilder("strings")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(ArrayTypeName.of(String.class))
        .addParameter(String.class, "text")
        .addParameter(ArrayTypeName.of(TypeName.INT), "lengths")
        .addJavadoc("Cuts {@code text} into pieces of the given lengths.\n\n"
            + "@param text the pieces, one after the other\n@param lengths their lengths\n"
            + "@return the pieces\n")
        .addStatement("String[] out = new String[lengths.length]")
        .addStatement("int at = 0")
        .beginControlFlow("for (int i = 0; i < out.length; i++)")
        .addStatement("out[i] = text.substring(at, at + lengths[i])")
        .addStatement("at += lengths[i]")
        .endControlFlow()
        .addStatement("return out")
        .build();
  }
}
