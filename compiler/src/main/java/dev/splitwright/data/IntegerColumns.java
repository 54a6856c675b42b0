package dev.splitwright.data;

import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import org.apache.commons.csv.CSVRecord;

/**
 * Checks that a data set can be fed to a classifier that takes {@code int} inputs: every numeric
 * cell present and a whole number within the {@code int} range. Categorical columns always pass:
 * their values are codes, and a missing category becomes an out-of-range code such as -1.
 *
 * <p>The check runs on the float32 values as loaded, so a cell like {@code 2.0000001} that rounds
 * to a whole float passes (the model itself only ever saw 2.0). A value up to 2^31 passes: it is
 * {@code (float) Integer.MAX_VALUE}.
 */
public final class IntegerColumns {
  private static final float INT_RANGE_END = 0x1p31f;

  private IntegerColumns() {}

  /**
   * Fails on the first offending cell in file order, naming its line, column and header.
   *
   * @param loaded the data as loaded from {@code file}
   * @param file the file it was loaded from; read again only to locate an offending cell
   * @param options the options it was loaded with
   * @throws InputException if a numeric cell is missing, not a whole number or out of range
   */
  public static void require(LoadedData loaded, Path file, LoadOptions options)
      throws InputException {
    Objects.requireNonNull(loaded, "loaded");
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(options, "options");
    Dataset data = loaded.dataset();
    int badRow = Integer.MAX_VALUE;
    int badFeature = -1;
    for (int f = 0; f < data.featureCount(); f++) {
      if (data.schema().feature(f).isCategorical()) {
        continue;
      }
      int row = firstBadRow(data, f, badRow);
      if (row < badRow) {
        badRow = row;
        badFeature = f;
      }
    }
    if (badFeature >= 0) {
      throw locate(file, options, data.schema().feature(badFeature).name(), badRow,
          data.value(badRow, badFeature));
    }
  }

  /** Whether {@code v} is a whole number an {@code int} input can stand for. */
  static boolean fits(float v) {
    return v == Math.rint(v) && v >= -INT_RANGE_END && v <= INT_RANGE_END;
  }

  /** The first row before {@code limit} whose value does not fit, or {@code limit}. */
  private static int firstBadRow(Dataset data, int feature, int limit) {
    int end = Math.min(limit, data.rows());
    for (int r = 0; r < end; r++) {
      if (!fits(data.value(r, feature))) {
        return r;
      }
    }
    return limit;
  }

  private static InputException locate(Path file, LoadOptions options, String column, int row,
      float value) throws InputException {
    try (CsvRows rows = CsvRows.open(file, null)) {
      List<String> header = rows.readHeader();
      int c = header.indexOf(column);
      CSVRecord record = rows.nextRow();
      for (int r = 0; r < row && record != null; r++) {
        record = rows.nextRow();
      }
      if (c < 0 || record == null) {
        throw LoadRules.changedWhileReading(rows.fileName());
      }
      String text = record.get(c).trim();
      return error(rows.cell(c), text, value, options.isMissing(text));
    }
  }

  private static InputException error(SourcePosition at, String text, float value,
      boolean missing) {
    String remedy = "drop --int-inputs, or ";
    if (missing) {
      return new InputException(at, "missing value, which an int input cannot express",
          remedy + "fill or remove the rows whose value is missing");
    }
    if (Float.isNaN(value) || value != Math.rint(value)) {
      return new InputException(at, InputException.quote(text)
          + " is not a whole number, as --int-inputs needs in numeric columns",
          remedy + "round or scale the column, or declare it with --categorical");
    }
    return new InputException(at, InputException.quote(text) + " is outside the int range",
        remedy + "scale the column into -2147483648..2147483647");
  }
}
