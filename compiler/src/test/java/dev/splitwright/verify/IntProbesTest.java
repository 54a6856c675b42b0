package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class IntProbesTest {
  private static final ClassCounts COUNTS = ClassCounts.of(1, 1);
  private static final EmitOptions INT_OPTIONS =
      EmitOptions.builder("p", "C").inputKind(InputKind.INT).build();
  private static final Verifier VERIFIER = Verifier.create();

  private static Leaf leaf(int c) {
    return new Leaf(c, COUNTS);
  }

  @ParameterizedTest
  @CsvSource({
    // threshold, largest int n with (float) n <= threshold; worked by hand from JLS 5.1.2
    // (round to nearest, ties to even) and IEEE 754 float spacing (2 above 2^24, 128 above 2^31).
    "512.5, 512",
    "512, 512",
    "-0.5, -1",
    "0, 0",
    // 16777217 lies halfway between the floats 2^24 and 2^24 + 2 and rounds to the even 2^24.
    "16777216, 16777217",
    // 16777219 lies halfway between 2^24 + 2 and 2^24 + 4 and rounds to the even 2^24 + 4.
    "16777218, 16777218",
    "2147483648, 2147483647",
    // Floats below 2^31 in magnitude are 128 apart: -2^31 + 64 is a tie and rounds to even -2^31.
    "-2147483648, -2147483584",
  })
  void findsTheLastIntAtOrBelowAThreshold(float threshold, long expected) {
    assertThat(IntProbes.largestIntAtOrBelow(threshold)).isEqualTo(expected);
  }

  @Test
  void findsNoIntBelowTheIntRange() {
    assertThat(IntProbes.largestIntAtOrBelow(Float.NEGATIVE_INFINITY)).isEqualTo(IntProbes.NONE);
    assertThat(IntProbes.largestIntAtOrBelow(Math.nextDown(-0x1p31f))).isEqualTo(IntProbes.NONE);
    assertThat(IntProbes.largestIntAtOrBelow(Float.POSITIVE_INFINITY))
        .isEqualTo(Integer.MAX_VALUE);
  }

  @Test
  void boundaryIsTheLastIntConvertingAtOrBelowForRandomThresholds() {
    SplittableRandom random = new SplittableRandom(5);
    for (int i = 0; i < 10_000; i++) {
      float t = Float.intBitsToFloat(random.nextInt());
      if (Float.isNaN(t) || Math.abs(t) > 0x1p31f) {
        continue;
      }
      long n = IntProbes.largestIntAtOrBelow(t);
      assertThat((float) (int) n).isLessThanOrEqualTo(t);
      if (n < Integer.MAX_VALUE) {
        assertThat((float) (int) (n + 1)).isGreaterThan(t);
      }
    }
  }

  @Test
  void probesTakeEverySplitBothWaysInTheIntDomain() {
    Schema schema = new Schema(List.of(Feature.numeric("adc"), Feature.categorical("mode",
        List.of("eco", "boost", "off"))), "state", List.of("ok", "fault"));
    // adc <= 99.5 and then mode in {boost}, else adc <= 2^24 (rounding region).
    DecisionTree tree = new DecisionTree(schema, new NumericSplit(0, 99.5f, false,
        new CategoricalSplit(1, CategoricalSplit.CodeSet.of(1), true, leaf(1), leaf(0), COUNTS),
        new NumericSplit(0, 0x1p24f, false, leaf(0), leaf(1), COUNTS), COUNTS));
    Coverage coverage = new Coverage(tree);
    List<int[]> probes = IntProbes.of(tree);
    for (int[] x : probes) {
      coverage.record(EmittedClassifier.modelInput(x));
    }
    assertThat(coverage.covered()).isEqualTo(3);
    assertThat(probes).anySatisfy(x -> assertThat(x).containsExactly(16777217, 0))
        .anySatisfy(x -> assertThat(x).containsExactly(16777218, 0))
        .anySatisfy(x -> assertThat(x).containsExactly(Integer.MAX_VALUE, 0))
        .anySatisfy(x -> assertThat(x).containsExactly(99, -1))
        .anySatisfy(x -> assertThat(x).containsExactly(99, 3));
  }

  @Test
  void catchesAnIntThresholdOffByOneWhereFloatProbesCannot() throws Exception {
    Schema schema = new Schema(List.of(Feature.numeric("count")), "state", List.of("ok", "fault"));
    DecisionTree tree = new DecisionTree(schema,
        new NumericSplit(0, 0x1p24f, false, leaf(0), leaf(1), COUNTS));
    EmittedSource right = JavaEmitter.emit(tree, INT_OPTIONS, HeaderInfo.none());
    assertThat(right.source()).contains("x[0] <= 16777217");
    assertThat(VERIFIER.verify(tree, right, INT_OPTIONS, List.of(), 1).passed()).isTrue();

    // The naive floor(t): wrong only for 16777217, which no float can hold.
    EmittedSource naive = new EmittedSource(right.qualifiedName(), right.layout(),
        right.source().replace("x[0] <= 16777217", "x[0] <= 16777216"));
    VerificationResult result = VERIFIER.verify(tree, naive, INT_OPTIONS, List.of(), 1);
    assertThat(result.mismatches()).isEqualTo(1);
    assertThat(result.firstMismatches()).containsExactly(
        "int probe #1 [16777217]: expected 0 but got 1");
  }

  @Test
  void passesMissingCategoryOfADataRowAsMinusOne() throws Exception {
    Schema schema = new Schema(List.of(Feature.categorical("mode", List.of("eco", "boost"))),
        "state", List.of("ok", "fault"));
    DecisionTree tree = new DecisionTree(schema, new CategoricalSplit(0,
        CategoricalSplit.CodeSet.of(1), true, leaf(1), leaf(0), COUNTS));
    EmittedSource right = JavaEmitter.emit(tree, INT_OPTIONS, HeaderInfo.none());
    Dataset rows = Dataset.ofRows(schema, new float[][] {{Float.NaN}, {0f}}, new int[] {1, 0});
    assertThat(VERIFIER.verify(tree, right, INT_OPTIONS, List.of(rows), 1).passed()).isTrue();

    // Sending missing codes right instead of left must fail already on the data row.
    EmittedSource wrong = new EmittedSource(right.qualifiedName(), right.layout(),
        right.source().replace(", true)", ", false)"));
    assertThat(wrong.source()).isNotEqualTo(right.source());
    VerificationResult result = VERIFIER.verify(tree, wrong, INT_OPTIONS, List.of(rows), 1);
    assertThat(result.firstMismatches()).first().asString()
        .isEqualTo("#0 [NaN]: expected 1 but got 0");
  }

  @Test
  void verifiesIntClassifierWithMoreThanSixtyFourCategories() throws Exception {
    List<String> codes = new ArrayList<>();
    for (int i = 0; i < 70; i++) {
      codes.add(String.format(Locale.ROOT, "c%02d", i));
    }
    Schema schema = new Schema(List.of(Feature.categorical("site", codes)), "state",
        List.of("ok", "fault"));
    DecisionTree tree = new DecisionTree(schema, new CategoricalSplit(0,
        CategoricalSplit.CodeSet.of(3, 64, 69), false, leaf(1), leaf(0), COUNTS));
    EmittedSource source = JavaEmitter.emit(tree, INT_OPTIONS, HeaderInfo.none());
    assertThat(source.source()).contains("int code = v;");
    VerificationResult result = VERIFIER.verify(tree, source, INT_OPTIONS, List.of(), 1);
    assertThat(result.passed()).isTrue();
    assertThat(result.branchCoverage()).isEqualTo(1.0);
  }
}
