package dev.splitwright.cgen;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.verify.ProbeAccess;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Float input compared as IEEE 754 bit patterns: the model's answers without float operations. */
class CompareBitsTest {
  @TempDir
  Path dir;

  /**
   * Keys follow the float order (IEEE 754-2008 3.4 and 5.11, ordered comparisons): strictly
   * increasing along a sorted list of floats, the two zeros sharing one key as thresholds.
   */
  @Test
  void keysAreOrderedLikeTheFloatsAndBothZerosShareOne() {
    float[] sorted = {Float.NEGATIVE_INFINITY, -Float.MAX_VALUE, -1f, -Float.MIN_NORMAL,
        -Float.MIN_VALUE, 0f, Float.MIN_VALUE, Float.MIN_NORMAL, 0.1f, Math.nextUp(0.1f), 1f,
        Float.MAX_VALUE, Float.POSITIVE_INFINITY};
    for (int i = 1; i < sorted.length; i++) {
      assertThat(CFloatKeys.key(sorted[i])).as("key(%s) > key(%s)", sorted[i], sorted[i - 1])
          .isGreaterThan(CFloatKeys.key(sorted[i - 1]));
    }
    assertThat(CFloatKeys.key(-0.0f)).isEqualTo(CFloatKeys.key(0.0f)).isEqualTo(0x8000_0000L);
    // Worked by hand: -Infinity is 0xff800000, its complement 0x007fffff; +Infinity 0x7f800000
    // with the sign bit set is 0xff800000.
    assertThat(CFloatKeys.key(Float.NEGATIVE_INFINITY)).isEqualTo(0x007f_ffffL);
    assertThat(CFloatKeys.key(Float.POSITIVE_INFINITY)).isEqualTo(0xff80_0000L);
    assertThatIllegalArgumentException().isThrownBy(() -> CFloatKeys.key(Float.NaN));
    assertThatIllegalArgumentException().isThrownBy(() -> CEmitOptions.of("x")
        .withCompareBits(true).withInputKind(InputKind.INT));
  }

  static Stream<Arguments> variants() {
    List<Arguments> out = new ArrayList<>();
    for (int tree = 0; tree < HandTrees.all().size(); tree++) {
      for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
        for (boolean probabilities : List.of(false, true)) {
          out.add(Arguments.of(tree, layout, probabilities));
        }
      }
    }
    return out.stream();
  }

  /**
   * The hand trees hold thresholds of -0, the smallest subnormal and both infinities, both NaN
   * directions; the inputs add NaN with the sign bit set and other payloads, whose bits read as
   * integers lie beyond the infinities'.
   */
  @ParameterizedTest(name = "tree {0} {1} probabilities={2}")
  @MethodSource("variants")
  void handBuiltTreesGiveTheModelsAnswers(int treeIndex, Layout layout, boolean probabilities)
      throws IOException {
    assumeTrue(Gcc.available(), "gcc and g++ are needed to build emitted C");
    DecisionTree tree = HandTrees.all().get(treeIndex);
    CEmitOptions options = CEmitOptions.of("bits").withLayout(layout)
        .withProbabilities(probabilities).withCompareBits(true);
    List<float[]> inputs = new ArrayList<>(HandTrees.floatInputs(tree));
    inputs.addAll(ProbeAccess.floatProbes(tree, 11, 500));
    int features = tree.schema().featureCount();
    for (int nan : new int[] {0xffc0_0000, 0xff80_0001, 0x7f80_0001, 0xffff_ffff, 0x7fff_ffff}) {
      for (int f = 0; f < features; f++) {
        List<float[]> bases = HandTrees.floatInputs(tree);
        for (float[] base : bases.subList(0, Math.min(20, bases.size()))) {
          float[] x = base.clone();
          x[f] = Float.intBitsToFloat(nan);
          inputs.add(x);
        }
      }
    }
    COracle.Report report = COracle.checkFloats(dir, tree, options, inputs);
    assertThat(report.mismatches()).as(report.describe()).isZero();
  }
}
