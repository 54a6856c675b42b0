package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.FieldSpec;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import com.palantir.javapoet.TypeSpec;
import dev.splitwright.data.Schema;
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
import java.util.Map;
import java.util.Optional;
import javax.lang.model.element.Modifier;

/**
 * Emits the tree as data: the nodes in pre-order packed into string constants ({@link PackedInts}),
 * decoded once at class initialisation into three arrays, and a loop that walks them. The code
 * does not grow with the tree, so neither method sizes nor the constant pool limit the tree.
 *
 * <p>Arrays, one entry per node: {@code NODE[i]} (layout with the constants below), {@code
 * THRESHOLD[i]} the comparison operand, {@code RIGHT[i]} the right child. The left child is
 * always {@code i + 1}.
 */
final class TableWriter {
  /*
   * The node layout, described once; the emitted comments, encoder and decoder are all built from
   * these constants. Packed, per node in pre-order: a leaf is (result << 1) | LEAF; a split is
   * (feature or set offset) << SPLIT_SHIFT | CATEGORICAL if categorical | MISSING_LEFT if missing
   * values go left, followed by its threshold if numeric. Decoding drops the leaf bit: NODE[i] is
   * ~result for a leaf (negative), else the split's word >>> 1, so each flag sits one bit lower.
   */
  /** Marks a leaf in the packed word. */
  private static final int LEAF = 1;
  /** In the packed word of a split: missing values go left. */
  private static final int MISSING_LEFT = 2;
  /** In the packed word of a split: the split is categorical. */
  private static final int CATEGORICAL = 4;
  /** Where the feature (numeric) or the offset in SETS (categorical) starts in the packed word. */
  private static final int SPLIT_SHIFT = 3;

  private final Schema schema;
  /** The ensemble whose trees the table holds one after another; empty for a single tree. */
  private final Optional<TreeEnsemble> ensemble;
  private final InputAccess input;
  private final TypeSpec.Builder type;
  private final SupportMethods support;
  private final LeafTable leaves;
  private final List<Node> nodes = new ArrayList<>();
  /** The most splits on one root-to-leaf path as listed: the decoder's stack size. */
  private int maxOpenSplits;
  private final Map<String, Integer> sets = new LinkedHashMap<>();
  private final PackedInts setData = new PackedInts();

  private TableWriter(Schema schema, Optional<TreeEnsemble> ensemble, EmitOptions options,
      InputAccess input, TypeSpec.Builder type, SupportMethods support) {
    this.schema = schema;
    this.ensemble = ensemble;
    this.input = input;
    this.type = type;
    this.support = support;
    // An ensemble's leaves return their class: the shares come from the votes.
    this.leaves = new LeafTable(ensemble.isEmpty() && options.probabilities());
  }

  static String write(DecisionTree tree, EmitOptions options, HeaderInfo header) {
    InputAccess input = InputAccess.of(tree.schema(), options);
    SupportMethods support = new SupportMethods(input.kind());
    TypeSpec.Builder type = ClassScaffold.start(tree, options, header, support);
    TableWriter writer = new TableWriter(tree.schema(), Optional.empty(), options, input, type,
        support);
    writer.collect(tree.root(), 0);
    writer.addTables();
    writer.addMethods();
    support.addTo(type);
    return ClassScaffold.finish(type.build(), options, header);
  }

  /**
   * Writes an ensemble: the trees' nodes one tree after another in the same three arrays, {@code
   * ROOT[t]} where tree {@code t} starts, and a loop in {@code scores} that walks each tree in
   * order and adds its weight to the class it reaches.
   */
  static String write(TreeEnsemble ensemble, EmitOptions options, HeaderInfo header) {
    InputAccess input = InputAccess.of(ensemble.schema(), options);
    SupportMethods support = new SupportMethods(input.kind());
    TypeSpec.Builder type = ClassScaffold.start(ensemble, options, header, support);
    TableWriter writer = new TableWriter(ensemble.schema(), Optional.of(ensemble), options, input,
        type, support);
    for (DecisionTree tree : ensemble.trees()) {
      writer.collect(tree.root(), 0);
    }
    writer.addTables();
    writer.addEnsembleMethods(ensemble, options);
    support.addTo(type);
    return ClassScaffold.finish(type.build(), options, header);
  }

  private void addEnsembleMethods(TreeEnsemble trees, EmitOptions options) {
    EnsembleVotes.addEntries(type, trees, input, options.probabilities());
    EnsembleVotes.addLoopedScores(type, trees, input, "ROOT[j]");
    type.addMethod(walk());
  }

  /** Lists the nodes in pre-order. */
  private void collect(Node node, int depth) {
    if (node instanceof NumericSplit numeric && input.kind() == InputKind.INT
        && Thresholds.forInt(numeric.threshold()) == Long.MIN_VALUE) {
      // Below every int: each int input goes right, so the left side is left out.
      collect(numeric.right(), depth);
      return;
    }
    nodes.add(node);
    if (node instanceof Split split) {
      maxOpenSplits = Math.max(maxOpenSplits, depth + 1);
      collect(split.left(), depth + 1);
      collect(split.right(), depth + 1);
    }
  }

  private boolean hasCategorical() {
    return nodes.stream().anyMatch(n -> n instanceof CategoricalSplit);
  }

  private void addTables() {
    PackedInts data = new PackedInts();
    PackedWords thresholds = new PackedWords();
    long wordCount = nodes.stream().filter(n -> n instanceof NumericSplit).count()
        * (input.kind() == InputKind.DOUBLE ? 2 : 1);
    boolean words = input.kind() != InputKind.INT && wordCount >= PackedWords.WORTHWHILE;
    for (int i = 0; i < nodes.size(); i++) {
      Node node = nodes.get(i);
      if (node instanceof Leaf leaf) {
        data.add((leaves.payload(leaf) << 1) | LEAF);
        continue;
      }
      Split split = (Split) node;
      int missing = split.missingLeft() ? MISSING_LEFT : 0;
      if (split instanceof NumericSplit numeric) {
        data.add((split.feature() << SPLIT_SHIFT) | missing);
        float t = numeric.threshold();
        PackedText bits = words ? thresholds : data;
        switch (input.kind()) {
          case FLOAT -> bits.addFloat(t);
          case DOUBLE -> bits.addDouble(Thresholds.forDouble(t));
          case INT -> data.addSigned((int) Thresholds.forInt(t));
        }
      } else {
        data.add((setOffset((CategoricalSplit) split) << SPLIT_SHIFT) | CATEGORICAL | missing);
      }
    }
    int n = nodes.size();
    type.addField(array("NODE", TypeName.INT, n,
        "Per node: ~result for a leaf; for a split, the feature (or the offset of its\n"
            + "set in SETS) shifted left by " + (SPLIT_SHIFT - 1) + ", | " + (CATEGORICAL >>> 1)
            + " if categorical, | " + (MISSING_LEFT >>> 1) + " if missing goes left."));
    type.addField(array("THRESHOLD", input.elementType(), n,
        "Per numeric split: go left when the value is at most this."));
    type.addField(array("RIGHT", TypeName.INT, n,
        "Per split: the right child; the left child is the next node."));
    if (!sets.isEmpty()) {
      type.addField(FieldSpec.builder(ArrayTypeName.of(TypeName.INT), "SETS",
              Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL)
          .addJavadoc("Per categorical split: feature, then k and bit words (see inSet).\n")
          .initializer(StringTable.unpack(setData))
          .build());
    }
    support.need(SupportMethods.Kind.UNPACK);
    if (thresholds.count() > 0) {
      support.need(SupportMethods.Kind.WORDS);
    }
    CodeBlock leafInit = leaves.addFields(type, support);
    CodeBlock weightInit = ensemble.map(this::addEnsembleFields).orElse(CodeBlock.of(""));
    type.addStaticBlock(CodeBlock.builder().add(decoder(data, thresholds)).add(leafInit)
        .add(weightInit).build());
  }

  /** {@code ROOT} and, for boosting, {@code WEIGHT}; returns the code that fills the weights. */
  private CodeBlock addEnsembleFields(TreeEnsemble trees) {
    type.addField(array("ROOT", TypeName.INT, trees.treeCount(),
        "Per tree, in combination order: the index of its root node."));
    return EnsembleVotes.addWeights(type, trees);
  }

  private int setOffset(CategoricalSplit split) {
    int k = schema.feature(split.feature()).categories().size();
    String key = split.feature() + ":" + k + ":" + split.leftCodes();
    Integer known = sets.get(key);
    if (known != null) {
      return known;
    }
    int at = setData.count();
    setData.add(split.feature());
    CategoryHelper.pack(setData, k, split.leftCodes().toArray());
    sets.put(key, at);
    support.need(SupportMethods.Kind.IN_SET_WIDE);
    return at;
  }

  /**
   * Decodes the nodes. Pre-order with leaves marked fixes the shape, so no child index is stored:
   * a split's left child is the next node, and the node after a leaf is the right child of the
   * latest split whose right child is still open.
   */
  private CodeBlock decoder(PackedInts data, PackedWords thresholds) {
    CodeBlock.Builder code = CodeBlock.builder()
        .add("// Per node in pre-order: a leaf is (result << 1) | $L; a split is (feature or\n",
            LEAF)
        .add("// set offset) << $L | $L if categorical | $L if missing goes left$L",
            SPLIT_SHIFT, CATEGORICAL, MISSING_LEFT, thresholds.count() > 0
                ? ".\n" : ", then its\n// threshold if numeric.\n")
        .add("// After a leaf comes the right child of the latest split still open.\n")
        .addStatement("int[] tree = $L", StringTable.unpack(data));
    if (thresholds.count() > 0) {
      code.add("// Thresholds of the numeric splits in order, as IEEE 754 bits.\n")
          .addStatement("int[] bits = $L", StringTable.words(thresholds))
          .addStatement("int word = 0");
    }
    code
        .addStatement("int[] open = new int[$L]", Math.max(1, maxOpenSplits))
        .addStatement("int top = 0")
        .addStatement("int at = 0");
    if (ensemble.isPresent()) {
      code.addStatement("int root = 0");
    }
    code
        .beginControlFlow("for (int i = 0; i < $L; i++)", nodes.size());
    if (ensemble.isPresent()) {
      // With no split open the previous tree is complete: a new tree starts here.
      code.beginControlFlow("if (top == 0)")
          .addStatement("ROOT[root++] = i")
          .nextControlFlow("else if (NODE[i - 1] < 0)")
          .addStatement("RIGHT[open[--top]] = i")
          .endControlFlow();
    } else {
      code.beginControlFlow("if (i > 0 && NODE[i - 1] < 0)")
          .addStatement("RIGHT[open[--top]] = i")
          .endControlFlow();
    }
    code
        .addStatement("int head = tree[at++]")
        .beginControlFlow("if ((head & $L) != 0)", LEAF)
        .addStatement("NODE[i] = ~(head >>> 1)")
        .nextControlFlow("else")
        .addStatement("NODE[i] = head >>> 1");
    boolean categorical = hasCategorical();
    if (categorical) {
      code.beginControlFlow("if ((head & $L) == 0)", CATEGORICAL);
    }
    String next = thresholds.count() > 0 ? "bits[word++]" : "tree[at++]";
    switch (input.kind()) {
      case FLOAT -> code.addStatement("THRESHOLD[i] = Float.intBitsToFloat($L)", next);
      case DOUBLE -> code.addStatement("long high = $L", next)
          .addStatement("THRESHOLD[i] = Double.longBitsToDouble(high << 32 | ($L & 0xffffffffL))",
              next);
      case INT -> code.addStatement("int zigzag = tree[at++]")
          .addStatement("THRESHOLD[i] = (zigzag >>> 1) ^ -(zigzag & 1)");
    }
    if (categorical) {
      code.endControlFlow();
    }
    return code.addStatement("open[top++] = i")
        .endControlFlow()
        .endControlFlow()
        .build();
  }

  private static FieldSpec array(String name, TypeName element, int length, String doc) {
    return FieldSpec.builder(ArrayTypeName.of(element), name,
            Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("$L\n", doc)
        .initializer("new $T[$L]", element, length)
        .build();
  }

  private void addMethods() {
    CodeBlock leafCall = CodeBlock.of("leaf($L)", input.asArray());
    MethodSpec.Builder classify = MethodSpec.methodBuilder("classify")
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc(EntryDoc.classify(schema, input));
    input.addParameters(classify);
    if (input.checksLength()) {
      EntryDoc.addLengthCheck(classify, schema);
    }
    type.addMethod(classify.addStatement("return $L", leaves.classOf(leafCall)).build());
    if (leaves.probabilities()) {
      type.addMethod(LeafTable.probabilitiesMethod(schema, input, leafCall));
    }
    type.addMethod(walk());
  }

  /** {@code leaf(x)}: walks from the root to a leaf and returns the leaf's result. */
  private MethodSpec walk() {
    CodeBlock.Builder code = CodeBlock.builder();
    if (ensemble.isEmpty()) {
      code.addStatement("int i = 0");
    }
    code.addStatement("int node")
        .beginControlFlow("while ((node = NODE[i]) >= 0)")
        .addStatement("boolean left");
    boolean categorical = hasCategorical();
    if (categorical) {
      code.beginControlFlow("if ((node & $L) == 0)", CATEGORICAL >>> 1);
    }
    if (input.kind() == InputKind.INT) {
      // An int is never missing.
      code.addStatement("left = x[node >>> $L] <= THRESHOLD[i]", SPLIT_SHIFT - 1);
    } else {
      // NaN fails every comparison, so "<=" sends it right and "!(>)" sends it left.
      code.addStatement("$T v = x[node >>> $L]", input.elementType(), SPLIT_SHIFT - 1)
          .addStatement("left = (node & $L) == 0 ? v <= THRESHOLD[i] : !(v > THRESHOLD[i])",
              MISSING_LEFT >>> 1);
    }
    if (categorical) {
      String cast = input.kind() == InputKind.DOUBLE ? "(float) " : "";
      code.nextControlFlow("else")
          .addStatement("int at = node >>> $L", SPLIT_SHIFT - 1)
          .addStatement("left = inSet($Lx[SETS[at]], at + 1, (node & $L) != 0)", cast,
              MISSING_LEFT >>> 1)
          .endControlFlow();
    }
    code.addStatement("i = left ? i + 1 : RIGHT[i]")
        .endControlFlow()
        .addStatement("return ~node");
    if (ensemble.isPresent()) {
      return MethodSpec.methodBuilder("leaf")
          .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
          .returns(TypeName.INT)
          .addJavadoc("Walks the node table from a tree's root to a leaf.\n\n"
              + "@param x the feature values in input order\n"
              + "@param i the index of the tree's root node\n"
              + "@return the class of the leaf reached\n")
          .addParameter(ArrayTypeName.of(input.elementType()), "x")
          .addParameter(TypeName.INT, "i")
          .addCode(code.build())
          .build();
    }
    return MethodSpec.methodBuilder("leaf")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc("Walks the node table from the root to a leaf.\n\n"
            + "@param x the feature values in input order\n"
            + "@return what the leaf holds: its class, or its number with class probabilities\n")
        .addParameter(ArrayTypeName.of(input.elementType()), "x")
        .addCode(code.build())
        .build();
  }
}
