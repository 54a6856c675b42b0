package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.FieldSpec;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import com.palantir.javapoet.TypeSpec;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.lang.model.element.Modifier;

/**
 * Emits the {@code flat} layout ({@link FlatTree}): the tree padded to a complete tree, walked in
 * exactly depth steps that add the comparison's outcome to the index instead of branching on it,
 * so inputs that jump around cost no mispredicted branches. The real nodes are packed in pre-order
 * ({@link PackedInts}) and spread over the complete-tree arrays once, at class initialisation.
 */
final class FlatWriter {
  /** The single tree, or an ensemble's first tree. */
  private final FlatTree flat;
  /** The trees in combination order: one for a single tree. */
  private final List<FlatTree> flats;
  /** Whether any slot is categorical: then {@code right} reads the code sets too. */
  private final boolean categorical;
  /** Whether every tree has the same depth: then the walk's step count is a constant. */
  private final boolean sameDepth;
  private final InputAccess input;
  private final TypeSpec.Builder type;
  private final SupportMethods support;
  private final LeafTable leaves;
  /** The input's feature count. */
  private final int features;
  /** The cap on a per-call method's bytecode ({@link EmitOptions#maxMethodBytes()}). */
  private final int maxMethodBytes;

  private FlatWriter(List<FlatTree> flats, InputAccess input, TypeSpec.Builder type,
      SupportMethods support, LeafTable leaves, EmitOptions options, int features) {
    this.flat = flats.get(0);
    this.flats = flats;
    this.categorical = flats.stream().anyMatch(FlatTree::hasCategorical);
    this.sameDepth = flats.stream().allMatch(t -> t.depth() == flat.depth());
    this.input = input;
    this.type = type;
    this.support = support;
    this.leaves = leaves;
    this.features = features;
    this.maxMethodBytes = options.maxMethodBytes();
  }

  static String write(DecisionTree tree, EmitOptions options, HeaderInfo header) {
    InputAccess input = InputAccess.of(tree.schema(), options);
    LeafTable leaves = new LeafTable(options.probabilities());
    FlatTree flat = FlatTree.of(tree, input.kind(), leaves::payload);
    SupportMethods support = new SupportMethods(input.kind());
    TypeSpec.Builder type = ClassScaffold.start(tree, options, header, support);
    FlatWriter writer = new FlatWriter(List.of(flat), input, type, support, leaves, options,
        tree.schema().featureCount());
    writer.addTables();
    writer.addMethods(tree);
    support.addTo(type);
    return ClassScaffold.finish(type.build(), options, header);
  }

  /**
   * Writes an ensemble: every tree padded to a complete tree, all in the same arrays one after
   * another; the walk takes tree t from its offset and {@code scores} adds the votes in tree order
   * as the other layouts do ({@link EnsembleVotes}). The trees are padded to the deepest one's
   * depth, so that the walk has a fixed step count, unless that would more than double the slots
   * (then each to its own depth, and the walk reads the count).
   */
  static String write(TreeEnsemble ensemble, EmitOptions options, HeaderInfo header) {
    InputAccess input = InputAccess.of(ensemble.schema(), options);
    // An ensemble's leaves return their class: the shares come from the votes.
    LeafTable leaves = new LeafTable(false);
    List<FlatTree> flats = new ArrayList<>();
    int deepest = 0;
    long slots = 0;
    for (DecisionTree tree : ensemble.trees()) {
      FlatTree flat = FlatTree.of(tree, input.kind(), leaves::payload);
      flats.add(flat);
      deepest = Math.max(deepest, flat.depth());
      slots += 1L << flat.depth();
    }
    if ((long) flats.size() << deepest <= 2 * slots) {
      // A 10-tree forest of depth 6 on the pump demo: a row in 141 ns with the count fixed, 192
      // with it read per tree (scratch timings, 2026-12-04). Trees already that deep stay as laid.
      for (int t = 0; t < flats.size(); t++) {
        if (flats.get(t).depth() < deepest) {
          flats.set(t, FlatTree.of(ensemble.trees().get(t), input.kind(), leaves::payload,
              deepest));
        }
      }
    }
    SupportMethods support = new SupportMethods(input.kind());
    TypeSpec.Builder type = ClassScaffold.start(ensemble, options, header, support);
    FlatWriter writer = new FlatWriter(List.copyOf(flats), input, type, support, leaves, options,
        ensemble.schema().featureCount());
    writer.addEnsembleTables(ensemble);
    EnsembleVotes.addEntries(type, ensemble, input, options.probabilities());
    writer.addEnsembleMethods(ensemble);
    support.addTo(type);
    return ClassScaffold.finish(type.build(), options, header);
  }

  /**
   * The arrays of all trees: each tree's split slots from {@code SPLIT_AT[t]} on, its leaf slot j
   * at {@code LEAF_FROM[t] + 2^D - 1 + j}, so that the walk's slot index reads the leaf directly.
   * One padding slot at the end lets a tree of depth 0 read a slot it then ignores.
   */
  private void addEnsembleTables(TreeEnsemble ensemble) {
    PackedInts data = new PackedInts();
    PackedInts sets = new PackedInts();
    int splits = 1;
    int leafSlots = 0;
    int deepest = 0;
    for (FlatTree tree : flats) {
      data.add(tree.depth());
      addNodes(tree, data, sets);
      splits += tree.splitSlots();
      leafSlots += 1 << tree.depth();
      deepest = Math.max(deepest, tree.depth());
    }
    int trees = flats.size();
    type.addField(array("NODE", TypeName.INT, splits,
        "Per split slot of the complete trees, tree after tree: the feature shifted left by "
            + FlatTree.FEATURE_SHIFT + ", | " + FlatTree.CATEGORICAL + " if categorical, | "
            + FlatTree.NAN_RIGHT + " if a\nmissing value goes right. The children of slot i "
            + "of a tree are 2i + 1 and 2i + 2."));
    type.addField(array("KEY", keyType(), splits,
        keyDoc()));
    type.addField(array("LEAF", TypeName.INT, leafSlots,
        "Per leaf slot, tree after tree: the class."));
    if (!sameDepth) {
      type.addField(array("DEPTH", TypeName.INT, trees,
          "Per tree: the depth of its complete tree."));
    }
    type.addField(array("SPLIT_AT", TypeName.INT, trees,
        "Per tree: where its split slots start in NODE and KEY."));
    type.addField(array("LEAF_FROM", TypeName.INT, trees,
        "Per tree of depth D: where its leaf slots start in LEAF, less 2^D - 1."));
    if (categorical) {
      addSetFields(splits, sets);
    }
    support.need(SupportMethods.Kind.UNPACK);
    CodeBlock weights = EnsembleVotes.addWeights(type, ensemble);
    type.addStaticBlock(CodeBlock.builder().add(ensembleDecoder(data, deepest)).add(weights)
        .build());
  }

  /** Spreads each tree's pre-order nodes over its complete tree; a tree ends at its last leaf. */
  private CodeBlock ensembleDecoder(PackedInts data, int deepest) {
    CodeBlock.Builder code = CodeBlock.builder()
        .add("// Per tree: its depth, then per node in pre-order: a leaf is (class << 1) | 1; a"
            + "\n// split is NODE << 1, then its key$L.\n",
            input.kind() == InputKind.DOUBLE ? " (high word, low word)" : "")
        .add(categorical ? "// A categorical split has its offset in SETS instead.\n" : "")
        .addStatement("int[] tree = $L", StringTable.unpack(data))
        .addStatement("int[] open = new int[$L]", deepest + 1)
        .addStatement("int at = 0")
        .addStatement("int base = 0")
        .addStatement("int leafAt = 0")
        .beginControlFlow("for (int t = 0; t < $L; t++)", flats.size())
        .addStatement("int d = tree[at++]")
        .add(sameDepth ? CodeBlock.of("") : CodeBlock.of("DEPTH[t] = d;\n"))
        .addStatement("SPLIT_AT[t] = base")
        .addStatement("LEAF_FROM[t] = leafAt - ((1 << d) - 1)")
        .addStatement("int top = 0")
        .addStatement("int slot = 0")
        .beginControlFlow("while (true)")
        .addStatement("int head = tree[at++]")
        .beginControlFlow("if ((head & 1) != 0)")
        .addStatement("int span = d - 31 + Integer.numberOfLeadingZeros(slot + 1)")
        .addStatement("int first = leafAt + ((slot + 1) << span) - (1 << d)")
        .beginControlFlow("for (int j = first; j < first + (1 << span); j++)")
        .addStatement("LEAF[j] = head >>> 1")
        .endControlFlow()
        .beginControlFlow("if (top == 0)")
        .addStatement("break")
        .endControlFlow()
        .addStatement("slot = open[--top]")
        .addStatement("continue")
        .endControlFlow()
        .addStatement("NODE[base + slot] = head >>> 1");
    String key = keyDecoder();
    if (categorical) {
      code.beginControlFlow("if ((head & $L) != 0)", FlatTree.CATEGORICAL << 1)
          .addStatement("int set = tree[at++]")
          .addStatement("KEY[base + slot] = SETS[set]")
          .addStatement("SET_AT[base + slot] = set + 1")
          .nextControlFlow("else")
          .addStatement("KEY[base + slot] = $L", key)
          .endControlFlow();
    } else {
      code.addStatement("KEY[base + slot] = $L", key);
    }
    return code.addStatement("open[top++] = 2 * slot + 2")
        .addStatement("slot = 2 * slot + 1")
        .endControlFlow()
        .addStatement("base += (1 << d) - 1")
        .addStatement("leafAt += 1 << d")
        .endControlFlow()
        .build();
  }

  /**
   * {@code scores} and the walks of tree t, two levels a step as for a single tree. For float and
   * double input without categorical slots, {@code scores} tests the row once for a missing or
   * infinite value and takes one walk for every tree: a test in each tree's walk cost a 10-tree
   * forest on the pump demo 230 ns a row against 200 (scratch timings, 2026-12-04).
   */
  private void addEnsembleMethods(TreeEnsemble ensemble) {
    if (finiteWalk()) {
      EnsembleVotes.addTestedScores(type, ensemble, input, "special(x) < 0", "walk",
          "walkFinite");
      type.addMethod(special());
      type.addMethod(ensembleWalk("walkFinite", "over", "rows whose values are all finite"));
      type.addMethod(ensembleWalk("walk", "right", "any row"));
      type.addMethod(over());
    } else {
      EnsembleVotes.addLoopedScores(type, ensemble, input, "j");
      type.addMethod(ensembleWalk("leaf", "right", "any row"));
    }
    type.addMethod(right());
  }

  /**
   * {@code leaf} and what it calls: the walk for any row and, for float and double input without
   * categorical slots, the finite rows' walk with the {@code special} test that picks between them.
   */
  private void addWalks() {
    if (finiteWalk()) {
      type.addMethod(dispatch("walkFinite", "walk"));
      type.addMethod(special());
      type.addMethod(walk("walkFinite", "over", "rows whose values are all finite"));
      type.addMethod(walk("walk", "right", "any row"));
      type.addMethod(over());
    } else {
      type.addMethod(walk("leaf", "right", "any row"));
    }
  }

  /**
   * Tree t's walk. With every tree of one depth the step count is a constant, as for a single
   * tree; else it is read per tree, and an odd depth takes its first level alone, by arithmetic:
   * the root's outcome, masked to 0 for an even depth.
   */
  private MethodSpec ensembleWalk(String name, String decide, String rows) {
    CodeBlock.Builder code = CodeBlock.builder();
    if (sameDepth) {
      if (flat.depth() > 0) {
        code.addStatement("int base = SPLIT_AT[t]");
      }
      code.addStatement("int i = 0");
      addSteps(code, flat.depth(), decide, "base + ");
    } else {
      code.addStatement("int base = SPLIT_AT[t]")
          .addStatement("int d = DEPTH[t]")
          .add("// Slot 1 + right at the root for an odd depth, else the root itself.\n")
          .addStatement("int i = (1 + $L(x, base)) & -(d & 1)", decide)
          .addStatement("int steps = d >>> 1")
          .beginControlFlow("for (int step = 0; step < steps; step++)");
      addStep(code, decide, "base + ");
      code.endControlFlow();
    }
    code.addStatement("return LEAF[LEAF_FROM[t] + i]");
    return MethodSpec.methodBuilder(name)
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc("Walks tree {@code t}'s complete tree from its root to a leaf slot, two levels"
            + " a step, for $L.\n\n", rows)
        .addJavadoc("@param x the feature values in input order\n"
            + "@param t the tree, in combination order\n"
            + "@return the class the leaf holds\n")
        .addParameter(ArrayTypeName.of(input.elementType()), "x")
        .addParameter(TypeName.INT, "t")
        .addCode(code.build())
        .build();
  }

  private String keyDoc() {
    return switch (input.kind()) {
      case INT -> "Per split slot: go right when the value is above this.";
      case FLOAT, DOUBLE -> "Per split slot: the threshold; go right when the value is above it"
          + " (-0.0 is\nstored as 0.0, so both zeros go left of either).";
    };
  }

  private TypeName keyType() {
    return switch (input.kind()) {
      case INT -> TypeName.INT;
      case FLOAT -> TypeName.FLOAT;
      case DOUBLE -> TypeName.DOUBLE;
    };
  }

  /** The decoder's expression for a numeric slot's key: the threshold from its packed bits. */
  private String keyDecoder() {
    return switch (input.kind()) {
      case DOUBLE ->
          "Double.longBitsToDouble((long) tree[at++] << 32 | (tree[at++] & 0xffffffffL))";
      case FLOAT -> "Float.intBitsToFloat(tree[at++])";
      case INT -> "tree[at++]";
    };
  }

  /** Where the keys that go left start for float input: {@link #right()} explains. */
  private static final int FLOAT_LOW = 0x7f800001;

  /**
   * Whether finite rows get a walk of their own ({@link #over()}): for float and double input
   * without categorical slots. A subtraction decides a finite value in fewer steps than the order
   * keys, which only missing and infinite values need.
   */
  private boolean finiteWalk() {
    return input.kind() != InputKind.INT && !categorical;
  }

  /** Appends {@code tree}'s nodes in pre-order to {@code data}, its code sets to {@code sets}. */
  private void addNodes(FlatTree tree, PackedInts data, PackedInts sets) {
    for (FlatTree.Slot slot : tree.preOrder()) {
      if (slot.node() instanceof Leaf leaf) {
        data.add(leaves.payload(leaf) << 1 | 1);
        continue;
      }
      int i = slot.index();
      data.add(tree.node(i) << 1);
      if (slot.node() instanceof NumericSplit) {
        long key = tree.key(i);
        if (input.kind() == InputKind.DOUBLE) {
          // The order key is its own inverse: these are the threshold's bits.
          long bits = key ^ ((key >> 63) & Long.MAX_VALUE);
          data.add((int) (bits >>> 32)).add((int) bits);
        } else if (input.kind() == InputKind.FLOAT) {
          data.add((int) key ^ (((int) key >> 31) & 0x7fffffff));
        } else {
          data.add((int) key);
        }
      } else {
        data.add(sets.count());
        sets.add((int) tree.key(i));
        for (int word : tree.rightCodes(i)) {
          sets.add(word);
        }
      }
    }
  }

  private void addTables() {
    PackedInts data = new PackedInts();
    PackedInts sets = new PackedInts();
    addNodes(flat, data, sets);
    int d = flat.depth();
    type.addField(array("NODE", TypeName.INT, flat.splitSlots(),
        "Per split slot of the complete tree: the feature shifted left by "
            + FlatTree.FEATURE_SHIFT + ", | " + FlatTree.CATEGORICAL + " if categorical, | "
            + FlatTree.NAN_RIGHT + " if a\nmissing value goes right. The children of slot i "
            + "are 2i + 1 and 2i + 2."));
    type.addField(array("KEY", keyType(), flat.splitSlots(),
        keyDoc()));
    type.addField(array("LEAF", TypeName.INT, 1 << d,
        "Per leaf slot (complete-tree slot " + ((1 << d) - 1) + " + j): the result."));
    if (flat.hasCategorical()) {
      addSetFields(flat.splitSlots(), sets);
    }
    support.need(SupportMethods.Kind.UNPACK);
    CodeBlock leafInit = leaves.addFields(type, support);
    type.addStaticBlock(CodeBlock.builder().add(decoder(data)).add(leafInit).build());
  }

  /** Spreads the pre-order nodes over the complete tree; a leaf fills the leaf slots below it. */
  private CodeBlock decoder(PackedInts data) {
    int d = flat.depth();
    CodeBlock.Builder code = CodeBlock.builder()
        .add("// Per node in pre-order: a leaf is (result << 1) | 1; a split is NODE << 1, then"
            + "\n// its key$L.\n", input.kind() == InputKind.DOUBLE ? " (high word, low word)" : "")
        .add(flat.hasCategorical() ? "// A categorical split has its offset in SETS instead.\n"
            : "")
        .addStatement("int[] tree = $L", StringTable.unpack(data))
        .addStatement("int[] open = new int[$L]", d + 1)
        .addStatement("int top = 0")
        .addStatement("int slot = 0")
        .addStatement("int at = 0")
        .beginControlFlow("for (int n = 0; n < $L; n++)", flat.preOrder().size())
        .addStatement("int head = tree[at++]")
        .beginControlFlow("if ((head & 1) != 0)")
        .addStatement("int span = $L + Integer.numberOfLeadingZeros(slot + 1)", d - 31)
        .addStatement("int first = ((slot + 1) << span) - $L", 1 << d)
        .beginControlFlow("for (int j = first; j < first + (1 << span); j++)")
        .addStatement("LEAF[j] = head >>> 1")
        .endControlFlow()
        .beginControlFlow("if (top > 0)")
        .addStatement("slot = open[--top]")
        .endControlFlow()
        .addStatement("continue")
        .endControlFlow()
        .addStatement("NODE[slot] = head >>> 1");
    String key = keyDecoder();
    if (flat.hasCategorical()) {
      code.beginControlFlow("if ((head & $L) != 0)", FlatTree.CATEGORICAL << 1)
          .addStatement("int set = tree[at++]")
          .addStatement("KEY[slot] = SETS[set]")
          .addStatement("SET_AT[slot] = set + 1")
          .nextControlFlow("else")
          .addStatement("KEY[slot] = $L", key)
          .endControlFlow();
    } else {
      code.addStatement("KEY[slot] = $L", key);
    }
    return code.addStatement("open[top++] = 2 * slot + 2")
        .addStatement("slot = 2 * slot + 1")
        .endControlFlow()
        .build();
  }

  /** {@code SET_AT} and {@code SETS}: the categorical splits' right-going codes. */
  private void addSetFields(int splitSlots, PackedInts sets) {
    type.addField(array("SET_AT", TypeName.INT, splitSlots,
        "Per categorical slot: where its right-going code bits start in SETS."));
    type.addField(FieldSpec.builder(ArrayTypeName.of(TypeName.INT), "SETS",
            Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("Per categorical split: k, then words with bit c set when code c goes"
            + " right;\nbit k for a missing or unknown code.\n")
        .initializer(StringTable.unpack(sets))
        .build());
  }

  private static FieldSpec array(String name, TypeName element, int length, String doc) {
    return FieldSpec.builder(ArrayTypeName.of(element), name,
            Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("$L\n", doc)
        .initializer("new $T[$L]", element, length)
        .build();
  }

  private void addMethods(DecisionTree tree) {
    CodeBlock leafCall = CodeBlock.of("leaf($L)", input.asArray());
    MethodSpec.Builder classify = MethodSpec.methodBuilder("classify")
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc(EntryDoc.classify(tree.schema(), input));
    input.addParameters(classify);
    if (input.checksLength()) {
      EntryDoc.addLengthCheck(classify, tree.schema());
    }
    type.addMethod(classify.addStatement("return $L", leaves.classOf(leafCall)).build());
    if (leaves.probabilities()) {
      type.addMethod(LeafTable.probabilitiesMethod(tree.schema(), input, leafCall));
    }
    if (input.checksLength() && maxMethodBytes >= FlatBatchWriter.MAX_BYTES) {
      // Rows as arrays, room beyond a bare class's budget and under the cap: many rows at once.
      type.addMethod(new FlatBatchWriter(tree.schema(), input, leaves, flat.depth(),
          flat.depth() > 0 && finiteWalk()).write());
    }
    if (flat.depth() == 0) {
      // A single leaf: nothing to decide.
      type.addMethod(walk("leaf", "right", "any row"));
    } else {
      addWalks();
      type.addMethod(right());
    }
  }

  /**
   * {@code leaf(x)}: two levels a step. The step decides slot i and, at the same time, both of its
   * children, then picks the grandchild: the three decisions do not wait for each other, so the
   * chain of dependent loads is half as long as one level a step. The only conditional branch is
   * the loop's own test of the step count, which goes the same way for every input.
   */
  private MethodSpec walk(String name, String decide, String rows) {
    int d = flat.depth();
    CodeBlock.Builder code = CodeBlock.builder().addStatement("int i = 0");
    addSteps(code, d, decide, "");
    code.addStatement("return LEAF[i - $L]", (1 << d) - 1);
    MethodSpec.Builder leaf = MethodSpec.methodBuilder(name)
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc("Walks the complete tree from the root to a leaf slot, two levels a step, for"
            + " $L.\n\n"
            + "@param x the feature values in input order\n"
            + "@return what the leaf holds: its class, or its number with class probabilities\n",
            rows)
        .addParameter(ArrayTypeName.of(input.elementType()), "x");
    return leaf.addCode(code.build()).build();
  }

  /** From slot i at depth 0 down {@code d} levels: two a step, then an odd one alone. */
  private static void addSteps(CodeBlock.Builder code, int d, String decide, String base) {
    if (d >= 2) {
      code.beginControlFlow("for (int step = 0; step < $L; step++)", d / 2);
      addStep(code, decide, base);
      code.endControlFlow();
    }
    if (d % 2 == 1) {
      code.addStatement("i = 2 * i + 1 + $L(x, $Li)", decide, base);
    }
  }

  /** One two-level step from slot i; {@code base} is where the tree's slots start. */
  private static void addStep(CodeBlock.Builder code, String decide, String base) {
    code.addStatement("int r = $L(x, $Li)", decide, base)
        .addStatement("int b = $L(x, $L2 * i + 1)", decide, base)
        .addStatement("int c = $L(x, $L2 * i + 2)", decide, base)
        .add("// Grandchild 4i + 3 + 2r + s; s decides child 2i + 1 + r: c if r, else b.\n")
        .addStatement("i = 4 * i + 3 + 2 * r + (b ^ ((b ^ c) & -r))");
  }

  /**
   * {@code leaf(x)} when finite rows have their own walk: a row with a missing or infinite value
   * takes the general one. This branch is on the row, not on a comparison: it goes the same way
   * for every row a working sensor sends.
   */
  private MethodSpec dispatch(String walkFinite, String walkAny) {
    return MethodSpec.methodBuilder("leaf")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc("Takes the finite rows' walk unless a value is missing or infinite.\n\n"
            + "@param x the feature values in input order\n"
            + "@return what the leaf holds\n")
        .addParameter(ArrayTypeName.of(input.elementType()), "x")
        .beginControlFlow("if (special(x) < 0)")
        .addStatement("return $L(x)", walkAny)
        .endControlFlow()
        .addStatement("return $L(x)", walkFinite)
        .build();
  }

  /** Upper bound of the bytecode bytes of one feature's term in a straight-line {@code special}. */
  private static final int SPECIAL_TERM_BYTES = 16;

  /**
   * Whether {@code special} reads the features one by one without a loop: up to {@link
   * EmitOptions#MAX_NAMED_ARGS} features and within the method cap. On the pump demo (six
   * features) the loop over {@code x.length} took about 5 ns of a 15.5 ns row in
   * {@code classifyAll}, the straight expression 2.4 (scratch timings, 2026-12-03).
   */
  private boolean straightSpecial() {
    return features <= EmitOptions.MAX_NAMED_ARGS
        && features * SPECIAL_TERM_BYTES + 8 <= maxMethodBytes;
  }

  /** {@code special(x)}: negative when some value is NaN or infinite, by arithmetic alone. */
  private MethodSpec special() {
    boolean dbl = input.kind() == InputKind.DOUBLE;
    String term = oddTerm(input.kind(), "x[$L]");
    CodeBlock.Builder code = CodeBlock.builder()
        .add("// Magnitude bits above the largest finite value's mean NaN or infinity (IEEE\n"
            + "// 754-2019 section 3.4): the difference is then negative.\n");
    if (straightSpecial()) {
      CodeBlock.Builder terms = CodeBlock.builder();
      for (int f = 0; f < features; f++) {
        terms.add(f == 0 ? term : "$W| " + term, f);
      }
      code.addStatement("$L odd = $L", dbl ? "long" : "int", terms.build());
    } else {
      code.addStatement("$L odd = 0", dbl ? "long" : "int")
          .beginControlFlow("for (int f = 0; f < x.length; f++)")
          .addStatement("odd |= " + term, "f")
          .endControlFlow();
    }
    code.addStatement("return $L", dbl ? "(int) (odd >> 32)" : "odd");
    return MethodSpec.methodBuilder("special")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc("Tells, by its sign, whether a value is missing or infinite.\n\n"
            + "@param x the feature values in input order\n"
            + "@return a negative number when some value is NaN or infinite, else zero or more\n")
        .addParameter(ArrayTypeName.of(input.elementType()), "x")
        .addCode(code.build())
        .build();
  }

  /** The head of a decision method {@code name(x, i)}: 1 when x goes right at slot i, else 0. */
  private MethodSpec.Builder decision(String name, String forWhat, String inputNote) {
    return MethodSpec.methodBuilder(name)
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc("Decides split slot {@code i} $Lwithout a conditional branch.\n\n"
            + "@param x the feature values in input order$L\n"
            + "@param i the split slot\n"
            + "@return 1 when x goes right, 0 when it goes left\n", forWhat, inputNote)
        .addParameter(ArrayTypeName.of(input.elementType()), "x")
        .addParameter(TypeName.INT, "i");
  }

  /**
   * {@code over(x, i)}: the decision for a finite value, as the sign of threshold less value. For
   * finite operands the difference is exact in sign and zero only when they are equal (IEEE
   * 754-2019 §6.3: gradual underflow, so x - y = 0 only for x = y, and +0 in round to nearest);
   * an infinite threshold gives an infinite difference of the right sign.
   */
  private MethodSpec over() {
    return decision("over", "for a finite value, ", ", all finite")
        .addStatement("return $L", overTerm(input.kind(), "i", valueAt("x", "i")))
        .build();
  }

  /**
   * The decision of {@link #over()} for the finite {@code value} at split slot {@code slot}, as an
   * expression (to be parenthesized inside another): 1 when it goes right, else 0. {@link
   * FlatBatchWriter} inlines it.
   */
  static String overTerm(InputKind kind, String slot, String value) {
    return kind == InputKind.DOUBLE
        ? "(int) (Double.doubleToRawLongBits(KEY[" + slot + "] - " + value + ") >>> 63)"
        : "Float.floatToRawIntBits(KEY[" + slot + "] - " + value + ") >>> 31";
  }

  /** The value of row {@code x} that split slot {@code slot} tests, as an expression. */
  static String valueAt(String x, String slot) {
    return x + "[NODE[" + slot + "] >>> " + FlatTree.FEATURE_SHIFT + "]";
  }

  /**
   * A term of {@link #special()} for {@code value}: negative when it is NaN or infinite (an
   * {@code int}, or a {@code long} for double input), else zero or more.
   */
  static String oddTerm(InputKind kind, String value) {
    return kind == InputKind.DOUBLE
        ? "(0x7fefffffffffffffL - (Double.doubleToRawLongBits(" + value + ") & Long.MAX_VALUE))"
        : "(0x7f7fffff - (Float.floatToRawIntBits(" + value + ") & 0x7fffffff))";
  }

  /**
   * {@code right(x, i)}: 1 when x goes right at split slot i, else 0, by arithmetic alone: no
   * conditional branch at all.
   */
  private MethodSpec right() {
    CodeBlock.Builder code = CodeBlock.builder()
        .addStatement("int node = NODE[i]");
    switch (input.kind()) {
      case FLOAT -> code
          .addStatement("float v = x[node >>> $L]", FlatTree.FEATURE_SHIFT)
          .add("// Order key: IEEE 754 bits with a negative value's magnitude bits flipped. A\n"
              + "// positive NaN's key is above +infinity's, a negative NaN's below -infinity's.\n")
          .addStatement("int bits = Float.floatToRawIntBits(v)")
          .addStatement("int key = bits ^ ((bits >> 31) & 0x7fffffff)")
          .addStatement("int t = Float.floatToRawIntBits(KEY[i])")
          .addStatement("t ^= (t >> 31) & 0x7fffffff")
          .add("// The keys that go left are one run, counted round the 32-bit circle from low:\n"
              + "// from -infinity's key if NaN goes right, else from just above +infinity's\n"
              + "// (so through every NaN).\n")
          .addStatement("int m = -(node & $L)", FlatTree.NAN_RIGHT)
          .addStatement("int low = ($L ^ m) - m", String.format(Locale.ROOT, "0x%08x", FLOAT_LOW))
          .addStatement("int right = (int) ((((t - low) & 0xffffffffL)"
              + " - ((key - low) & 0xffffffffL)) >>> 63)");
      case DOUBLE -> code
          .addStatement("double v = x[node >>> $L]", FlatTree.FEATURE_SHIFT)
          .addStatement("long bits = Double.doubleToRawLongBits(v)")
          .addStatement("int nan = (int) ((0x7ff0000000000000L - (bits & Long.MAX_VALUE)) >> 63)")
          .addStatement("long key = bits ^ ((bits >> 63) & Long.MAX_VALUE)")
          .addStatement("long t = Double.doubleToRawLongBits(KEY[i])")
          .addStatement("t ^= (t >> 63) & Long.MAX_VALUE")
          .add("// t < key without overflow: Hacker's Delight, 2nd ed., section 2-12.\n")
          .addStatement("int right = (int) (((t - key) ^ ((t ^ key) & ((t - key) ^ t))) >>> 63)")
          .addStatement("right = (right & ~nan) | (node & nan & $L)", FlatTree.NAN_RIGHT);
      case INT -> code
          .addStatement("int v = x[node >>> $L]", FlatTree.FEATURE_SHIFT)
          .addStatement("int right = (int) (((long) KEY[i] - v) >>> 63)");
    }
    if (categorical) {
      code.add("// A categorical slot reads its code's bit; a code that is not a whole number in\n"
          + "// [0, k) reads bit k, the missing side. A numeric slot masks k to 0.\n")
          .addStatement("int cat = -((node >>> 1) & 1)")
          .addStatement("int k = $LKEY[i] & cat", input.kind() == InputKind.INT ? "" : "(int) ");
      if (input.kind() == InputKind.INT) {
        code.addStatement("int c = v")
            .addStatement("int bad = (c | (k - 1 - c)) >> 31");
      } else {
        String f = input.kind() == InputKind.DOUBLE ? "(float) v" : "v";
        code.addStatement("int c = (int) $L", f)
            .add("// Adding 0f turns -0.0 into 0.0 (IEEE 754-2019 6.3), code 0 as in the model.\n")
            .addStatement("int d = Float.floatToRawIntBits(c) ^ Float.floatToRawIntBits($L + 0f)",
                f)
            .addStatement("int bad = (d | -d | c | (k - 1 - c)) >> 31");
      }
      code.addStatement("int code = (c & ~bad) | (k & bad)")
          .addStatement("right = (right & ~cat) | ((SETS[SET_AT[i] + (code >>> 5)] >>> code) & cat"
              + " & 1)");
    }
    code.addStatement("return right");
    return decision("right", "", "")
        .addCode(code.build())
        .build();
  }
}
