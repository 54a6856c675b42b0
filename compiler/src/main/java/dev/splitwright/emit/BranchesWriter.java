package dev.splitwright.emit;

import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import com.palantir.javapoet.TypeSpec;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.Locale;
import javax.lang.model.element.Modifier;

/** Emits the tree as nested {@code if} comparisons, split into methods under the bytecode cap. */
final class BranchesWriter {
  private final DecisionTree tree;
  private final EmitOptions options;
  private final InputAccess input;
  private final MethodPlan plan;
  private final TypeSpec.Builder type;
  private boolean needsCategoryHelper;
  private boolean needsWideCategoryHelper;
  private int fieldIndex;

  private BranchesWriter(DecisionTree tree, EmitOptions options, InputAccess input,
      TypeSpec.Builder type) {
    this.tree = tree;
    this.options = options;
    this.input = input;
    this.type = type;
    this.plan = MethodPlan.of(tree.root(), options.maxMethodBytes(),
        MethodPlan.ENTRY_CHECK_BYTES, input.callBytes());
  }

  static String write(DecisionTree tree, EmitOptions options, HeaderInfo header) {
    InputAccess input = InputAccess.of(tree.schema(), options);
    TypeSpec.Builder type = ClassScaffold.start(tree, options, header, input);
    BranchesWriter writer = new BranchesWriter(tree, options, input, type);
    writer.addMethods();
    return ClassScaffold.finish(type.build(), options, header);
  }

  private void addMethods() {
    MethodSpec.Builder classify = MethodSpec.methodBuilder("classify")
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc(EntryDoc.classify(tree.schema(), input));
    input.addParameters(classify);
    if (!input.named()) {
      EntryDoc.addLengthCheck(classify, tree.schema());
    }
    classify.addCode(body(tree.root()));
    type.addMethod(classify.build());
    for (Node root : plan.methodRoots()) {
      MethodSpec.Builder helper = MethodSpec.methodBuilder(plan.methodName(root))
          .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
          .returns(TypeName.INT);
      input.addParameters(helper);
      type.addMethod(helper.addCode(body(root)).build());
    }
    if (needsCategoryHelper) {
      type.addMethod(CategoryHelper.narrow(input.kind()));
    }
    if (needsWideCategoryHelper) {
      type.addMethod(CategoryHelper.wide(input.kind()));
    }
  }

  /** The statements of a method whose tree starts at {@code root}. */
  private CodeBlock body(Node root) {
    CodeBlock.Builder code = CodeBlock.builder();
    writeNode(root, code, true);
    return code.build();
  }

  private void writeNode(Node node, CodeBlock.Builder code, boolean methodRoot) {
    if (!methodRoot && plan.isOutlined(node)) {
      code.addStatement("return $L($L)", plan.methodName(node), input.arguments());
      return;
    }
    if (node instanceof Leaf leaf) {
      code.addStatement("return $L", leaf.prediction());
      return;
    }
    Split split = (Split) node;
    code.beginControlFlow("if ($L)", condition(split));
    writeNode(split.left(), code, false);
    code.nextControlFlow("else");
    writeNode(split.right(), code, false);
    code.endControlFlow();
  }

  private String condition(Split split) {
    String value = input.read(split.feature());
    if (split instanceof NumericSplit numeric) {
      return numericCondition(value, numeric);
    }
    CategoricalSplit categorical = (CategoricalSplit) split;
    int k = tree.schema().feature(split.feature()).categories().size();
    int[] codes = categorical.leftCodes().toArray();
    if (k <= Long.SIZE) {
      needsCategoryHelper = true;
      long mask = 0;
      for (int code : codes) {
        mask |= 1L << code;
      }
      return String.format(Locale.ROOT, "inSet(%s, %d, 0x%xL, %b)", value, k, mask,
          split.missingLeft());
    }
    needsWideCategoryHelper = true;
    String field = "SET_" + fieldIndex++;
    type.addField(CategoryHelper.maskField(field, k, codes));
    return String.format(Locale.ROOT, "inSet(%s, %d, %s, %b)", value, k, field,
        split.missingLeft());
  }

  private String numericCondition(String value, NumericSplit split) {
    float t = split.threshold();
    return switch (input.kind()) {
      // NaN fails every comparison, so "<=" sends it right and "!(>)" sends it left.
      case FLOAT -> split.missingLeft()
          ? "!(" + value + " > " + JavaText.floatLiteral(t) + ")"
          : value + " <= " + JavaText.floatLiteral(t);
      case DOUBLE -> split.missingLeft()
          ? "!(" + value + " > " + JavaText.doubleLiteral(Thresholds.forDouble(t)) + ")"
          : value + " <= " + JavaText.doubleLiteral(Thresholds.forDouble(t));
      case INT -> {
        long n = Thresholds.forInt(t);
        yield n == Long.MIN_VALUE ? value + " < " + Integer.MIN_VALUE : value + " <= " + n;
      }
    };
  }
}
