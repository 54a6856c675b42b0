package dev.splitwright.eval;

import dev.splitwright.data.Dataset;
import java.util.Objects;

/**
 * One fold of k-fold cross-validation: the rows held out for validation and the rows to train on,
 * as ascending indices into {@code source}. The parts are copied out only when asked for, so that k
 * folds of a large data set do not hold k copies at once.
 */
public record Fold(Dataset source, int index, int[] trainRows, int[] validationRows) {

  public Fold {
    Objects.requireNonNull(source, "source");
    trainRows = Objects.requireNonNull(trainRows, "trainRows").clone();
    validationRows = Objects.requireNonNull(validationRows, "validationRows").clone();
    if (index < 0) {
      throw new IllegalArgumentException("index must be non-negative: " + index);
    }
    if (trainRows.length + validationRows.length != source.rows()) {
      throw new IllegalArgumentException("fold rows do not cover the source");
    }
  }

  /** Copies out the rows to train on. */
  public Dataset train() {
    return source.subset(trainRows);
  }

  /** Copies out the held-out rows. */
  public Dataset validation() {
    return source.subset(validationRows);
  }

  /** Returns a fresh copy of the training row indices. */
  @Override
  public int[] trainRows() {
    return trainRows.clone();
  }

  /** Returns a fresh copy of the held-out row indices. */
  @Override
  public int[] validationRows() {
    return validationRows.clone();
  }
}
