package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.FieldSpec;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import com.palantir.javapoet.TypeSpec;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import javax.lang.model.element.Modifier;

/** Emits the tree as nested {@code if} comparisons, split into methods under the bytecode cap. */
final class BranchesWriter {
  private final DecisionTree tree;
  private final InputAccess input;
  private final MethodPlan plan;
  private final TypeSpec.Builder type;
  private final SupportMethods support;
  private final LeafTable leaves;
  /** The constant each leaf returns, or null to return the bare number. */
  private final ConstantNames names;
  /** Code sets of more than 64 categories, by content, with their offset in {@code SETS}. */
  private final Map<String, Integer> wideSets;
  private final PackedInts setData;

  private BranchesWriter(DecisionTree tree, EmitOptions options, InputAccess input,
      TypeSpec.Builder type, SupportMethods support) {
    this(tree, options, input, type, support, new LeafTable(options.probabilities()),
        new LinkedHashMap<>(), new PackedInts(), "node");
  }

  /**
   * A writer of one tree of a class that may hold several: {@code wideSets} and {@code setData}
   * are shared by all, outlined methods are named {@code <prefix><pre-order index>}.
   */
  private BranchesWriter(DecisionTree tree, EmitOptions options, InputAccess input,
      TypeSpec.Builder type, SupportMethods support, LeafTable leaves,
      Map<String, Integer> wideSets, PackedInts setData, String prefix) {
    this.tree = tree;
    this.input = input;
    this.type = type;
    this.support = support;
    this.leaves = leaves;
    this.wideSets = wideSets;
    this.setData = setData;
    // Leaves return CLASS_... constants: compile-time constants, so the bytecode is the same as
    // with the number (JLS §13.1); a bare class has no constants, leaf numbers are no classes.
    this.names = options.bare() || leaves.probabilities() ? null
        : ConstantNames.of(tree.schema());
    this.plan = MethodPlan.of(tree.root(), options.maxMethodBytes(),
        MethodPlan.ENTRY_CHECK_BYTES, input.callBytes(), prefix);
  }

  static String write(DecisionTree tree, EmitOptions options, HeaderInfo header) {
    InputAccess input = InputAccess.of(tree.schema(), options);
    SupportMethods support = new SupportMethods(input.kind());
    TypeSpec.Builder type = ClassScaffold.start(tree, options, header, support);
    BranchesWriter writer = new BranchesWriter(tree, options, input, type, support);
    writer.checkConstantPool();
    writer.addMethods();
    support.addTo(type);
    return ClassScaffold.finish(type.build(), options, header);
  }

  /**
   * Writes an ensemble: tree {@code t} is {@code private static int tree<t>(...)} returning its
   * class (its outlined subtrees {@code tree<t>Node<index>}), and {@code scores} calls the trees
   * in order. With probabilities the leaves still return classes: the shares come from the votes.
   */
  static String write(TreeEnsemble ensemble, EmitOptions options, HeaderInfo header) {
    InputAccess input = InputAccess.of(ensemble.schema(), options);
    SupportMethods support = new SupportMethods(input.kind());
    TypeSpec.Builder type = ClassScaffold.start(ensemble, options, header, support);
    LeafTable leaves = new LeafTable(false);
    Map<String, Integer> wideSets = new LinkedHashMap<>();
    PackedInts setData = new PackedInts();
    List<BranchesWriter> writers = new ArrayList<>();
    int helpers = 0;
    for (int t = 0; t < ensemble.treeCount(); t++) {
      BranchesWriter writer = new BranchesWriter(ensemble.trees().get(t), options, input, type,
          support, leaves, wideSets, setData, "tree" + t + "Node");
      writers.add(writer);
      helpers += 1 + writer.plan.methodRoots().size();
    }
    // Scores and its vote chunks count at most as many helpers again as there are trees.
    long bound = ConstantCount.forEnsemble(ensemble, input.kind(),
        helpers + 1 + ensemble.treeCount());
    checkConstantPool(bound);
    EnsembleVotes.addEntries(type, ensemble, input, options.probabilities());
    EnsembleVotes.addUnrolledScores(type, ensemble, input, options.maxMethodBytes(),
        t -> CodeBlock.of("tree$L($L)", t, input.arguments()));
    for (int t = 0; t < writers.size(); t++) {
      writers.get(t).addTreeMethods("tree" + t, "tree " + t);
    }
    if (!wideSets.isEmpty()) {
      addSets(type, setData);
    }
    support.addTo(type);
    return ClassScaffold.finish(type.build(), options, header);
  }

  /** The tree's root method, named {@code name}, and its outlined subtrees. */
  private void addTreeMethods(String name, String what) {
    MethodSpec.Builder root = MethodSpec.methodBuilder(name)
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc(EntryDoc.walk("the root of " + what, input, false));
    input.addParameters(root);
    type.addMethod(root.addCode(body(tree.root())).build());
    addOutlined();
  }

  private void addOutlined() {
    for (Node node : plan.methodRoots()) {
      MethodSpec.Builder helper = MethodSpec.methodBuilder(plan.methodName(node))
          .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
          .returns(TypeName.INT)
          .addJavadoc(EntryDoc.walk(plan.methodName(node) + " (a method of its own to keep "
              + "methods under the bytecode cap and their nesting readable)", input,
              leaves.probabilities()));
      input.addParameters(helper);
      type.addMethod(helper.addCode(body(node)).build());
    }
  }

  private static void addSets(TypeSpec.Builder type, PackedInts setData) {
    type.addField(FieldSpec.builder(ArrayTypeName.of(TypeName.INT), "SETS",
            Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("Code sets of more than 64 categories: k, then ceil(k / 32) bit words.\n")
        .initializer(StringTable.unpack(setData))
        .build());
  }

  private void addMethods() {
    MethodSpec.Builder classify = MethodSpec.methodBuilder("classify")
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc(EntryDoc.classify(tree.schema(), input));
    input.addParameters(classify);
    if (input.checksLength()) {
      EntryDoc.addLengthCheck(classify, tree.schema());
    }
    MethodSpec.Builder root = classify;
    if (leaves.probabilities()) {
      // The tree returns a leaf number; classify and classProbabilities look it up.
      CodeBlock leafCall = CodeBlock.of("leaf($L)", input.arguments());
      classify.addStatement("return $L", leaves.classOf(leafCall));
      type.addMethod(classify.build());
      type.addMethod(LeafTable.probabilitiesMethod(tree.schema(), input, leafCall));
      root = MethodSpec.methodBuilder("leaf")
          .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
          .returns(TypeName.INT)
          .addJavadoc(EntryDoc.walk("the root", input, true));
      input.addParameters(root);
    }
    type.addMethod(root.addCode(body(tree.root())).build());
    addOutlined();
    if (!wideSets.isEmpty()) {
      addSets(type, setData);
    }
    CodeBlock init = leaves.addFields(type, support);
    if (!init.isEmpty()) {
      type.addStaticBlock(init);
    }
  }

  /** The statements of a method whose tree starts at {@code root}. */
  private CodeBlock body(Node root) {
    CodeBlock.Builder code = CodeBlock.builder();
    writeNode(root, code, true, 0);
    return code.build();
  }

  /** Columns before a statement of a method body at nesting {@code depth}. */
  private static int indent(int depth) {
    return 8 + 4 * depth;
  }

  private void writeNode(Node node, CodeBlock.Builder code, boolean methodRoot, int depth) {
    if (!methodRoot && plan.isOutlined(node)) {
      code.addStatement("return $L($L)", plan.methodName(node), input.arguments());
      return;
    }
    if (node instanceof Leaf leaf) {
      int payload = leaves.payload(leaf);
      code.addStatement("return $L", names == null ? payload : names.classConstant(payload));
      return;
    }
    Split split = (Split) node;
    String condition = condition(split);
    String trailing = "";
    if (split instanceof CategoricalSplit categorical) {
      addCommentLines(code, depth, setComment(categorical));
    } else if (!input.named()) {
      // Named parameters carry the feature's name already.
      String name = " // " + JavaText.comment(SourceLines.shortName(
          tree.schema().feature(split.feature()).name(), COMMENT_NAME_CHARS));
      String line = "if (" + condition.replace(WRAP, ' ') + ") {" + name;
      if (indent(depth) + SourceLines.width(line) <= SourceLines.MAX_COLUMNS) {
        trailing = name;
      } else {
        addCommentLines(code, depth, name.substring(4));
      }
    }
    code.add("if ($L) {$L\n", wrappable(condition), trailing).indent();
    writeNode(split.left(), code, false, depth + 1);
    code.nextControlFlow("else");
    writeNode(split.right(), code, false, depth + 1);
    code.endControlFlow();
  }

  /** Characters of a feature or category name in a comment beside the code. */
  private static final int COMMENT_NAME_CHARS = 24;
  /** Category names listed in a set's comment; the rest are counted. */
  private static final int COMMENT_CATEGORIES = 6;

  /** {@code mode in {manual, remote}, or missing}: the codes that take the if branch. */
  private String setComment(CategoricalSplit split) {
    List<String> categories = tree.schema().feature(split.feature()).categories();
    int[] codes = split.leftCodes().toArray();
    StringBuilder out = new StringBuilder(JavaText.comment(SourceLines.shortName(
        tree.schema().feature(split.feature()).name(), COMMENT_NAME_CHARS))).append(" in {");
    for (int i = 0; i < codes.length && i < COMMENT_CATEGORIES; i++) {
      out.append(i == 0 ? "" : ", ").append(JavaText.comment(
          SourceLines.shortName(categories.get(codes[i]), COMMENT_NAME_CHARS)));
    }
    if (codes.length > COMMENT_CATEGORIES) {
      out.append(", and ").append(codes.length - COMMENT_CATEGORIES).append(" more");
    }
    return out.append(split.missingLeft() ? "}, or missing" : "}").toString();
  }

  /** Escaped comment text as {@code //} lines that fit beside the indentation. */
  private static void addCommentLines(CodeBlock.Builder code, int depth, String text) {
    for (String line : SourceLines.wrap(text, SourceLines.MAX_COLUMNS - indent(depth) - 3)) {
      code.add("// $L\n", line);
    }
  }

  /** Marks where a condition may wrap onto the next line; a space when it does not. */
  private static final char WRAP = '\u0001';

  /** The condition with each {@link #WRAP} as a wrapping space. */
  private static CodeBlock wrappable(String condition) {
    CodeBlock.Builder out = CodeBlock.builder();
    String[] parts = condition.split(String.valueOf(WRAP), -1);
    for (int i = 0; i < parts.length; i++) {
      out.add(i == 0 ? "$L" : "$W$L", parts[i]);
    }
    return out.build();
  }

  private String condition(Split split) {
    String value = input.read(split.feature());
    if (split instanceof NumericSplit numeric) {
      return numericCondition(value, numeric);
    }
    if (input.kind() == InputKind.DOUBLE) {
      value = "(float) " + value;
    }
    CategoricalSplit categorical = (CategoricalSplit) split;
    int k = tree.schema().feature(split.feature()).categories().size();
    int[] codes = categorical.leftCodes().toArray();
    if (k <= Long.SIZE) {
      support.need(SupportMethods.Kind.IN_SET_NARROW);
      long mask = 0;
      for (int code : codes) {
        mask |= 1L << code;
      }
      return String.format(Locale.ROOT, "inSet(%s,%c%d,%c0x%xL,%c%b)", value, WRAP, k, WRAP,
          mask, WRAP, split.missingLeft());
    }
    support.need(SupportMethods.Kind.IN_SET_WIDE);
    String key = k + ":" + categorical.leftCodes();
    Integer at = wideSets.get(key);
    if (at == null) {
      at = setData.count();
      CategoryHelper.pack(setData, k, codes);
      wideSets.put(key, at);
    }
    return String.format(Locale.ROOT, "inSet(%s,%c%d,%c%b)", value, WRAP, at, WRAP,
        split.missingLeft());
  }

  private String numericCondition(String value, NumericSplit split) {
    float t = split.threshold();
    return switch (input.kind()) {
      // NaN fails every comparison, so "<=" sends it right and "!(>)" sends it left.
      case FLOAT -> split.missingLeft()
          ? "!(" + value + " >" + WRAP + JavaText.floatLiteral(t) + ")"
          : value + " <=" + WRAP + JavaText.floatLiteral(t);
      case DOUBLE -> {
        double d = Thresholds.forDouble(t);
        yield split.missingLeft()
            ? "!(" + value + " >" + WRAP + JavaText.doubleLiteral(d) + ")"
            : value + " <=" + WRAP + JavaText.doubleLiteral(d);
      }
      case INT -> {
        long n = Thresholds.forInt(t);
        yield n == Long.MIN_VALUE ? value + " <" + WRAP + Integer.MIN_VALUE
            : value + " <=" + WRAP + n;
      }
    };
  }

  /** Refuses a tree whose constants cannot fit one class file; the table layout always fits. */
  private void checkConstantPool() {
    checkConstantPool(constantBound());
  }

  private static void checkConstantPool(long bound) {
    if (bound > ConstantCount.LIMIT) {
      throw new EmitLimitException("layout", String.format(Locale.ROOT,
          "the branches layout of this tree needs up to %d class-file constants, over the "
              + "limit of %d (JVM Specification 4.1)", bound, ConstantCount.LIMIT),
          "use --layout table, whose constants do not grow with the tree");
    }
  }

  private long constantBound() {
    int methods = plan.methodRoots().size() + (leaves.probabilities() ? 1 : 0);
    return ConstantCount.forBranches(tree, input.kind(), methods, leaves.probabilities());
  }

  /** The bound {@link #write} checks, for tests to hold against real class files. */
  static long constantBound(DecisionTree tree, EmitOptions options) {
    InputAccess input = InputAccess.of(tree.schema(), options);
    SupportMethods support = new SupportMethods(input.kind());
    TypeSpec.Builder type = ClassScaffold.start(tree, options, HeaderInfo.none(), support);
    return new BranchesWriter(tree, options, input, type, support).constantBound();
  }
}
