package dev.splitwright.data;

import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import org.apache.commons.csv.CSVRecord;

/**
 * Loads a training file in two streaming passes: the first decides each column's kind and counts
 * the rows, the second fills one exactly sized float array per column.
 */
final class TwoPassLoad {
  private TwoPassLoad() {}

  static LoadedData load(Path file, LoadOptions options) throws InputException {
    return fill(file, options, survey(file, options));
  }

  /** What the first pass learned. */
  private record Survey(
      List<String> header,
      int target,
      boolean[] categorical,
      long rows,
      long bytes,
      String sha256) {}

  /** First-pass state of one column. */
  private static final class ColumnSurvey {
    final boolean forcedCategorical;
    final boolean forcedNumeric;
    boolean sawText;
    CellText.Kind firstBadKind;
    SourcePosition firstBadAt;
    String firstBadText;

    ColumnSurvey(boolean forcedCategorical, boolean forcedNumeric) {
      this.forcedCategorical = forcedCategorical;
      this.forcedNumeric = forcedNumeric;
    }

    boolean categorical() {
      return forcedCategorical || sawText;
    }
  }

  private static Survey survey(Path file, LoadOptions options) throws InputException {
    MessageDigest digest = LoadRules.sha256();
    try (CsvRows rows = CsvRows.open(file, digest)) {
      List<String> header = rows.readHeader();
      int target = LoadRules.resolveTarget(rows.fileName(), header, options);
      LoadRules.checkDeclaredColumns(rows.fileName(), header, target, options);
      ColumnSurvey[] columns = new ColumnSurvey[header.size()];
      for (int c = 0; c < columns.length; c++) {
        columns[c] =
            new ColumnSurvey(
                options.categoricalColumns().contains(header.get(c)),
                options.numericColumns().contains(header.get(c)));
      }
      long count = 0;
      for (CSVRecord record = rows.nextRow(); record != null; record = rows.nextRow()) {
        if (++count > LoadRules.MAX_ROWS) {
          throw LoadRules.tooManyRows(rows);
        }
        for (int c = 0; c < columns.length; c++) {
          String text = record.get(c).trim();
          if (c == target) {
            LoadRules.requireLabel(rows, c, text, options, header, record.get(0).trim());
          } else if (!columns[c].categorical() && !options.isMissing(text)) {
            surveyCell(rows, c, text, columns[c]);
          }
        }
      }
      rows.finish();
      if (count == 0) {
        throw LoadRules.headerOnly(rows.fileName());
      }
      boolean[] categorical = new boolean[columns.length];
      SourcePosition firstBadAt = null;
      ColumnSurvey firstBad = null;
      for (int c = 0; c < columns.length; c++) {
        categorical[c] = columns[c].categorical();
        ColumnSurvey s = columns[c];
        if (!categorical[c]
            && c != target
            && s.firstBadAt != null
            && (firstBadAt == null || s.firstBadAt.line() < firstBadAt.line())) {
          firstBadAt = s.firstBadAt;
          firstBad = s;
        }
      }
      if (firstBad != null) {
        throw CellText.numericCellError(
            firstBad.firstBadKind, firstBadAt, firstBad.firstBadText, false);
      }
      String sha = HexFormat.of().formatHex(digest.digest());
      return new Survey(header, target, categorical, count, rows.bytesRead(), sha);
    }
  }

  private static void surveyCell(CsvRows rows, int c, String text, ColumnSurvey column)
      throws InputException {
    CellText.Kind kind = CellText.classify(text);
    if (kind == CellText.Kind.NUMBER) {
      return;
    }
    if (column.forcedNumeric) {
      throw CellText.numericCellError(kind, rows.cell(c), text, true);
    }
    if (kind == CellText.Kind.TEXT) {
      // The column is categorical; odd number syntax in it is then just a category name.
      column.sawText = true;
    } else if (column.firstBadAt == null) {
      column.firstBadKind = kind;
      column.firstBadAt = rows.cell(c);
      column.firstBadText = text;
    }
  }

  private static LoadedData fill(Path file, LoadOptions options, Survey survey)
      throws InputException {
    int width = survey.header().size();
    int rowCount = (int) survey.rows();
    int[] featureOf = new int[width];
    float[][] columns = new float[width - 1][];
    CodeBook[] categories = new CodeBook[width];
    for (int c = 0, f = 0; c < width; c++) {
      if (c == survey.target()) {
        featureOf[c] = -1;
        continue;
      }
      featureOf[c] = f;
      columns[f++] = new float[rowCount];
      if (survey.categorical()[c]) {
        categories[c] = new CodeBook();
      }
    }
    int[] labels = new int[rowCount];
    CodeBook classes = new CodeBook();
    try (CsvRows rows = CsvRows.open(file, null)) {
      if (!rows.readHeader().equals(survey.header())) {
        throw LoadRules.changedWhileReading(rows.fileName());
      }
      int row = 0;
      for (CSVRecord record = rows.nextRow(); record != null; record = rows.nextRow()) {
        if (row == rowCount) {
          throw LoadRules.changedWhileReading(rows.fileName());
        }
        for (int c = 0; c < width; c++) {
          String text = record.get(c).trim();
          if (c == survey.target()) {
            LoadRules.requireLabel(rows, c, text, options, survey.header(),
                record.get(0).trim());
            labels[row] = classes.code(text);
            if (classes.size() > CsvLoader.MAX_CLASSES) {
              throw new InputException(
                  rows.cell(c),
                  "more than " + CsvLoader.MAX_CLASSES + " distinct class labels",
                  "choose a target column with fewer classes");
            }
          } else if (options.isMissing(text)) {
            columns[featureOf[c]][row] = Float.NaN;
          } else if (categories[c] != null) {
            columns[featureOf[c]][row] = categories[c].code(text);
            if (categories[c].size() > CsvLoader.MAX_CATEGORIES) {
              throw new InputException(
                  rows.cell(c),
                  "more than "
                      + CsvLoader.MAX_CATEGORIES
                      + " distinct values in a categorical column",
                  "drop identifier-like columns; declare the column numeric if it holds numbers");
            }
          } else {
            if (!CellText.isPlainDecimal(text, text.length())) {
              throw LoadRules.changedWhileReading(rows.fileName());
            }
            columns[featureOf[c]][row] = CellText.parse(text);
          }
        }
        row++;
      }
      rows.finish();
      if (row != rowCount || rows.bytesRead() != survey.bytes()) {
        throw LoadRules.changedWhileReading(rows.fileName());
      }
    }
    List<Feature> features = new ArrayList<>(width - 1);
    for (int c = 0; c < width; c++) {
      if (c == survey.target()) {
        continue;
      }
      String name = survey.header().get(c);
      if (categories[c] == null) {
        features.add(Feature.numeric(name));
      } else {
        recode(columns[featureOf[c]], categories[c].finalCodes());
        features.add(Feature.categorical(name, categories[c].sortedValues()));
      }
    }
    int[] classCodes = classes.finalCodes();
    for (int r = 0; r < labels.length; r++) {
      labels[r] = classCodes[labels[r]];
    }
    Schema schema =
        new Schema(features, survey.header().get(survey.target()), classes.sortedValues());
    return new LoadedData(
        Dataset.wrap(schema, columns, labels),
        LoadRules.sourceName(file),
        survey.sha256(),
        survey.rows());
  }

  private static void recode(float[] column, int[] finalCodes) {
    for (int r = 0; r < column.length; r++) {
      if (!Float.isNaN(column[r])) {
        column[r] = finalCodes[(int) column[r]];
      }
    }
  }
}
