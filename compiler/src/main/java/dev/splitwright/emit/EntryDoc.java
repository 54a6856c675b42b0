package dev.splitwright.emit;

import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.MethodSpec;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.TreeEnsemble;

/** Javadoc and argument checks of the public entry methods, shared by the layouts. */
final class EntryDoc {
  private EntryDoc() {}

  static CodeBlock classify(Schema schema, InputAccess input) {
    // A bare class has no label method; its class comment lists the classes by index.
    CodeBlock.Builder doc = CodeBlock.builder()
        .add("$L\n\n", ClassScaffold.memberDoc("Returns the class index (0 to "
            + (schema.classCount() - 1) + ") for one input; " + (input.bare()
                ? "the class comment lists the classes by index."
                : "see {@link #label(int)}.")));
    boolean categorical = schema.features().stream().anyMatch(Feature::isCategorical);
    String missing = switch (input.kind()) {
      case FLOAT, DOUBLE -> "NaN marks a missing value";
      case INT -> categorical
          ? "a numeric value cannot be missing, a category code outside its table (such as -1) "
              + "marks a missing category"
          : "no value can be missing";
    };
    if (input.named()) {
      addNamedParams(doc, schema, input);
    } else {
      String index = input.bare() ? "" : " (the FEATURE_ constants give each index)";
      doc.add("$L\n", param("@param x the " + schema.featureCount() + " feature values in the "
          + "order of the class comment" + index + "; " + missing
          + (categorical ? "; categorical features take their code" : "")));
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
      addNamedParams(doc, schema, input);
    } else {
      doc.add("@param x the $L feature values, as for {@link #classify}\n", schema.featureCount());
    }
    return doc.add("@param out receives $L frequencies, one per class index\n", schema.classCount())
        .build();
  }

  static CodeBlock ensembleProbabilities(Schema schema, InputAccess input,
      TreeEnsemble ensemble) {
    CodeBlock.Builder doc = CodeBlock.builder()
        .add("$L\n\n", ClassScaffold.memberDoc("Fills {@code out} with each class's share of "
            + (ensemble.kind() == TreeEnsemble.Kind.FOREST ? "the votes" : "the weighted votes")
            + ": its score divided by the total weight of all trees, as float."));
    if (input.named()) {
      addNamedParams(doc, schema, input);
    } else {
      doc.add("@param x the $L feature values, as for {@link #classify}\n", schema.featureCount());
    }
    return doc.add("@param out receives $L shares, one per class index\n", schema.classCount())
        .build();
  }

  /**
   * The comment of a private method that walks the tree from {@code from} on: the entry method's
   * parameters, one line each, and what it returns. Javadoc's checks ({@code -Xdoclint:all})
   * cover private methods too.
   */
  static CodeBlock walk(String from, InputAccess input, boolean leafNumbers) {
    CodeBlock.Builder doc = CodeBlock.builder()
        .add("$L\n\n", ClassScaffold.memberDoc("Walks the tree from " + from + " on."));
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

  private static void addNamedParams(CodeBlock.Builder doc, Schema schema, InputAccess input) {
    for (int f = 0; f < schema.featureCount(); f++) {
      Feature feature = schema.feature(f);
      doc.add("$L\n", param("@param " + input.parameterNames().get(f) + " "
          + JavaText.javadoc(feature.name())
          + (feature.isCategorical() ? " (category code)" : "")));
    }
  }

  /** A tag line wrapped to fit, continuation lines indented. */
  private static String param(String text) {
    return String.join("\n    ", SourceLines.wrap(text, ClassScaffold.MEMBER_DOC_WIDTH - 4));
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
