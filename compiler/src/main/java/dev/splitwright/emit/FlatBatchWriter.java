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
 * them walked side by side. One row's walk is a chain of loads, each waiting for the last; on a
 * deep tree whose arrays do not fit the first-level cache each link waits for the second level.
 * Four independent chains in one loop body let the core overlap those waits, which it cannot do
 * across the calls of a one-row loop once their instructions fill its window.
 */
final class FlatBatchWriter {
  /**
   * Rows walked side by side. Scratch timings on 2026-12-03, ns a row on the bench's depth-14
   * tree: one row at a time 51, two lanes 37, four 30, eight 31 (and on the pump tree eight lanes
   * took 26 against 14 for four: too many live values for the registers).
   */
  static final int LANES = 4;

  /**
   * Upper bound of the method's bytecode bytes: 601 measured for an odd depth with probabilities
   * and 30 features, which is the largest shape ({@code FlatBatchTest} holds the bound). A class
   * whose cap is lower does not get the method.
   */
  static final int MAX_BYTES = 768;

  private final Schema schema;
  private final InputAccess input;
  private final LeafTable leaves;
  private final int depth;
  private final boolean finiteWalk;

  /**
   * @param finiteWalk whether the class has the finite rows' walk ({@code over}, {@code special});
   *     then a group with a missing or infinite value goes through {@code classify} row by row
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
            + " so that\ntheir table loads overlap, which a loop of {@code classify} calls cannot"
            + " do as well\non a tree whose tables outgrow the first-level cache.\n\n", LANES)
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
    List<String> specials = new ArrayList<>();
    for (int j = 0; j < LANES; j++) {
      code.addStatement("$T x$L = rows[$L]", row, j, at(j));
      lengths.add("(x" + j + ".length - " + schema.featureCount() + ")");
      specials.add("special(x" + j + ")");
    }
    // $W lets the condition wrap between its terms.
    String odd = "(" + String.join(" |$W", lengths) + ") != 0";
    if (finiteWalk) {
      odd += "$W|| (" + String.join(" |$W", specials) + ") < 0";
    }
    code.add("// A row of the wrong length is refused by classify; with a missing or infinite\n"
            + "// value it takes classify's other walk.\n")
        .beginControlFlow("if (" + odd + ")");
    for (int j = 0; j < LANES; j++) {
      code.addStatement("out[$L] = classify(x$L)", at(j), j);
    }
    code.addStatement("continue").endControlFlow();
    for (int j = 0; j < LANES; j++) {
      code.addStatement("int i$L = 0", j);
    }
    String decide = finiteWalk ? "over" : "right";
    if (depth >= 2) {
      code.beginControlFlow("for (int step = 0; step < $L; step++)", depth / 2);
      for (int j = 0; j < LANES; j++) {
        code.addStatement("int r$L = $L(x$L, i$L)", j, decide, j, j)
            .addStatement("int b$L = $L(x$L, 2 * i$L + 1)", j, decide, j, j)
            .addStatement("int c$L = $L(x$L, 2 * i$L + 2)", j, decide, j, j);
      }
      code.add("// As in the one-row walk: grandchild 4i + 3 + 2r + (c if r, else b).\n");
      for (int j = 0; j < LANES; j++) {
        code.addStatement("i$L = 4 * i$L + 3 + 2 * r$L + (b$L ^ ((b$L ^ c$L) & -r$L))",
            j, j, j, j, j, j, j);
      }
      code.endControlFlow();
    }
    if (depth % 2 == 1) {
      for (int j = 0; j < LANES; j++) {
        code.addStatement("i$L = 2 * i$L + 1 + $L(x$L, i$L)", j, j, decide, j, j);
      }
    }
    for (int j = 0; j < LANES; j++) {
      CodeBlock slot = CodeBlock.of("LEAF[i$L - $L]", j, (1 << depth) - 1);
      code.addStatement("out[$L] = $L", at(j), leaves.classOf(slot));
    }
    return code.endControlFlow().build();
  }

  /** The index of lane {@code j} in the group that starts at {@code row}. */
  private static String at(int j) {
    return j == 0 ? "row" : "row + " + j;
  }
}
