package dev.splitwright.emit;

import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.FieldSpec;
import com.palantir.javapoet.JavaFile;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.NameAllocator;
import com.palantir.javapoet.TypeName;
import com.palantir.javapoet.TypeSpec;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.DecisionTree;
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
  static TypeSpec.Builder start(DecisionTree tree, EmitOptions options, HeaderInfo header,
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

    type.addField(FieldSpec.builder(TypeName.INT, "FEATURE_COUNT",
            Modifier.PUBLIC, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("Number of input features.\n")
        .initializer("$L", schema.featureCount()).build());
    type.addField(FieldSpec.builder(TypeName.INT, "CLASS_COUNT",
            Modifier.PUBLIC, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("Number of classes; {@code classify} returns 0 to CLASS_COUNT - 1.\n")
        .initializer("$L", schema.classCount()).build());

    NameAllocator names = new NameAllocator();
    for (String reserved : List.of("FEATURE_COUNT", "CLASS_COUNT", "LABELS", "FEATURES", "SETS")) {
      names.newName(reserved, reserved);
    }
    for (int c = 0; c < schema.classCount(); c++) {
      String label = schema.classes().get(c);
      type.addField(FieldSpec.builder(TypeName.INT,
              Identifiers.constant(names, "CLASS_", label, "class" + c),
              Modifier.PUBLIC, Modifier.STATIC, Modifier.FINAL)
          .addJavadoc("Class index of label \"$L\".\n", JavaText.javadoc(label))
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
  private static void addCategoryCodes(TypeSpec.Builder type, Schema schema, NameAllocator names) {
    for (int f = 0; f < schema.featureCount(); f++) {
      Feature feature = schema.feature(f);
      if (!feature.isCategorical() || feature.categories().size() > MAX_NAMED_CATEGORIES) {
        continue;
      }
      String prefix = Identifiers.ascii(feature.name(), "FEATURE" + f).toUpperCase(Locale.ROOT)
          + "_";
      for (int code = 0; code < feature.categories().size(); code++) {
        String category = feature.categories().get(code);
        type.addField(FieldSpec.builder(TypeName.INT,
                Identifiers.constant(names, prefix, category, "feature" + f + "code" + code),
                Modifier.PUBLIC, Modifier.STATIC, Modifier.FINAL)
            .addJavadoc("Code of category \"$L\" of feature \"$L\" (input $L).\n",
                JavaText.javadoc(category), JavaText.javadoc(feature.name()), f)
            .initializer("$L", code).build());
      }
    }
  }

  private static CodeBlock classJavadoc(DecisionTree tree, EmitOptions options, HeaderInfo header) {
    Schema schema = tree.schema();
    CodeBlock.Builder doc = CodeBlock.builder();
    doc.add("Decision tree classifier for $L, generated by Splitwright.\n",
        JavaText.javadoc(schema.target()));
    doc.add("\n<p>Features, in input order:\n<ol start=\"0\">\n");
    for (Feature f : schema.features()) {
      doc.add("  <li>$L$L</li>\n", JavaText.javadoc(f.name()), describe(f));
    }
    doc.add("</ol>\n\n<p>Classes, by index:\n<ol start=\"0\">\n");
    for (String label : schema.classes()) {
      doc.add("  <li>$L</li>\n", JavaText.javadoc(label));
    }
    doc.add("</ol>\n\n<p>Tree: depth $L, $L leaves, $L splits; layout $L, input $L.\n",
        tree.depth(), tree.leafCount(), tree.internalNodeCount(),
        options.layout().optionName(), options.inputKind().optionName());
    for (String line : header.scoreLines()) {
      doc.add("<br>$L\n", JavaText.javadoc(line));
    }
    List<String> data = header.dataLines();
    for (int i = 0; i < data.size(); i++) {
      doc.add("$L$L\n", i == 0 ? "\n<p>" : "<br>", JavaText.javadoc(data.get(i)));
    }
    doc.add("<br>Options: $L\n", JavaText.javadoc(header.command()));
    doc.add("\n<p>Outputs are statistical: validate them on your own data. They do not "
        + "replace the\nsafety analysis and standards that apply to your product.\n");
    return doc.build();
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
    JavaFile file = JavaFile.builder(options.packageName(), type)
        .addFileComment("Generated by Splitwright from $L. Do not edit: regenerate instead.\n",
            JavaText.comment(header.origin()))
        .addFileComment("Options: $L", JavaText.comment(header.command()))
        .skipJavaLangImports(true)
        .indent(INDENT)
        .build();
    return JavaText.asciiOnly(file.toString());
  }
}
