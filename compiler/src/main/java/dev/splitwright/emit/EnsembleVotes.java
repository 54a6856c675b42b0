package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.FieldSpec;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import com.palantir.javapoet.TypeSpec;
import dev.splitwright.data.Schema;
import dev.splitwright.model.TreeEnsemble;
import java.util.Locale;
import java.util.function.IntFunction;
import javax.lang.model.element.Modifier;

/**
 * The entry methods of an emitted ensemble, shared by the layouts: {@code scores} adds each tree's
 * weight to the class its tree returns, in tree order and in float, exactly as {@link
 * TreeEnsemble#scores} does; {@code classify} takes the largest score (lowest index on ties) and
 * {@code classProbabilities} divides each score by the total weight. Java float arithmetic is
 * strict IEEE 754 binary32 (JLS 15.4, JEP 306), so these are the model's bits.
 */
final class EnsembleVotes {
  /**
   * Upper bound of the bytes {@code scores} spends besides the votes: {@code new float[k]}, its
   * store and load, {@code areturn} (JVM Specification 6.5).
   */
  private static final int SCORES_BYTES = 32;

  private EnsembleVotes() {}

  /** Adds {@code classify} and, with probabilities, {@code classProbabilities}. */
  static void addEntries(TypeSpec.Builder type, TreeEnsemble ensemble, InputAccess input,
      boolean probabilities) {
    Schema schema = ensemble.schema();
    CodeBlock scoresCall = CodeBlock.of("scores($L)", input.arguments());
    MethodSpec.Builder classify = MethodSpec.methodBuilder("classify")
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .returns(TypeName.INT)
        .addJavadoc(EntryDoc.classify(schema, input));
    input.addParameters(classify);
    if (input.checksLength()) {
      EntryDoc.addLengthCheck(classify, schema);
    }
    type.addMethod(classify.addStatement("float[] out = $L", scoresCall)
        .addStatement("int c = 0")
        .beginControlFlow("for (int i = 1; i < out.length; i++)")
        .addCode("// Only a larger score wins, so ties go to the lowest class index.\n")
        .beginControlFlow("if (out[i] > out[c])")
        .addStatement("c = i")
        .endControlFlow()
        .endControlFlow()
        .addStatement("return c")
        .build());
    if (!probabilities) {
      return;
    }
    MethodSpec.Builder m = MethodSpec.methodBuilder("classProbabilities")
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .addJavadoc(EntryDoc.ensembleProbabilities(schema, input, ensemble));
    input.addParameters(m);
    m.addParameter(ArrayTypeName.of(TypeName.FLOAT), "out");
    if (input.checksLength()) {
      EntryDoc.addLengthCheck(m, schema);
    }
    m.beginControlFlow("if (out.length != $L)", schema.classCount())
        .addStatement("throw new IllegalArgumentException($W$S.concat(String.valueOf(out.length)))",
            "expected room for " + schema.classCount() + " classes but got ")
        .endControlFlow();
    type.addMethod(m.addStatement("float[] v = $L", scoresCall)
        .addCode("// The total weight, summed in tree order in float.\n")
        .beginControlFlow("for (int c = 0; c < out.length; c++)")
        .addStatement("out[c] = v[c] / $L", JavaText.floatLiteral(ensemble.totalWeight()))
        .endControlFlow()
        .build());
  }

  /** {@code private static float[] scores(<inputs>)} with its javadoc, before its body. */
  static MethodSpec.Builder scoresStart(TreeEnsemble ensemble, InputAccess input) {
    MethodSpec.Builder scores = MethodSpec.methodBuilder("scores")
        .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
        .returns(ArrayTypeName.of(TypeName.FLOAT))
        .addJavadoc("$L\n\n", ClassScaffold.memberDoc("Adds each tree's weight to the score of "
            + "the class it returns, tree by tree in order."));
    addInputDoc(scores, input);
    scores.addJavadoc("@return the score of each class\n");
    input.addParameters(scores);
    return scores.addStatement("float[] out = new float[$L]", ensemble.schema().classCount());
  }

  /**
   * Adds {@code scores} with one statement per tree, {@code out[<tree call>] += weight}; when the
   * statements would pass the bytecode cap they go to {@code votes0, votes1, ...} methods that
   * {@code scores} calls in order.
   *
   * @param treeCall the expression that returns tree {@code t}'s class
   * @return how many helper methods were added besides {@code scores}
   */
  static int addUnrolledScores(TypeSpec.Builder type, TreeEnsemble ensemble, InputAccess input,
      int cap, IntFunction<CodeBlock> treeCall) {
    int trees = ensemble.treeCount();
    // aload out, the inputs, invokestatic, dup2, faload, ldc_w, fadd, fastore (JVMS 6.5).
    int voteBytes = input.callBytes() + 8;
    int perMethod = Math.max(1, (cap - SCORES_BYTES) / voteBytes);
    MethodSpec.Builder scores = scoresStart(ensemble, input);
    if (trees <= perMethod) {
      for (int t = 0; t < trees; t++) {
        scores.addStatement("out[$L] += $L", treeCall.apply(t), weight(ensemble, t));
      }
      type.addMethod(scores.addStatement("return out").build());
      return 0;
    }
    int chunks = (trees + perMethod - 1) / perMethod;
    if (SCORES_BYTES + (long) chunks * (input.callBytes() + 1) > cap) {
      throw new EmitLimitException("max-method-bytes", String.format(Locale.ROOT,
          "the votes of %d trees need %d methods, whose calls do not fit a method of %d bytes",
          trees, chunks, cap), "give a larger --max-method-bytes, or use --layout table");
    }
    for (int k = 0; k < chunks; k++) {
      scores.addStatement("votes$L($L, out)", k, input.arguments());
    }
    type.addMethod(scores.addStatement("return out").build());
    for (int k = 0; k < chunks; k++) {
      int first = k * perMethod;
      int last = Math.min(trees, first + perMethod) - 1;
      MethodSpec.Builder votes = MethodSpec.methodBuilder("votes" + k)
          .addModifiers(Modifier.PRIVATE, Modifier.STATIC)
          .addJavadoc("$L\n\n", ClassScaffold.memberDoc("Adds the votes of trees " + first
              + " to " + last + " (a method of its own to keep methods under the bytecode cap)."));
      addInputDoc(votes, input);
      votes.addJavadoc("@param out the scores so far, by class\n");
      input.addParameters(votes);
      votes.addParameter(ArrayTypeName.of(TypeName.FLOAT), "out");
      for (int t = first; t <= last; t++) {
        votes.addStatement("out[$L] += $L", treeCall.apply(t), weight(ensemble, t));
      }
      type.addMethod(votes.build());
    }
    return chunks;
  }

  /**
   * For boosting, adds {@code WEIGHT} (per tree, the weight of its vote) and returns the static
   * initializer code that fills it; a forest's votes all weigh 1, so it needs none.
   */
  static CodeBlock addWeights(TypeSpec.Builder type, TreeEnsemble trees) {
    if (trees.kind() == TreeEnsemble.Kind.FOREST) {
      return CodeBlock.of("");
    }
    type.addField(FieldSpec.builder(ArrayTypeName.of(TypeName.FLOAT), "WEIGHT",
            Modifier.PRIVATE, Modifier.STATIC, Modifier.FINAL)
        .addJavadoc("$L\n", "Per tree: the weight of its vote.")
        .initializer("new $T[$L]", TypeName.FLOAT, trees.treeCount())
        .build());
    PackedInts bits = new PackedInts();
    for (int t = 0; t < trees.treeCount(); t++) {
      bits.addFloat(trees.weight(t));
    }
    return CodeBlock.builder()
        .add("// The tree weights as IEEE 754 bits.\n")
        .addStatement("int[] weights = $L", StringTable.unpack(bits))
        .beginControlFlow("for (int t = 0; t < $L; t++)", trees.treeCount())
        .addStatement("WEIGHT[t] = Float.intBitsToFloat(weights[t])")
        .endControlFlow()
        .build();
  }

  /**
   * Adds {@code scores}: a loop over the trees j in order that adds {@code 1f} (forest) or {@code
   * WEIGHT[j]} to the score of the class {@code leaf(x, <tree>)} returns.
   *
   * @param tree how {@code leaf} is told tree j: {@code j} itself or where it starts
   */
  static void addLoopedScores(TypeSpec.Builder type, TreeEnsemble trees, InputAccess input,
      String tree) {
    MethodSpec.Builder scores = loopedStart(trees, input);
    addVoteLoop(scores, trees, "leaf", tree);
    type.addMethod(scores.addStatement("return out").build());
  }

  /**
   * Adds {@code scores} as {@link #addLoopedScores} does, with one test of the row before the
   * trees instead of one in each: a row for which {@code test} holds takes {@code walkIf(x, j)},
   * any other {@code walkElse(x, j)}.
   */
  static void addTestedScores(TypeSpec.Builder type, TreeEnsemble trees, InputAccess input,
      String test, String walkIf, String walkElse) {
    MethodSpec.Builder scores = loopedStart(trees, input)
        .addCode("// One test of the row serves every tree.\n")
        .beginControlFlow("if ($L)", test);
    addVoteLoop(scores, trees, walkIf, "j");
    scores.nextControlFlow("else");
    addVoteLoop(scores, trees, walkElse, "j");
    type.addMethod(scores.endControlFlow().addStatement("return out").build());
  }

  private static MethodSpec.Builder loopedStart(TreeEnsemble trees, InputAccess input) {
    MethodSpec.Builder scores = scoresStart(trees, input);
    if (input.named()) {
      scores.addStatement("$T[] x = $L", input.elementType(), input.asArray());
    }
    return scores;
  }

  private static void addVoteLoop(MethodSpec.Builder scores, TreeEnsemble trees, String walk,
      String tree) {
    boolean forest = trees.kind() == TreeEnsemble.Kind.FOREST;
    scores.beginControlFlow("for (int j = 0; j < $L; j++)", trees.treeCount())
        .addStatement("out[$L(x, $L)] += $L", walk, tree, forest ? "1f" : "WEIGHT[j]")
        .endControlFlow();
  }

  /** The literal of tree {@code t}'s weight. */
  static String weight(TreeEnsemble ensemble, int t) {
    return JavaText.floatLiteral(ensemble.weight(t));
  }

  static void addInputDoc(MethodSpec.Builder method, InputAccess input) {
    if (input.named()) {
      for (String name : input.parameterNames()) {
        method.addJavadoc("@param $L as for {@link #classify}\n", name);
      }
    } else {
      method.addJavadoc("@param x the feature values, as for {@link #classify}\n");
    }
  }
}
