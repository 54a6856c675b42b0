package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.FieldSpec;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import com.palantir.javapoet.TypeSpec;
import dev.splitwright.data.Schema;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.Leaf;
import javax.lang.model.element.Modifier;

/**
 * What the tree returns at each leaf. Without {@code --probabilities} that is the class itself.
 * With it, leaves with the same class and frequencies share a number, the tree returns that
 * number, and packed tables map it to the class and to the frequencies. The frequencies are the
 * float values of {@code count / (double) total}, computed here exactly as {@code
 * DecisionTree.probabilities} computes them, so the emitted code needs no arithmetic.
 */
final class LeafTable {
  private final boolean probabilities;
  private final LeafNumbers numbers = new LeafNumbers();

  LeafTable(boolean probabilities) {
    this.probabilities = probabilities;
  }

  boolean probabilities() {
    return probabilities;
  }

  /** The value the tree code returns at {@code leaf}. */
  int payload(Leaf leaf) {
    return probabilities ? numbers.numberOf(leaf) : leaf.prediction();
  }

  private static float[] frequencies(ClassCounts counts) {
    return LeafNumbers.frequencies(counts);
  }

  /** The expression {@code classify} returns for a tree result {@code leafCall}. */
  CodeBlock classOf(CodeBlock leafCall) {
    return probabilities ? CodeBlock.of("LEAF_CLASS[$L]", leafCall) : leafCall;
  }

  /**
   * Adds the packed tables and returns the code of the static initializer that fills them (empty
   * without probabilities); call after every leaf got its payload.
   */
  CodeBlock addFields(TypeSpec.Builder type, SupportMethods support) {
    if (!probabilities) {
      return CodeBlock.of("");
    }
    support.need(SupportMethods.Kind.UNPACK);
    PackedInts data = new PackedInts();
    PackedWords shares = new PackedWords();
    int entries = 0;
    for (Leaf leaf : numbers.distinct()) {
      for (float v : frequencies(leaf.counts())) {
        entries += v != 0f ? 1 : 0;
      }
    }
    boolean words = entries >= PackedWords.WORTHWHILE;
    if (words) {
      support.need(SupportMethods.Kind.WORDS);
    }
    for (Leaf leaf : numbers.distinct()) {
      data.add(leaf.prediction());
      float[] p = frequencies(leaf.counts());
      int nonZero = 0;
      for (float v : p) {
        nonZero += v != 0f ? 1 : 0;
      }
      data.add(nonZero);
      for (int c = 0; c < p.length; c++) {
        if (p[c] != 0f) {
          data.add(c);
          (words ? shares : data).addFloat(p[c]);
        }
      }
    }
    int n = numbers.distinct().size();
    type.addField(intArray("LEAF_CLASS", n, "The class of each leaf number."));
    type.addField(intArray("PROBABILITY_START", n + 1,
        "Where each leaf number's non-zero frequencies start in PROBABILITY; one past the last."));
    type.addField(intArray("PROBABILITY_CLASS", entries, "The class of each frequency."));
    type.addField(FieldSpec.builder(ArrayTypeName.of(TypeName.FLOAT), "PROBABILITY",
        Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("The non-zero class frequencies of the leaves, leaf after leaf.\n")
        .initializer("new float[$L]", entries).build());
    return CodeBlock.builder()
        .add(words
            ? "// Per distinct leaf: class, count of non-zero frequencies, their classes; the\n"
                + "// frequencies follow as float bits, in the same order.\n"
            : "// Per distinct leaf: class, count of non-zero frequencies, (class, float bits).\n")
        .addStatement("int[] leaves = $L", StringTable.unpack(data))
        .add(words ? CodeBlock.builder()
            .addStatement("int[] shares = $L", StringTable.words(shares)).build()
            : CodeBlock.of(""))
        .addStatement("int next = 0")
        .addStatement("int j = 0")
        .beginControlFlow("for (int leaf = 0; leaf < $L; leaf++)", n)
        .addStatement("LEAF_CLASS[leaf] = leaves[next++]")
        .addStatement("PROBABILITY_START[leaf] = j")
        .beginControlFlow("for (int m = leaves[next++]; m > 0; m--, j++)")
        .addStatement("PROBABILITY_CLASS[j] = leaves[next++]")
        .addStatement("PROBABILITY[j] = Float.intBitsToFloat($L)",
            words ? "shares[j]" : "leaves[next++]")
        .endControlFlow()
        .endControlFlow()
        .addStatement("PROBABILITY_START[$L] = j", n)
        .build();
  }

  private static FieldSpec intArray(String name, int length, String doc) {
    return FieldSpec.builder(ArrayTypeName.of(TypeName.INT), name,
        Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("$L\n", doc)
        .initializer("new int[$L]", length).build();
  }

  /**
   * {@code classProbabilities(<inputs>, float[] out)}, which fills {@code out} from the leaf that
   * {@code leaf(<inputs>)} returns.
   */
  static MethodSpec probabilitiesMethod(Schema schema, InputAccess input,
      CodeBlock leafCall) {
    MethodSpec.Builder m = MethodSpec.methodBuilder("classProbabilities")
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .addJavadoc(EntryDoc.probabilities(schema, input));
    input.addParameters(m);
    m.addParameter(ArrayTypeName.of(TypeName.FLOAT), "out");
    if (input.checksLength()) {
      EntryDoc.addLengthCheck(m, schema);
    }
    m.beginControlFlow("if (out.length != $L)", schema.classCount())
        .addStatement("throw new IllegalArgumentException($W$S.concat(String.valueOf(out.length)))",
            "expected room for " + schema.classCount() + " classes but got ")
        .endControlFlow();
    return m.addStatement("int leaf = $L", leafCall)
        .beginControlFlow("for (int c = 0; c < out.length; c++)")
        .addStatement("out[c] = 0f")
        .endControlFlow()
        .beginControlFlow(
            "for (int j = PROBABILITY_START[leaf]; j < PROBABILITY_START[leaf + 1]; j++)")
        .addStatement("out[PROBABILITY_CLASS[j]] = PROBABILITY[j]")
        .endControlFlow()
        .build();
  }
}
