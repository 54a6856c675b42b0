package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.CodeBlock;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.TypeName;
import dev.splitwright.data.Schema;
import java.util.ArrayList;
import java.util.List;
import javax.lang.model.element.Modifier;

/**
 * Emits {@code classifyAll} for a single {@code flat} tree: many rows at once, {@link #LANES} of
 * them walked side by side, one level a step. One row's walk is a chain of loads, each waiting for
 * the last, and a loop of one-row calls overlaps little of the next row's chain with this one's.
 * Independent chains in one loop body keep the core busy; one level a step (rather than the
 * one-row walk's two) does a third fewer comparisons, which is what counts once the chains
 * overlap.
 *
 * <p>A finite row's walk also notes, from the values it reads, whether any of them was missing
 * or infinite; only then does the group go through {@code classify} again. A value off the path
 * cannot change the leaf, so reading the path is enough, and it costs less than testing every
 * feature of every row first.
 */
final class FlatBatchWriter {
  /**
   * Rows walked side by side. Scratch timings on 2026-12-04 (AMD EPYC family 26), ns a row with
   * one level a step, pump demo tree / bench depth-14 tree: four lanes 12.4 / 32.2, six 12.5 /
   * 29.0, eight 10.8 / 23.2, twelve 10.8 / 24.5, sixteen 11.2 / 25.1. The two-level step of the
   * one-row walk took 12.3 / 28.9 with four lanes and 30.3 on the deep tree with eight (more live
   * values than registers).
   */
  static final int LANES = 8;

  /**
   * Upper bound of the method's bytecode bytes. Measured: 999 for double input with
   * probabilities, the largest shape, and 973 for float ({@code FlatBatchTest} holds the bound).
   * In a class of more than 256 constants a float method's 24 {@code int} constants may each take
   * {@code ldc_w}, a byte longer than {@code ldc} (JVMS §6.5): 997. A class whose cap is lower
   * does not get the method.
   */
  static final int MAX_BYTES = 1024;

  private final Schema schema;
  private final InputAccess input;
  private final LeafTable leaves;
  private final int depth;
  private final boolean finiteWalk;

  /**
   * @param finiteWalk whether finite rows are decided by subtraction (float and double input
   *     without categorical slots); then a group with a missing or infinite value on a path goes
   *     through {@code classify} row by row, else every step uses {@code right}
   */
  FlatBatchWriter(Schema schema, InputAccess input, LeafTable leaves, int depth,
      boolean finiteWalk) {
    this.schema = schema;
    this.input = input;
    this.leaves = leaves;
    this.depth = depth;
    this.finiteWalk = finiteWalk;
  }

  MethodSpec write() {
    TypeName row = ArrayTypeName.of(input.elementType());
    MethodSpec.Builder method = MethodSpec.methodBuilder(JavaEmitter.BATCH_METHOD)
        .addModifiers(Modifier.PUBLIC, Modifier.STATIC)
        .addJavadoc("Classifies every row as {@link #classify} does and writes the class indexes"
            + " to\n{@code out}: for a log or a buffer of readings. Rows are walked $L at a time,"
            + " so that\ntheir walks overlap, which a loop of {@code classify} calls cannot do as"
            + " well.\n\n", LANES)
        .addJavadoc("@param rows the inputs, each as for {@link #classify}\n"
            + "@param out receives the class index of {@code rows[r]} at {@code out[r]}; at least"
            + " as\n    long as {@code rows}\n"
            + "@throws IllegalArgumentException if {@code out} is shorter than {@code rows}, or a"
            + " row\n    does not hold $L values\n", schema.featureCount())
        .addParameter(ArrayTypeName.of(row), "rows")
        .addParameter(ArrayTypeName.of(TypeName.INT), "out");
    method.beginControlFlow("if (out.length < rows.length)")
        // String.concat, as in classify: no invokedynamic string concatenation.
        .addStatement("throw new IllegalArgumentException($W$S.concat(String.valueOf(out.length))"
            + "$W.concat($S).concat(String.valueOf(rows.length)).concat($S))", "out has ",
            " entries for ", " rows")
        .endControlFlow()
        .addStatement("int row = 0");
    if (depth > 0) {
      method.addCode(groups(row));
    }
    return method.beginControlFlow("for (; row < rows.length; row++)")
        .addStatement("out[row] = classify(rows[row])")
        .endControlFlow()
        .build();
  }

  /** The loop over whole groups of {@link #LANES} rows; the rows after the last group follow. */
  private CodeBlock groups(TypeName row) {
    CodeBlock.Builder code = CodeBlock.builder()
        .beginControlFlow("for (; row + $L <= rows.length; row += $L)", LANES, LANES);
    List<String> lengths = new ArrayList<>();
    for (int j = 0; j < LANES; j++) {
      code.addStatement("$T x$L = rows[$L]", row, j, at(j));
      lengths.add("(x" + j + ".length - " + schema.featureCount() + ")");
    }
    code.add("// A row of the wrong length is refused by classify.\n")
        .beginControlFlow("if ((" + String.join(" |$W", lengths) + ") != 0)")
        .add(oneByOne())
        .addStatement("continue")
        .endControlFlow();
    for (int j = 0; j < LANES; j++) {
      code.addStatement("int i$L = 0", j);
    }
    boolean dbl = input.kind() == InputKind.DOUBLE;
    if (finiteWalk) {
      code.addStatement("$L odd = 0", dbl ? "long" : "int");
    }
    code.beginControlFlow("for (int step = 0; step < $L; step++)", depth);
    for (int j = 0; j < LANES; j++) {
      String lane = "i" + j;
      if (finiteWalk) {
        String value = "v" + j;
        code.addStatement("$T $L = $L", input.elementType(), value,
                FlatWriter.valueAt("x" + j, lane))
            .addStatement("odd |= $L", FlatWriter.oddTerm(input.kind(), value))
            .addStatement("$L = 2 * $L + 1 + ($L)", lane, lane,
                FlatWriter.overTerm(input.kind(), lane, value));
      } else {
        code.addStatement("$L = 2 * $L + 1 + right(x$L, $L)", lane, lane, j, lane);
      }
    }
    code.endControlFlow();
    if (finiteWalk) {
      code.add("// A missing or infinite value on a path: classify takes the walk for those.\n")
          .beginControlFlow("if (odd < 0)")
          .add(oneByOne())
          .addStatement("continue")
          .endControlFlow();
    }
    for (int j = 0; j < LANES; j++) {
      CodeBlock slot = CodeBlock.of("LEAF[i$L - $L]", j, (1 << depth) - 1);
      code.addStatement("out[$L] = $L", at(j), leaves.classOf(slot));
    }
    return code.endControlFlow().build();
  }

  /** The group's rows through {@code classify}, one by one. */
  private static CodeBlock oneByOne() {
    CodeBlock.Builder code = CodeBlock.builder();
    for (int j = 0; j < LANES; j++) {
      code.addStatement("out[$L] = classify(x$L)", at(j), j);
    }
    return code.build();
  }

  /** The index of lane {@code j} in the group that starts at {@code row}. */
  private static String at(int j) {
    return j == 0 ? "row" : "row + " + j;
  }
}
