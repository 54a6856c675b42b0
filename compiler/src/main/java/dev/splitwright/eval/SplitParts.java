package dev.splitwright.eval;

import dev.splitwright.data.Dataset;
import java.util.Objects;

/**
 * A data set split into three disjoint parts that together cover every row. Each part keeps the
 * original row order; the {@code ...Rows} arrays give the original indices, ascending.
 */
public record SplitParts(
    Dataset train,
    Dataset validation,
    Dataset test,
    int[] trainRows,
    int[] validationRows,
    int[] testRows) {

  public SplitParts {
    Objects.requireNonNull(train, "train");
    Objects.requireNonNull(validation, "validation");
    Objects.requireNonNull(test, "test");
    trainRows = checked(trainRows, train, "trainRows");
    validationRows = checked(validationRows, validation, "validationRows");
    testRows = checked(testRows, test, "testRows");
  }

  private static int[] checked(int[] rows, Dataset part, String name) {
    Objects.requireNonNull(rows, name);
    if (rows.length != part.rows()) {
      throw new IllegalArgumentException(
          name + " has " + rows.length + " indices for " + part.rows() + " rows");
    }
    return rows.clone();
  }

  /** Returns a fresh copy of the original indices of the training rows. */
  @Override
  public int[] trainRows() {
    return trainRows.clone();
  }

  /** Returns a fresh copy of the original indices of the validation rows. */
  @Override
  public int[] validationRows() {
    return validationRows.clone();
  }

  /** Returns a fresh copy of the original indices of the test rows. */
  @Override
  public int[] testRows() {
    return testRows.clone();
  }
}
