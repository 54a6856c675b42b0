package dev.splitwright.data;

import java.nio.file.Path;
import java.util.Objects;

/**
 * Reads a labelled CSV file (UTF-8, header row, RFC 4180 quoting) into a {@link Dataset}.
 *
 * <p>The file is streamed, never held as text: {@link #load} reads it twice, first to decide each
 * column's kind and count the rows, then to fill one exactly sized float array per column. Cells
 * are trimmed. Empty cells and the {@link LoadOptions#missingTokens} are missing values (NaN). A
 * column is categorical if declared so or if any non-missing cell is not a number; categories and
 * class labels are coded in sorted order, so the codes depend only on the file's contents.
 */
public final class CsvLoader {

  /** Most distinct class labels a target column may have. */
  public static final int MAX_CLASSES = 65_535;

  /** Most distinct values a categorical column may have; more suggests an identifier column. */
  public static final int MAX_CATEGORIES = 65_535;

  /**
   * Longest column name or class label, in characters. Both become string constants of the emitted
   * class, which the class file format caps at 65535 bytes (JVM Specification §4.4.7); far shorter
   * than that, a longer one is a misplaced data cell, not a name.
   */
  public static final int MAX_NAME_LENGTH = 1024;

  private CsvLoader() {}

  /**
   * Loads {@code file} with {@link LoadOptions#defaults()}.
   *
   * @throws InputException if the file cannot be read or is not a valid labelled table
   */
  public static LoadedData load(Path file) throws InputException {
    return load(file, LoadOptions.defaults());
  }

  /**
   * Loads a training file: the schema (column kinds, categories, class labels) comes from the file.
   *
   * @throws InputException if the file cannot be read, is not a valid labelled table, or an option
   *     names a column the file lacks
   */
  public static LoadedData load(Path file, LoadOptions options) throws InputException {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(options, "options");
    return TwoPassLoad.load(file, options);
  }

  /**
   * Loads a file to evaluate a model on, coded with the training {@code schema}: the header must
   * hold exactly the schema's feature columns and target, in any order. A category the training
   * data never showed loads as missing (NaN), which the tree routes like any missing value; an
   * unknown class label is an error, since no prediction could match it. Of {@code options} only
   * the missing-value tokens apply; a target or declared kind that contradicts {@code schema} is an
   * option error.
   *
   * @throws InputException if the file cannot be read, does not match the schema, or is malformed
   */
  public static LoadedData loadWithSchema(Path file, Schema schema, LoadOptions options)
      throws InputException {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(schema, "schema");
    Objects.requireNonNull(options, "options");
    return SchemaLoad.load(file, schema, options);
  }

  /**
   * Loads a field log to score a model on, exactly as {@link #loadWithSchema} does, and also counts
   * the rows holding a category the model never saw and the rows holding a missing cell.
   *
   * @throws InputException if the file cannot be read, does not match the schema, or is malformed
   */
  public static FieldLog loadFieldLog(Path file, Schema schema, LoadOptions options)
      throws InputException {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(schema, "schema");
    Objects.requireNonNull(options, "options");
    SchemaLoad.RowTally tally = new SchemaLoad.RowTally();
    LoadedData loaded = SchemaLoad.load(file, schema, options, tally);
    return new FieldLog(loaded, tally.unseenCategoryRows, tally.missingValueRows);
  }
}
