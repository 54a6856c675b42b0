package dev.splitwright.data;

/** How a feature column is read and split. */
public enum FeatureKind {
  /** Values are float32 numbers; splits compare against a threshold. */
  NUMERIC,
  /** Values are category codes 0..k-1 stored as floats; splits test set membership. */
  CATEGORICAL
}
