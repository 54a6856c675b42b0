package dev.splitwright.check;

import java.util.Arrays;
import java.util.Objects;
import java.util.Optional;

/**
 * One input on which the candidate disagreed with the oracle.
 *
 * @param index 0-based position of the input in the iteration order
 * @param input the input
 * @param expected what the oracle returned
 * @param actual what the candidate returned; empty if it threw or returned null
 * @param error the candidate's exception ({@code Throwable.toString()}), if it threw
 */
public record Mismatch<I, R>(
    long index, I input, R expected, Optional<R> actual, Optional<String> error) {

  public Mismatch {
    if (index < 0) {
      throw new IllegalArgumentException("index must be >= 0, but it is " + index);
    }
    Objects.requireNonNull(input, "input");
    Objects.requireNonNull(expected, "expected");
    Objects.requireNonNull(actual, "actual");
    Objects.requireNonNull(error, "error");
    if (actual.isPresent() && error.isPresent()) {
      throw new IllegalArgumentException("a candidate cannot both return and throw");
    }
  }

  /** One line, e.g. {@code #4 [1.5, 2.0]: expected 1 but got 2}. */
  public String describe() {
    String outcome =
        error.map(e -> "threw " + e).orElseGet(() -> "got " + text(actual.orElse(null)));
    return "#" + index + " " + text(input) + ": expected " + text(expected) + " but " + outcome;
  }

  private static String text(Object value) {
    // deepToString prints arrays, primitive ones included, by content.
    String wrapped = Arrays.deepToString(new Object[] {value});
    return wrapped.substring(1, wrapped.length() - 1);
  }
}
