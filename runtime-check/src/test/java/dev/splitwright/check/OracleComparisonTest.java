package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.assertThatIllegalStateException;
import static org.assertj.core.api.Assertions.assertThatNullPointerException;

import java.util.List;
import java.util.Optional;
import java.util.function.Function;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;

class OracleComparisonTest {

  private static final List<Integer> ZERO_TO_99 = IntStream.range(0, 100).boxed().toList();

  @Test
  void countsEveryMismatchButReportsOnlyTheFirstOnes() {
    Function<Integer, Integer> oracle = x -> x % 7;
    Function<Integer, Integer> candidate = x -> x % 10 == 3 ? -1 : x % 7;

    ComparisonResult<Integer, Integer> result =
        OracleComparison.compare(ZERO_TO_99, candidate, oracle, 3);

    // Inputs 3, 13, ..., 93 disagree: 10 of 100 (worked by hand).
    assertThat(result.checked()).isEqualTo(100);
    assertThat(result.mismatchCount()).isEqualTo(10);
    assertThat(result.passed()).isFalse();
    assertThat(result.firstMismatches())
        .containsExactly(
            new Mismatch<>(3, 3, 3, Optional.of(-1), Optional.empty()),
            new Mismatch<>(13, 13, 6, Optional.of(-1), Optional.empty()),
            new Mismatch<>(23, 23, 2, Optional.of(-1), Optional.empty()));
    assertThat(result.summary())
        .isEqualTo(
            """
            10 of 100 inputs disagree
            #3 3: expected 3 but got -1
            #13 13: expected 6 but got -1
            #23 23: expected 2 but got -1
            ... 7 more""");
  }

  @Test
  void candidateExceptionIsRecordedAsAMismatchAndTheRunGoesOn() {
    Function<Integer, Integer> oracle = x -> x;
    Function<Integer, Integer> candidate = x -> x * (x - 5) / (x - 5);

    ComparisonResult<Integer, Integer> result =
        OracleComparison.compare(ZERO_TO_99, candidate, oracle, 10);

    assertThat(result.checked()).isEqualTo(100);
    assertThat(result.mismatchCount()).isEqualTo(1);
    Mismatch<Integer, Integer> only = result.firstMismatches().get(0);
    assertThat(only.actual()).isEmpty();
    assertThat(only.error()).contains("java.lang.ArithmeticException: / by zero");
    assertThat(only.describe())
        .isEqualTo("#5 5: expected 5 but threw java.lang.ArithmeticException: / by zero");
  }

  @Test
  void identicalFunctionsPass() {
    ComparisonResult<Integer, Integer> result =
        OracleComparison.compare(ZERO_TO_99, x -> x * x, x -> x * x, 5);

    assertThat(result.passed()).isTrue();
    assertThat(result.firstMismatches()).isEmpty();
    assertThat(result.summary()).isEqualTo("0 of 100 inputs disagree");
  }

  @Test
  void emptyInputDoesNotPass() {
    ComparisonResult<Integer, Integer> result =
        OracleComparison.compare(List.of(), x -> x, x -> x, 5);

    assertThat(result.checked()).isZero();
    assertThat(result.passed()).isFalse();
    assertThat(result.summary()).isEqualTo("0 of 0 inputs disagree (no inputs were checked)");
  }

  @Test
  void floatsCompareByBitPattern() {
    // IEEE 754 gives NaN and the two zeros distinct meanings; Float.equals compares bit
    // patterns, so NaN matches NaN and 0.0f does not match -0.0f (Float.equals javadoc).
    List<Float> inputs = List.of(Float.NaN, 0.0f, 1.5f);

    ComparisonResult<Float, Float> result =
        OracleComparison.compare(inputs, x -> x == 0.0f ? -0.0f : x, x -> x, 5);

    assertThat(result.mismatchCount()).isEqualTo(1);
    assertThat(result.firstMismatches().get(0).describe())
        .isEqualTo("#1 0.0: expected 0.0 but got -0.0");
  }

  @Test
  void arraysCompareByContent() {
    List<float[]> inputs = List.of(new float[] {1f, 2f}, new float[] {3f, 4f});

    ComparisonResult<float[], float[]> result =
        OracleComparison.compare(
            inputs, x -> x[0] == 3f ? new float[] {x[1]} : x.clone(), float[]::clone, 5);

    assertThat(result.mismatchCount()).isEqualTo(1);
    assertThat(result.firstMismatches().get(0).describe())
        .isEqualTo("#1 [3.0, 4.0]: expected [3.0, 4.0] but got [4.0]");
  }

  @Test
  void candidateReturningNullIsAMismatch() {
    ComparisonResult<Integer, Integer> result =
        OracleComparison.compare(List.of(1), x -> null, x -> x, 5);

    assertThat(result.firstMismatches().get(0).describe())
        .isEqualTo("#0 1: expected 1 but got null");
  }

  @Test
  void oracleFailurePropagates() {
    assertThatIllegalStateException()
        .isThrownBy(
            () ->
                OracleComparison.compare(
                    List.of(1),
                    x -> x,
                    x -> {
                      throw new IllegalStateException("reference broken");
                    },
                    5))
        .withMessage("reference broken");
  }

  @Test
  void rejectsNullOracleResult() {
    assertThatNullPointerException()
        .isThrownBy(() -> OracleComparison.compare(List.of(1, 2), x -> x, x -> null, 5))
        .withMessage("oracle result for input #0");
  }

  @Test
  void rejectsNegativeReportLimit() {
    assertThatIllegalArgumentException()
        .isThrownBy(() -> OracleComparison.compare(List.of(1), x -> x, x -> x, -1))
        .withMessage("maxReported must be >= 0, but it is -1");
  }
}
