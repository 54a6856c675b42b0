package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * With {@code double[]} input the class must be the float model's class on {@code (float) x}. The
 * emitted threshold is the largest double that rounds to t or below; the verifier's double probes
 * sit at and beside the halfway points between t and its float neighbours, where rounding flips.
 */
class DoubleInputTest {
  private static final Verifier VERIFIER = Verifier.create().withRandomProbes(200);
  private static final ClassCounts COUNTS = ClassCounts.of(1, 1, 1);
  private static final Schema SCHEMA = new Schema(
      List.of(Feature.numeric("x"), Feature.categorical("mode", List.of("a", "b", "c"))),
      "y", List.of("low", "mid", "high"));

  /** Thresholds where rounding to float is easiest to get wrong (IEEE 754 binary32). */
  static List<Float> thresholds() {
    List<Float> values = new ArrayList<>(List.of(0.0f, -0.0f, 1.0f, -1.0f, 2.5f, 0.1f, -0.1f,
        Float.MIN_VALUE, -Float.MIN_VALUE, Float.MIN_NORMAL, Math.nextDown(Float.MIN_NORMAL),
        Float.MAX_VALUE, -Float.MAX_VALUE, Math.nextDown(Float.MAX_VALUE), 0x1p24f,
        Math.nextUp(0x1p24f), 0x1p-126f, 3.0f, 1.5f, 0.75f, 1e30f, -1e-30f,
        Float.POSITIVE_INFINITY, Float.NEGATIVE_INFINITY));
    SplittableRandom random = new SplittableRandom(11);
    for (int i = 0; i < 200; i++) {
      float t = Float.intBitsToFloat(random.nextInt());
      if (!Float.isNaN(t)) {
        values.add(t);
      }
    }
    return values;
  }

  /**
   * A chain: at each split go left to a leaf or right to the next threshold, so every threshold
   * is reached by inputs above all thresholds before it; the last split is categorical.
   */
  static DecisionTree chain(List<Float> thresholds) {
    Node node = new CategoricalSplit(1, CategoricalSplit.CodeSet.of(1), false,
        new Leaf(2, COUNTS), new Leaf(0, COUNTS), COUNTS);
    for (int i = thresholds.size() - 1; i >= 0; i--) {
      Leaf left = new Leaf((i + 1) % 3, COUNTS);
      node = new NumericSplit(0, thresholds.get(i), i % 2 == 0, left, node, COUNTS);
    }
    return new DecisionTree(SCHEMA, node);
  }

  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE"})
  void doubleInputAgreesWithTheFloatModelAtEveryRoundingBoundary(Layout layout)
      throws Exception {
    // Sorted, so each threshold is reachable: inputs above the previous ones go on to it.
    List<Float> sorted = new ArrayList<>(thresholds());
    sorted.sort(null);
    DecisionTree tree = chain(sorted);
    for (boolean named : new boolean[] {false, true}) {
      EmitOptions options = EmitOptions.builder("dbl", "Chain").layout(layout)
          .inputKind(InputKind.DOUBLE).namedArgs(named).build();

      VerificationResult result = VERIFIER.verify(tree,
          JavaEmitter.emit(tree, options, HeaderInfo.none()), options, List.of(), 2);

      assertThat(result.passed()).as(result.verdict()).isTrue();
      // Each numeric split gets 17 specials and 7 values around its halfway points.
      assertThat(result.inputsChecked()).isGreaterThan(24L * sorted.size());
    }
  }

  @Test
  void doubleProbesCatchAThresholdCopiedFromFloatThatFloatProbesMiss() throws Exception {
    DecisionTree tree = chain(List.of(2.5f));
    EmitOptions options = EmitOptions.builder("dbl", "Naive").inputKind(InputKind.DOUBLE).build();
    EmittedSource right = JavaEmitter.emit(tree, options, HeaderInfo.none());
    // 2.5 + 2^-23, halfway to the next float, rounds to 2.5f (ties to even): the float model
    // sends it left, a naive "x <= 2.5" right (worked by hand).
    assertThat(right.source()).contains("2.5000001192092896");
    EmittedSource naive = new EmittedSource(right.qualifiedName(), right.layout(),
        right.source().replace("2.5000001192092896", "2.5"));
    CompiledClasses compiled = VERIFIER.compiler().compileOne(naive.qualifiedName(),
        naive.source());

    VerificationResult result = VERIFIER.check(tree, compiled, naive, options, List.of(), 2);

    assertThat(result.passed()).isFalse();
    assertThat(result.firstMismatches()).allMatch(m -> m.startsWith("double input "));
    assertThat((float) 2.5000001192092896).isEqualTo(2.5f);
  }
}
