package dev.splitwright.model;

import java.util.Arrays;
import java.util.Objects;

/** Training rows of each class that reached a node. Immutable. */
public final class ClassCounts {
  private final int[] counts;

  private ClassCounts(int[] counts) {
    this.counts = counts;
  }

  /** Creates counts from a copy of {@code counts}; every entry must be non-negative. */
  public static ClassCounts of(int... counts) {
    for (int c : counts) {
      if (c < 0) {
        throw new IllegalArgumentException(
            "class counts must be non-negative: " + Arrays.toString(counts));
      }
    }
    return new ClassCounts(counts.clone());
  }

  public int classCount() {
    return counts.length;
  }

  public int get(int classIndex) {
    return counts[classIndex];
  }

  public int total() {
    int sum = 0;
    for (int c : counts) {
      sum += c;
    }
    return sum;
  }

  /** Returns a fresh copy of the counts. */
  public int[] toArray() {
    return counts.clone();
  }

  /** Returns the class with the most rows, the lowest index on ties. */
  public int majority() {
    int best = 0;
    for (int c = 1; c < counts.length; c++) {
      if (counts[c] > counts[best]) {
        best = c;
      }
    }
    return best;
  }

  /**
   * Returns the class with the largest weighted count {@code classWeights[c] * count(c)}, the
   * lowest index on ties: the class a leaf predicts under class weights.
   */
  public int weightedMajority(double[] classWeights) {
    Objects.requireNonNull(classWeights, "classWeights");
    if (classWeights.length != counts.length) {
      throw new IllegalArgumentException("expected " + counts.length + " class weights but got "
          + classWeights.length);
    }
    int best = 0;
    for (int c = 1; c < counts.length; c++) {
      if (classWeights[c] * counts[c] > classWeights[best] * counts[best]) {
        best = c;
      }
    }
    return best;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof ClassCounts other && Arrays.equals(counts, other.counts);
  }

  @Override
  public int hashCode() {
    return Arrays.hashCode(counts);
  }

  @Override
  public String toString() {
    return Arrays.toString(counts);
  }
}
