package dev.splitwright.emit;

import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.FieldSpec;
import com.palantir.javapoet.JavaFile;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import com.palantir.javapoet.TypeSpec;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.text.DecimalText;
import java.util.List;
import java.util.Locale;
import javax.lang.model.element.Modifier;

/**
 * The parts of an emitted classifier that do not depend on the layout: header, label and feature
 * tables, class-index constants and their accessors. Layouts add {@code classify} and helpers.
 */
final class ClassScaffold {
  private static final String INDENT = "    ";

  private ClassScaffold() {}

  /** Starts the class with everything but the tree. */
  static TypeSpec.Builder start(Classifier tree, EmitOptions options, HeaderInfo header,
      SupportMethods support) {
    Schema schema = tree.schema();
    TypeSpec.Builder type = TypeSpec.classBuilder(options.className())
        .addModifiers(Modifier.PUBLIC, Modifier.FINAL)
        .addJavadoc(classJavadoc(tree, options, header));
    type.addMethod(MethodSpec.constructorBuilder().addModifiers(Modifier.PRIVATE)
        .addJavadoc("Not instantiable: every member is static.\n").build());
    if (options.bare()) {
      return type;
    }

    ConstantNames names = ConstantNames.of(schema);
    type.addField(FieldSpec.builder(TypeName.INT, "FEATURE_COUNT",
            Modifier.PUBLIC, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("Number of input features.\n")
        .initializer("$L", schema.featureCount()).build());
    for (int f = 0; f < schema.featureCount(); f++) {
      type.addField(FieldSpec.builder(TypeName.INT, names.featureConstant(f),
              Modifier.PUBLIC, Modifier.STATIC, Modifier.FINAL)
          .addJavadoc("$L\n", memberDoc("Input index of feature \""
              + JavaText.javadoc(schema.feature(f).name()) + "\"."))
          .initializer("$L", f).build());
    }
    type.addField(FieldSpec.builder(TypeName.INT, "CLASS_COUNT",
            Modifier.PUBLIC, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("Number of classes; {@code classify} returns 0 to CLASS_COUNT - 1.\n")
        .initializer("$L", schema.classCount()).build());
    for (int c = 0; c < schema.classCount(); c++) {
      type.addField(FieldSpec.builder(TypeName.INT, names.classConstant(c),
              Modifier.PUBLIC, Modifier.STATIC, Modifier.FINAL)
          .addJavadoc("$L\n", memberDoc("Class index of label \""
              + JavaText.javadoc(schema.classes().get(c)) + "\"."))
          .initializer("$L", c).build());
    }
    addCategoryCodes(type, schema, names);
    type.addField(StringTable.field("LABELS", schema.classes(), support).toBuilder()
        .addJavadoc("Class labels, by class index.\n").build());
    type.addField(StringTable.field("FEATURES", schema.featureNames(), support).toBuilder()
        .addJavadoc("Feature names (CSV headers), by input index.\n").build());
    type.addMethod(MethodSpec.methodBuilder("label")
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .returns(String.class)
        .addParameter(TypeName.INT, "classIndex")
        .addJavadoc("Returns the label of a class index that {@code classify} returned.\n\n"
            + "@param classIndex a class index, 0 to CLASS_COUNT - 1\n"
            + "@return the label as written in the training data\n")
        .addStatement("return LABELS[classIndex]")
        .build());
    type.addMethod(MethodSpec.methodBuilder("featureName")
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .returns(String.class)
        .addParameter(TypeName.INT, "featureIndex")
        .addJavadoc("Returns the CSV header of the feature at {@code featureIndex}.\n\n"
            + "@param featureIndex an input index, 0 to FEATURE_COUNT - 1\n"
            + "@return the feature's name\n")
        .addStatement("return FEATURES[featureIndex]")
        .build());
    return type;
  }

  /** Categorical features with more categories than this get no named code constants. */
  static final int MAX_NAMED_CATEGORIES = 256;

  /** How many category code constants {@link #addCategoryCodes} writes for {@code schema}. */
  static int namedCategoryCount(Schema schema) {
    int n = 0;
    for (Feature feature : schema.features()) {
      if (feature.isCategorical() && feature.categories().size() <= MAX_NAMED_CATEGORIES) {
        n += feature.categories().size();
      }
    }
    return n;
  }

  /**
   * One constant per category, e.g. {@code MODE_MANUAL = 1}, so callers pass codes by name; the
   * original text is in each constant's Javadoc. Skipped for identifier-like columns with very
   * many categories, whose code table is still in the class comment.
   */
  private static void addCategoryCodes(TypeSpec.Builder type, Schema schema,
      ConstantNames names) {
    for (int f = 0; f < schema.featureCount(); f++) {
      Feature feature = schema.feature(f);
      List<String> constants = names.categoryConstants(f);
      for (int code = 0; code < constants.size(); code++) {
        String category = feature.categories().get(code);
        type.addField(FieldSpec.builder(TypeName.INT, constants.get(code),
                Modifier.PUBLIC, Modifier.STATIC, Modifier.FINAL)
            .addJavadoc("$L\n", memberDoc("Code of category \"" + JavaText.javadoc(category)
                + "\" of feature \"" + JavaText.javadoc(feature.name()) + "\" (input " + f
                + ")."))
            .initializer("$L", code).build());
      }
    }
  }

  /** Javadoc columns left on a member's comment lines after {@code "     * "}. */
  static final int MEMBER_DOC_WIDTH = SourceLines.MAX_COLUMNS - 7;
  /** Columns left on the class comment's lines after {@code " * "}. */
  private static final int CLASS_DOC_WIDTH = SourceLines.MAX_COLUMNS - 3;

  /** Escaped javadoc text of a member, wrapped to fit. */
  static String memberDoc(String escaped) {
    return SourceLines.wrapped(escaped, MEMBER_DOC_WIDTH);
  }

  private static CodeBlock classJavadoc(Classifier model, EmitOptions options,
      HeaderInfo header) {
    Schema schema = model.schema();
    StringBuilder doc = new StringBuilder();
    doc.append(model instanceof TreeEnsemble ensemble ? ensembleName(ensemble)
        : "Decision tree classifier").append(" for ").append(JavaText.javadoc(schema.target()))
        .append(", generated by Splitwright.\n");
    doc.append("\n<p>Features, in input order:\n<ol start=\"0\">\n");
    for (Feature f : schema.features()) {
      doc.append("  <li>").append(JavaText.javadoc(f.name())).append(describe(f))
          .append("</li>\n");
    }
    doc.append("</ol>\n\n<p>Classes, by index:\n<ol start=\"0\">\n");
    for (String label : schema.classes()) {
      doc.append("  <li>").append(JavaText.javadoc(label)).append("</li>\n");
    }
    if (model instanceof DecisionTree tree) {
      doc.append(String.format(Locale.ROOT,
          "</ol>\n\n<p>Tree: depth %d, %d leaves, %d splits; layout %s, input %s.\n",
          tree.depth(), tree.leafCount(), tree.internalNodeCount(),
          options.layout().optionName(), options.inputKind().optionName()));
    } else {
      describeEnsemble(doc, (TreeEnsemble) model, options);
    }
    for (String line : header.scoreLines()) {
      doc.append("<br>").append(JavaText.javadoc(line)).append("\n");
    }
    if (options.layout() == Layout.BRANCHES && options.inputKind() != InputKind.INT) {
      // NaN fails every comparison (IEEE 754), so the form decides where a missing value goes.
      doc.append("\n<p>Each comparison is written so that a missing value (NaN) goes where it "
          + "went in training: {@code x <= t} sends it to the else branch, {@code !(x > t)} "
          + "to the if branch.\n");
    }
    List<String> data = header.dataLines();
    for (int i = 0; i < data.size(); i++) {
      doc.append(i == 0 ? "\n<p>" : "<br>").append(JavaText.javadoc(data.get(i))).append("\n");
    }
    doc.append("<br>Options: ").append(JavaText.javadoc(header.command())).append("\n");
    doc.append("\n<p>Outputs are statistical: validate them on your own data. They do not "
        + "replace the safety analysis and standards that apply to your product.\n");
    return CodeBlock.of("$L", SourceLines.wrapped(doc.toString(), CLASS_DOC_WIDTH));
  }

  private static String ensembleName(TreeEnsemble ensemble) {
    String trees = ensemble.treeCount() + (ensemble.treeCount() == 1 ? " tree" : " trees");
    return switch (ensemble.kind()) {
      case FOREST -> "Voting forest of " + trees;
      case BOOSTED -> "Boosted ensemble (SAMME) of " + trees;
    };
  }

  /** Kind, tree count, the combination rule and each tree's size. */
  private static void describeEnsemble(StringBuilder doc, TreeEnsemble ensemble,
      EmitOptions options) {
    doc.append(String.format(Locale.ROOT,
        "</ol>\n\n<p>Ensemble: %s, %d %s; layout %s, input %s.\n",
        ensemble.kind().fileName(), ensemble.treeCount(),
        ensemble.treeCount() == 1 ? "tree" : "trees",
        options.layout().optionName(), options.inputKind().optionName()));
    // The rule is the model's (TreeEnsemble): float arithmetic is strict IEEE 754 (JEP 306).
    doc.append("Each tree votes for the class of the leaf it reaches with its weight"
        + (ensemble.kind() == TreeEnsemble.Kind.FOREST ? " (1 in a forest)" : "")
        + "; the votes are added in float, tree by tree in order, and the class with the "
        + "largest score wins, the lowest class index on ties.\n");
    for (int t = 0; t < ensemble.treeCount(); t++) {
      DecisionTree tree = ensemble.trees().get(t);
      doc.append(String.format(Locale.ROOT, "<br>Tree %d: depth %d, %d leaves%s.\n", t,
          tree.depth(), tree.leafCount(), ensemble.kind() == TreeEnsemble.Kind.FOREST ? ""
              : ", weight " + DecimalText.shortest(ensemble.weight(t))));
    }
  }

  private static String describe(Feature f) {
    if (!f.isCategorical()) {
      return "";
    }
    StringBuilder out = new StringBuilder(" (categorical codes: ");
    for (int i = 0; i < f.categories().size(); i++) {
      out.append(i == 0 ? "" : ", ").append(i).append(" = ")
          .append(JavaText.javadoc(f.categories().get(i)));
    }
    return out.append(")").toString();
  }

  /** Wraps the class into a file with the do-not-edit comment and returns ASCII source. */
  static String finish(TypeSpec type, EmitOptions options, HeaderInfo header) {
    // The options stand once, in the class comment; here only where the file came from.
    String origin = "Generated by Splitwright from " + JavaText.comment(header.origin())
        + ". Do not edit: regenerate instead.";
    JavaFile file = JavaFile.builder(options.packageName(), type)
        .addFileComment("$L", SourceLines.wrapped(origin, SourceLines.MAX_COLUMNS - 3))
        .skipJavaLangImports(true)
        .indent(INDENT)
        .build();
    return JavaText.asciiOnly(file.toString());
  }
}
