package dev.splitwright.data;

import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeSet;
import org.apache.commons.csv.CSVRecord;

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

  // Java arrays cannot be much longer than this.
  private static final long MAX_ROWS = Integer.MAX_VALUE - 8;

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
    Survey survey = survey(file, options);
    return fill(file, options, survey);
  }

  /** What the first pass learned. */
  private record Survey(
      List<String> header, int target, boolean[] categorical, long rows, long bytes, String sha256) {}

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
    MessageDigest digest = sha256();
    try (CsvRows rows = CsvRows.open(file, digest)) {
      List<String> header = rows.readHeader();
      int target = resolveTarget(rows.fileName(), header, options);
      checkDeclaredColumns(rows.fileName(), header, target, options);
      ColumnSurvey[] columns = new ColumnSurvey[header.size()];
      for (int c = 0; c < columns.length; c++) {
        columns[c] =
            new ColumnSurvey(
                options.categoricalColumns().contains(header.get(c)),
                options.numericColumns().contains(header.get(c)));
      }
      long count = 0;
      for (CSVRecord record = rows.nextRow(); record != null; record = rows.nextRow()) {
        if (++count > MAX_ROWS) {
          throw new InputException(
              SourcePosition.ofLine(rows.fileName(), rows.line()),
              "more than " + MAX_ROWS + " data rows",
              "split the file");
        }
        for (int c = 0; c < columns.length; c++) {
          String text = record.get(c).trim();
          if (c == target) {
            requireLabel(rows, c, text, options);
          } else if (!columns[c].categorical() && !options.isMissing(text)) {
            surveyCell(rows, c, text, columns[c]);
          }
        }
      }
      rows.finish();
      if (count == 0) {
        throw headerOnly(rows.fileName());
      }
      boolean[] categorical = new boolean[columns.length];
      SourcePosition firstBadAt = null;
      ColumnSurvey firstBad = null;
      for (int c = 0; c < columns.length; c++) {
        categorical[c] = columns[c].categorical();
        ColumnSurvey s = columns[c];
        if (!categorical[c] && c != target && s.firstBadAt != null
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
        throw changedWhileReading(rows.fileName());
      }
      int row = 0;
      for (CSVRecord record = rows.nextRow(); record != null; record = rows.nextRow()) {
        if (row == rowCount) {
          throw changedWhileReading(rows.fileName());
        }
        for (int c = 0; c < width; c++) {
          String text = record.get(c).trim();
          if (c == survey.target()) {
            requireLabel(rows, c, text, options);
            labels[row] = classes.code(text);
            if (classes.size() > MAX_CLASSES) {
              throw new InputException(
                  rows.cell(c),
                  "more than " + MAX_CLASSES + " distinct class labels",
                  "choose a target column with fewer classes");
            }
          } else if (options.isMissing(text)) {
            columns[featureOf[c]][row] = Float.NaN;
          } else if (categories[c] != null) {
            columns[featureOf[c]][row] = categories[c].code(text);
            if (categories[c].size() > MAX_CATEGORIES) {
              throw new InputException(
                  rows.cell(c),
                  "more than " + MAX_CATEGORIES + " distinct values in a categorical column",
                  "drop identifier-like columns; declare the column numeric if it holds numbers");
            }
          } else {
            if (!CellText.isPlainDecimal(text, text.length())) {
              throw changedWhileReading(rows.fileName());
            }
            columns[featureOf[c]][row] = CellText.parse(text);
          }
        }
        row++;
      }
      rows.finish();
      if (row != rowCount || rows.bytesRead() != survey.bytes()) {
        throw changedWhileReading(rows.fileName());
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
        Dataset.wrap(schema, columns, labels), sourceName(file), survey.sha256(), survey.rows());
  }

  private static void recode(float[] column, int[] finalCodes) {
    for (int r = 0; r < column.length; r++) {
      if (!Float.isNaN(column[r])) {
        column[r] = finalCodes[(int) column[r]];
      }
    }
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
    checkAgainstSchema(schema, options);
    MessageDigest digest = sha256();
    try (CsvRows rows = CsvRows.open(file, digest)) {
      List<String> header = rows.readHeader();
      int[] featureOf = mapColumns(rows.fileName(), header, schema);
      int target = header.indexOf(schema.target());
      List<Map<String, Integer>> categoryCodes = new ArrayList<>();
      for (Feature feature : schema.features()) {
        Map<String, Integer> codes = new HashMap<>();
        for (int k = 0; k < feature.categories().size(); k++) {
          codes.put(feature.categories().get(k), k);
        }
        categoryCodes.add(codes);
      }
      Map<String, Integer> classCodes = new HashMap<>();
      for (int k = 0; k < schema.classCount(); k++) {
        classCodes.put(schema.classes().get(k), k);
      }
      FloatColumn[] columns = new FloatColumn[schema.featureCount()];
      for (int f = 0; f < columns.length; f++) {
        columns[f] = new FloatColumn();
      }
      IntColumn labels = new IntColumn();
      long count = 0;
      for (CSVRecord record = rows.nextRow(); record != null; record = rows.nextRow()) {
        if (++count > MAX_ROWS) {
          throw new InputException(
              SourcePosition.ofLine(rows.fileName(), rows.line()),
              "more than " + MAX_ROWS + " data rows",
              "split the file");
        }
        for (int c = 0; c < header.size(); c++) {
          String text = record.get(c).trim();
          if (c == target) {
            requireLabel(rows, c, text, options);
            Integer code = classCodes.get(text);
            if (code == null) {
              throw new InputException(
                  rows.cell(c),
                  "unknown class label " + InputException.quote(text),
                  "the model knows only " + String.join(", ", schema.classes()));
            }
            labels.add(code);
            continue;
          }
          int f = featureOf[c];
          if (options.isMissing(text)) {
            columns[f].add(Float.NaN);
          } else if (schema.feature(f).isCategorical()) {
            Integer code = categoryCodes.get(f).get(text);
            columns[f].add(code == null ? Float.NaN : code);
          } else {
            CellText.Kind kind = CellText.classify(text);
            if (kind != CellText.Kind.NUMBER) {
              throw CellText.numericCellError(kind, rows.cell(c), text, false);
            }
            columns[f].add(CellText.parse(text));
          }
        }
      }
      rows.finish();
      if (count == 0) {
        throw headerOnly(rows.fileName());
      }
      float[][] values = new float[columns.length][];
      for (int f = 0; f < columns.length; f++) {
        values[f] = columns[f].toArray();
      }
      return new LoadedData(
          Dataset.wrap(schema, values, labels.toArray()),
          sourceName(file),
          HexFormat.of().formatHex(digest.digest()),
          count);
    }
  }

  /** Maps file columns to schema features; -1 for the target. */
  private static int[] mapColumns(String fileName, List<String> header, Schema schema)
      throws InputException {
    List<String> expected = new ArrayList<>(schema.featureNames());
    expected.add(schema.target());
    TreeSet<String> absent = new TreeSet<>(expected);
    header.forEach(absent::remove);
    if (!absent.isEmpty()) {
      throw new InputException(
          SourcePosition.ofLine(fileName, 1),
          "missing " + (absent.size() == 1 ? "column " : "columns ") + quoteAll(absent),
          "the model was trained on " + String.join(", ", expected));
    }
    int[] featureOf = new int[header.size()];
    for (int c = 0; c < header.size(); c++) {
      String name = header.get(c);
      if (name.equals(schema.target())) {
        featureOf[c] = -1;
      } else {
        featureOf[c] = schema.featureNames().indexOf(name);
        if (featureOf[c] < 0) {
          throw new InputException(
              SourcePosition.ofCell(fileName, 1, c + 1, ""),
              "column " + InputException.quote(name) + " is not one the model was trained on",
              "remove the column; the model was trained on " + String.join(", ", expected));
        }
      }
    }
    return featureOf;
  }

  private static void checkAgainstSchema(Schema schema, LoadOptions options)
      throws InputException {
    if (options.target().isPresent() && !options.target().get().equals(schema.target())) {
      throw new InputException(
          LoadOptions.OPTION_TARGET,
          "the model's target column is " + InputException.quote(schema.target())
              + ", not " + InputException.quote(options.target().get()),
          "leave the option out or name " + InputException.quote(schema.target()));
    }
    for (Feature feature : schema.features()) {
      if (feature.isCategorical() && options.numericColumns().contains(feature.name())) {
        throw kindContradiction(LoadOptions.OPTION_NUMERIC, feature.name(), "categorical");
      }
      if (!feature.isCategorical() && options.categoricalColumns().contains(feature.name())) {
        throw kindContradiction(LoadOptions.OPTION_CATEGORICAL, feature.name(), "numeric");
      }
    }
  }

  private static InputException kindContradiction(String option, String column, String kind) {
    return new InputException(
        option,
        "the model was trained with " + InputException.quote(column) + " as a " + kind + " column",
        "leave the option out when loading data for this model");
  }

  private static int resolveTarget(String fileName, List<String> header, LoadOptions options)
      throws InputException {
    if (header.size() < 2) {
      throw new InputException(
          SourcePosition.ofLine(fileName, 1),
          "the header names only one column",
          "a labelled table needs at least one feature column and a target column");
    }
    if (options.target().isEmpty()) {
      return header.size() - 1;
    }
    String target = options.target().get();
    if (target.isEmpty()) {
      throw new InputException(
          LoadOptions.OPTION_TARGET, "blank column name", "name the class-label column");
    }
    int index = header.indexOf(target);
    if (index < 0) {
      throw unknownColumn(LoadOptions.OPTION_TARGET, fileName, target, header);
    }
    return index;
  }

  private static void checkDeclaredColumns(
      String fileName, List<String> header, int target, LoadOptions options)
      throws InputException {
    for (String name : options.categoricalColumns()) {
      checkDeclared(LoadOptions.OPTION_CATEGORICAL, fileName, name, header, target);
      if (options.numericColumns().contains(name)) {
        throw new InputException(
            LoadOptions.OPTION_NUMERIC,
            "column " + InputException.quote(name) + " is also declared categorical",
            "declare each column at most once");
      }
    }
    for (String name : options.numericColumns()) {
      checkDeclared(LoadOptions.OPTION_NUMERIC, fileName, name, header, target);
    }
  }

  private static void checkDeclared(
      String option, String fileName, String name, List<String> header, int target)
      throws InputException {
    int index = header.indexOf(name);
    if (index < 0) {
      throw unknownColumn(option, fileName, name, header);
    }
    if (index == target) {
      throw new InputException(
          option,
          InputException.quote(name) + " is the target column",
          "declare only feature columns; class labels are always read as text");
    }
  }

  private static InputException unknownColumn(
      String option, String fileName, String name, List<String> header) {
    return new InputException(
        option,
        fileName + " has no column " + InputException.quote(name),
        "use one of " + String.join(", ", header));
  }

  private static void requireLabel(CsvRows rows, int c, String text, LoadOptions options)
      throws InputException {
    if (options.isMissing(text)) {
      throw new InputException(
          rows.cell(c), "missing class label", "give every row a label, or remove the row");
    }
  }

  private static InputException headerOnly(String fileName) {
    return new InputException(
        SourcePosition.ofFile(fileName),
        "header only, no data rows",
        "add data rows below the header row");
  }

  private static InputException changedWhileReading(String fileName) {
    return new InputException(
        SourcePosition.ofFile(fileName),
        "the file changed while it was being read",
        "load it again once nothing is writing to it");
  }

  private static String quoteAll(Iterable<String> names) {
    List<String> quoted = new ArrayList<>();
    names.forEach(n -> quoted.add(InputException.quote(n)));
    return String.join(", ", quoted);
  }

  private static String sourceName(Path file) {
    Path name = file.getFileName();
    return name == null ? file.toString() : name.toString();
  }

  private static MessageDigest sha256() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      // Every Java platform must provide SHA-256 (java.security.MessageDigest javadoc).
      throw new IllegalStateException("SHA-256 unavailable", e);
    }
  }
}
