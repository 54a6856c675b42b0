package dev.splitwright.model;

import java.util.Arrays;
import java.util.Objects;

/**
 * Goes left when the category code {@code x[feature]} is one of {@code leftCodes}; a missing or
 * unseen code goes to the side {@code missingLeft} names.
 */
public record CategoricalSplit(
    int feature, CodeSet leftCodes, boolean missingLeft, Node left, Node right, ClassCounts counts)
    implements Split {

  public CategoricalSplit {
    if (feature < 0) {
      throw new IllegalArgumentException("feature index must be non-negative: " + feature);
    }
    Objects.requireNonNull(leftCodes, "leftCodes");
    Objects.requireNonNull(left, "left");
    Objects.requireNonNull(right, "right");
    Objects.requireNonNull(counts, "counts");
  }

  @Override
  public boolean goesLeftPresent(float value) {
    return leftCodes.contains((int) value);
  }

  /** A sorted set of distinct non-negative category codes. Immutable. */
  public static final class CodeSet {
    private final int[] codes;

    private CodeSet(int[] codes) {
      this.codes = codes;
    }

    /** Creates a set from codes in any order; duplicates and negatives are rejected. */
    public static CodeSet of(int... codes) {
      int[] sorted = codes.clone();
      Arrays.sort(sorted);
      for (int i = 0; i < sorted.length; i++) {
        if (sorted[i] < 0 || (i > 0 && sorted[i] == sorted[i - 1])) {
          throw new IllegalArgumentException(
              "codes must be distinct and non-negative: " + Arrays.toString(codes));
        }
      }
      return new CodeSet(sorted);
    }

    public boolean contains(int code) {
      return Arrays.binarySearch(codes, code) >= 0;
    }

    /** Returns the codes in ascending order (a fresh copy). */
    public int[] toArray() {
      return codes.clone();
    }

    public int size() {
      return codes.length;
    }

    @Override
    public boolean equals(Object o) {
      return o instanceof CodeSet other && Arrays.equals(codes, other.codes);
    }

    @Override
    public int hashCode() {
      return Arrays.hashCode(codes);
    }

    @Override
    public String toString() {
      return Arrays.toString(codes);
    }
  }
}
