package dev.splitwright.data;

import java.util.Objects;

/**
 * A field log loaded with a model's schema, with the rows the model could only treat as missing.
 * A row may count in both tallies.
 *
 * @param unseenCategoryRows rows with at least one category the model never saw (loaded as NaN,
 *     so the tree routes it like a missing value)
 * @param missingValueRows rows with at least one empty cell or missing-value token
 */
public record FieldLog(LoadedData loaded, long unseenCategoryRows, long missingValueRows) {

  public FieldLog {
    Objects.requireNonNull(loaded, "loaded");
    if (unseenCategoryRows < 0 || unseenCategoryRows > loaded.dataRows()
        || missingValueRows < 0 || missingValueRows > loaded.dataRows()) {
      throw new IllegalArgumentException("row tallies must lie between 0 and the row count");
    }
  }
}
