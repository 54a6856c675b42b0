package dev.splitwright.emit;

import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.MethodSpec;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;

/** Javadoc and argument checks of the public entry methods, shared by the layouts. */
final class EntryDoc {
  private EntryDoc() {}

  static CodeBlock classify(Schema schema, InputAccess input) {
    // A bare class has no label method; its class comment lists the classes by index.
    CodeBlock.Builder doc = CodeBlock.builder()
        .add("Returns the class index (0 to $L) for one input; $L.\n\n", schema.classCount() - 1,
            input.bare()
                ? "the class comment lists the classes by index"
                : "see {@link #label(int)}");
    String missing = switch (input.kind()) {
      case FLOAT, DOUBLE -> "NaN marks a missing value";
      case INT -> "a numeric value cannot be missing, a category code outside its table "
          + "(such as -1) marks a missing category";
    };
    if (input.named()) {
      for (int f = 0; f < schema.featureCount(); f++) {
        doc.add("@param $L $L\n", input.parameterNames().get(f), paramText(schema.feature(f)));
      }
    } else {
      doc.add("@param x the $L feature values in the order of the class comment; $L;\n"
          + "    categorical features take their code\n", schema.featureCount(), missing);
    }
    return doc.add("@return the class index\n").build();
  }

  static CodeBlock probabilities(Schema schema, InputAccess input) {
    CodeBlock.Builder doc = CodeBlock.builder()
        .add("Fills {@code out} with the class frequencies of the training rows at the leaf\n"
            + "this input reaches: {@code out[c]} is the share of class {@code c}, as float.\n"
            + "The class {@link #classify} returns is not always the most frequent one when\n"
            + "class weights were used in training.\n\n");
    if (input.named()) {
      for (int f = 0; f < schema.featureCount(); f++) {
        doc.add("@param $L $L\n", input.parameterNames().get(f), paramText(schema.feature(f)));
      }
    } else {
      doc.add("@param x the $L feature values, as for {@link #classify}\n", schema.featureCount());
    }
    return doc.add("@param out receives $L frequencies, one per class index\n", schema.classCount())
        .build();
  }

  /**
   * The comment of a private method that walks the tree from {@code from} on: the entry method's
   * parameters, one line each, and what it returns. Javadoc's checks ({@code -Xdoclint:all})
   * cover private methods too.
   */
  static CodeBlock walk(String from, InputAccess input, boolean leafNumbers) {
    CodeBlock.Builder doc = CodeBlock.builder().add("Walks the tree from $L on.\n\n", from);
    if (input.named()) {
      for (String name : input.parameterNames()) {
        doc.add("@param $L as for {@link #classify}\n", name);
      }
    } else {
      doc.add("@param x the feature values, as for {@link #classify}\n");
    }
    return doc.add("@return $L\n",
        leafNumbers ? "the number of the leaf reached" : "the class index").build();
  }

  private static String paramText(Feature feature) {
    return JavaText.javadoc(feature.name()) + (feature.isCategorical() ? " (category code)" : "");
  }

  /** Rejects an input array of the wrong length before any comparison. */
  static void addLengthCheck(MethodSpec.Builder method, Schema schema) {
    method.beginControlFlow("if (x.length != $L)", schema.featureCount())
        // String.concat keeps the class free of invokedynamic string concatenation, whose
        // bootstrap lives in java.lang.invoke.
        .addStatement("throw new IllegalArgumentException($W$S.concat(String.valueOf(x.length)))",
            "expected " + schema.featureCount() + " features but got ")
        .endControlFlow();
  }
}
