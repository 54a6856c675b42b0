package dev.splitwright.check;

import java.util.List;
import java.util.Objects;

/**
 * Outcome of {@link OracleComparison#compare}.
 *
 * @param checked number of inputs run through both functions
 * @param mismatchCount how many of them disagreed
 * @param firstMismatches the first disagreements in input order, at most the {@code maxReported}
 *     asked for
 */
public record ComparisonResult<I, R>(
    long checked, long mismatchCount, List<Mismatch<I, R>> firstMismatches) {

  public ComparisonResult {
    if (checked < 0 || mismatchCount < 0 || mismatchCount > checked) {
      throw new IllegalArgumentException(
          "need 0 <= mismatchCount <= checked, but they are " + mismatchCount + " and " + checked);
    }
    firstMismatches = List.copyOf(Objects.requireNonNull(firstMismatches, "firstMismatches"));
    if (firstMismatches.size() > mismatchCount) {
      throw new IllegalArgumentException(
          firstMismatches.size() + " mismatches reported but only " + mismatchCount + " counted");
    }
  }

  /**
   * Whether at least one input was checked and none disagreed. An empty comparison does not pass,
   * so a wiring mistake that feeds no inputs cannot look like success.
   */
  public boolean passed() {
    return checked > 0 && mismatchCount == 0;
  }

  /** A headline plus one line per reported mismatch. */
  public String summary() {
    StringBuilder out =
        new StringBuilder()
            .append(mismatchCount)
            .append(" of ")
            .append(checked)
            .append(" inputs disagree");
    if (checked == 0) {
      out.append(" (no inputs were checked)");
    }
    for (Mismatch<I, R> mismatch : firstMismatches) {
      out.append('\n').append(mismatch.describe());
    }
    if (firstMismatches.size() < mismatchCount) {
      out.append("\n... ").append(mismatchCount - firstMismatches.size()).append(" more");
    }
    return out.toString();
  }
}
