package dev.splitwright.check;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.function.Function;

/** Runs a candidate function and a trusted oracle on the same inputs and counts disagreements. */
public final class OracleComparison {

  private OracleComparison() {}

  /**
   * Compares {@code candidate} with {@code oracle} on every input, in iteration order.
   *
   * <p>Results are equal when {@link Objects#deepEquals} says so: boxed floating-point values
   * compare by bit pattern (NaN equals NaN, 0.0 differs from -0.0) and arrays by content. When the
   * candidate throws, that input is a mismatch with the exception recorded; the comparison goes on.
   * An exception from the oracle propagates, since the reference itself is then broken.
   *
   * @param maxReported how many mismatches to keep in {@link ComparisonResult#firstMismatches()};
   *     all are counted
   * @throws NullPointerException if an input is null or the oracle returns null
   * @throws IllegalArgumentException if {@code maxReported} is negative
   */
  public static <I, R> ComparisonResult<I, R> compare(
      Iterable<I> inputs,
      Function<? super I, ? extends R> candidate,
      Function<? super I, ? extends R> oracle,
      int maxReported) {
    Objects.requireNonNull(inputs, "inputs");
    Objects.requireNonNull(candidate, "candidate");
    Objects.requireNonNull(oracle, "oracle");
    if (maxReported < 0) {
      throw new IllegalArgumentException("maxReported must be >= 0, but it is " + maxReported);
    }
    long checked = 0;
    long mismatchCount = 0;
    List<Mismatch<I, R>> reported = new ArrayList<>();
    for (I input : inputs) {
      long index = checked++;
      Objects.requireNonNull(input, () -> "input #" + index);
      R expected = oracle.apply(input);
      Objects.requireNonNull(expected, () -> "oracle result for input #" + index);
      Optional<Mismatch<I, R>> mismatch = check(index, input, expected, candidate);
      if (mismatch.isPresent()) {
        mismatchCount++;
        if (reported.size() < maxReported) {
          reported.add(mismatch.get());
        }
      }
    }
    return new ComparisonResult<>(checked, mismatchCount, reported);
  }

  private static <I, R> Optional<Mismatch<I, R>> check(
      long index, I input, R expected, Function<? super I, ? extends R> candidate) {
    R actual;
    try {
      actual = candidate.apply(input);
    } catch (RuntimeException | StackOverflowError | LinkageError e) {
      // Generated code may also fail to link or recurse too deep; both are the candidate's fault.
      return Optional.of(
          new Mismatch<>(index, input, expected, Optional.empty(), Optional.of(e.toString())));
    }
    if (Objects.deepEquals(expected, actual)) {
      return Optional.empty();
    }
    return Optional.of(
        new Mismatch<>(index, input, expected, Optional.ofNullable(actual), Optional.empty()));
  }
}
