package dev.splitwright.model;

import java.util.Objects;

/**
 * Goes left when {@code x[feature] <= threshold} in float32; NaN goes to the side {@code
 * missingLeft} names. {@code -0.0f} and {@code 0.0f} compare equal, as IEEE 754 requires.
 */
public record NumericSplit(
    int feature, float threshold, boolean missingLeft, Node left, Node right, ClassCounts counts)
    implements Split {

  public NumericSplit {
    if (feature < 0) {
      throw new IllegalArgumentException("feature index must be non-negative: " + feature);
    }
    if (Float.isNaN(threshold)) {
      throw new IllegalArgumentException("threshold must not be NaN");
    }
    Objects.requireNonNull(left, "left");
    Objects.requireNonNull(right, "right");
    Objects.requireNonNull(counts, "counts");
  }

  @Override
  public boolean goesLeftPresent(float value) {
    return value <= threshold;
  }
}
