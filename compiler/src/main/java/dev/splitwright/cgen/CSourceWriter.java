package dev.splitwright.cgen;

import dev.splitwright.data.Schema;
import dev.splitwright.emit.FlatTree;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The {@code .c} file: the fast-math guard, the tree in the chosen layout, the probability tables
 * and, unless bare, the label and feature-name strings. File-scope objects are all {@code static
 * const}; the only functions called are the file's own.
 */
final class CSourceWriter {
  private CSourceWriter() {}

  static String write(DecisionTree tree, CEmitOptions options, HeaderInfo header, CApi api) {
    String prefix = api.prefix();
    CSets sets = new CSets(prefix);
    CLeaves leaves = new CLeaves(prefix, options.probabilities());
    String treeSignature = options.probabilities()
        ? "static int " + prefix + "_leaf(" + api.inputParameter() + ")"
        : api.classifySignature();
    CFloatKeys floatKeys = new CFloatKeys(prefix);
    Optional<CFloatKeys> keys = options.compareBits() ? Optional.of(floatKeys) : Optional.empty();
    String treeCode = options.layout() == Layout.FLAT
        ? CFlat.function(FlatTree.of(tree, options.inputKind(), leaves::payload),
            options.inputKind(), prefix, treeSignature)
        : options.layout() == Layout.TABLE
        ? CTable.function(tree, options.inputKind(), sets, leaves, keys, prefix, treeSignature)
        : CBranches.function(tree, options.inputKind(), sets, leaves, keys, treeSignature);

    StringBuilder out = new StringBuilder();
    preamble(out, header, api);
    sets.write(out, options.inputKind());
    floatKeys.write(out);
    out.append(treeCode);
    if (options.probabilities()) {
      leaves.writeTables(out);
      out.append(api.classifySignature()).append("\n{\n    return (int)").append(prefix)
          .append("_leaf_class[").append(prefix).append("_leaf(x)];\n}\n\n");
      leaves.writeProbabilities(out, api.probabilitiesSignature(), prefix + "_leaf(x)");
    }
    if (!options.bare()) {
      Schema schema = tree.schema();
      strings(out, prefix + "_labels", api.macroPrefix() + "_CLASS_COUNT", schema.classes(),
          api.labelSignature(), "class_index");
      strings(out, prefix + "_feature_names", api.macroPrefix() + "_FEATURE_COUNT",
          schema.featureNames(), api.featureNameSignature(), "feature_index");
    }
    return out.toString();
  }

  /**
   * Writes an ensemble: each tree a {@code static} function returning its class ({@code
   * <prefix>_tree<t>}, in the flat layout with its own {@code static const} arrays; in the table
   * layout all trees are in one table walked by one function), {@code
   * <prefix>_scores} adding the weights in tree order as {@code TreeEnsemble} does, and {@code
   * classify} and {@code probabilities} on the scores. Float additions and divisions are exact
   * IEEE 754 binary32 operations only when {@code FLT_EVAL_METHOD == 0} (C99 5.2.4.2.2), so the
   * file stops with {@code #error} otherwise.
   */
  static String write(TreeEnsemble ensemble, CEmitOptions options, HeaderInfo header,
      CApi api) {
    String prefix = api.prefix();
    CSets sets = new CSets(prefix);
    CLeaves leaves = new CLeaves(prefix, false);
    CFloatKeys floatKeys = new CFloatKeys(prefix);
    Optional<CFloatKeys> keys = options.compareBits() ? Optional.of(floatKeys) : Optional.empty();
    StringBuilder trees = new StringBuilder();
    // With the table layout every tree lives in one packed table walked by one function, called
    // with the index each tree starts at; otherwise each tree is a function of its own.
    List<String> calls = new ArrayList<>();
    if (options.layout() == Layout.TABLE) {
      List<Long> roots = new ArrayList<>();
      String walk = prefix + "_walk";
      trees.append(CTable.packed(ensemble.trees(), options.inputKind(), sets, leaves, keys,
          prefix, "static int " + walk + "(" + api.inputParameter() + ", uint32_t i)", roots));
      for (long root : roots) {
        calls.add(walk + "(x, " + root + "u)");
      }
    } else {
      for (int t = 0; t < ensemble.treeCount(); t++) {
        DecisionTree tree = ensemble.trees().get(t);
        String name = prefix + "_tree" + t;
        String signature = "static int " + name + "(" + api.inputParameter() + ")";
        // flat: each tree its own complete tree, arrays and walk, its leaves holding classes.
        trees.append(options.layout() == Layout.FLAT
            ? CFlat.function(FlatTree.of(tree, options.inputKind(), leaves::payload),
                options.inputKind(), name, signature)
            : CBranches.function(tree, options.inputKind(), sets, leaves, keys, signature));
        calls.add(name + "(x)");
      }
    }
    StringBuilder out = new StringBuilder();
    preamble(out, header, api);
    out.append("#include <float.h>\n\n")
        .append("/*\n * The votes are added in float; with more precision in between (a\n"
            + " * FLT_EVAL_METHOD other than 0) the sums would differ from the model's.\n */\n")
        .append("#if !defined(FLT_EVAL_METHOD) || FLT_EVAL_METHOD != 0\n")
        .append("#error \"").append(api.sourceName())
        .append(" adds float votes: it needs FLT_EVAL_METHOD == 0 (float arithmetic in "
            + "float)\"\n#endif\n\n");
    sets.write(out, options.inputKind());
    floatKeys.write(out);
    out.append(trees);
    String classes = api.macroPrefix() + "_CLASS_COUNT";
    out.append("/* Adds each tree's weight to the score of the class it returns, in order. */\n")
        .append("static void ").append(prefix).append("_scores(").append(api.inputParameter())
        .append(", float score[").append(classes).append("])\n{\n    int c;\n")
        .append("    for (c = 0; c < ").append(classes).append("; c++) {\n")
        .append("        score[c] = 0.0f;\n    }\n");
    for (int t = 0; t < ensemble.treeCount(); t++) {
      float w = ensemble.weight(t);
      out.append("    score[").append(calls.get(t)).append("] += ")
          .append(CText.hexFloat(w)).append("; /* ").append(CText.decimal(w)).append(" */\n");
    }
    out.append("}\n\n")
        .append(api.classifySignature()).append("\n{\n")
        .append("    float score[").append(classes).append("];\n    int best = 0;\n    int c;\n")
        .append("    ").append(prefix).append("_scores(x, score);\n")
        .append("    /* Only a larger score wins, so ties go to the lowest class index. */\n")
        .append("    for (c = 1; c < ").append(classes).append("; c++) {\n")
        .append("        if (score[c] > score[best]) {\n            best = c;\n        }\n")
        .append("    }\n    return best;\n}\n\n");
    if (options.probabilities()) {
      float total = ensemble.totalWeight();
      out.append(api.probabilitiesSignature()).append("\n{\n    int c;\n")
          .append("    ").append(prefix).append("_scores(x, out);\n")
          .append("    /* The total weight, summed in tree order in float. */\n")
          .append("    for (c = 0; c < ").append(classes).append("; c++) {\n")
          .append("        out[c] = out[c] / ").append(CText.hexFloat(total)).append("; /* ")
          .append(CText.decimal(total)).append(" */\n    }\n}\n\n");
    }
    if (!options.bare()) {
      Schema schema = ensemble.schema();
      strings(out, prefix + "_labels", classes, schema.classes(), api.labelSignature(),
          "class_index");
      strings(out, prefix + "_feature_names", api.macroPrefix() + "_FEATURE_COUNT",
          schema.featureNames(), api.featureNameSignature(), "feature_index");
    }
    return out.toString();
  }

  /** The file comment, the header's include and the fast-math guard. */
  private static void preamble(StringBuilder out, HeaderInfo header, CApi api) {
    out.append("/*\n * ").append(api.sourceName()).append(": generated by Splitwright from ")
        .append(CText.comment(header.origin())).append(". Do not edit: regenerate instead.\n")
        .append(" * Options: ").append(CText.comment(header.command())).append('\n')
        .append(" * See ").append(api.headerName())
        .append(" for the features, the classes and the build flags.\n */\n\n")
        .append("#include \"").append(api.headerName()).append("\"\n\n")
        .append("/*\n"
            + " * These flags let the compiler assume there is no NaN and rewrite comparisons,\n"
            + " * so NaN would no longer go the way the model sends it.\n */\n")
        .append("#if defined(__FAST_MATH__) || (defined(__FINITE_MATH_ONLY__) && "
            + "__FINITE_MATH_ONLY__ == 1)\n")
        .append("#error \"").append(api.sourceName())
        .append(" needs IEEE 754 comparisons: build it without -ffast-math and "
            + "-ffinite-math-only\"\n#endif\n\n");
  }

  private static void strings(StringBuilder out, String table, String count, List<String> texts,
      String signature, String parameter) {
    for (int i = 0; i < texts.size(); i++) {
      if (CText.isLongString(texts.get(i))) {
        out.append("/* ").append(CText.comment(texts.get(i).substring(0, 40)))
            .append("...: longer than a string literal may be (C99 5.2.4.1). */\n")
            .append("static const char ").append(table).append('_').append(i).append("[] = {\n")
            .append(CText.charInitializer(texts.get(i))).append("};\n\n");
      }
    }
    out.append("static const char *const ").append(table).append('[').append(count)
        .append("] = {\n");
    for (int i = 0; i < texts.size(); i++) {
      String text = texts.get(i);
      out.append("    ").append(CText.isLongString(text) ? table + "_" + i
          : CText.stringLiteral(text)).append(i + 1 < texts.size() ? ",\n" : "\n");
    }
    out.append("};\n\n").append(signature).append("\n{\n")
        .append("    if (").append(parameter).append(" < 0 || ").append(parameter).append(" >= ")
        .append(count).append(") {\n        return \"\";\n    }\n")
        .append("    return ").append(table).append('[').append(parameter).append("];\n}\n\n");
  }
}
