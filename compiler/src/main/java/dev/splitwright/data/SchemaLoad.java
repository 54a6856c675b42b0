package dev.splitwright.data;

import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import org.apache.commons.csv.CSVRecord;

/** Loads a file to evaluate a model on, coding it with the training schema in one pass. */
final class SchemaLoad {
  private SchemaLoad() {}

  static LoadedData load(Path file, Schema schema, LoadOptions options) throws InputException {
    return load(file, schema, options, new RowTally());
  }

  /**
   * Counts rows that hold a category the schema does not know and rows that hold a missing cell;
   * both load as NaN, so only the loader can still tell them apart.
   */
  static final class RowTally {
    long unseenCategoryRows;
    long missingValueRows;
  }

  static LoadedData load(Path file, Schema schema, LoadOptions options, RowTally tally)
      throws InputException {
    checkAgainstSchema(schema, options);
    MessageDigest digest = LoadRules.sha256();
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
        if (++count > LoadRules.MAX_ROWS) {
          throw LoadRules.tooManyRows(rows);
        }
        boolean unseen = false;
        boolean missing = false;
        for (int c = 0; c < header.size(); c++) {
          String text = record.get(c).trim();
          if (c == target) {
            LoadRules.requireLabel(rows, c, text, options);
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
            missing = true;
            columns[f].add(Float.NaN);
          } else if (schema.feature(f).isCategorical()) {
            Integer code = categoryCodes.get(f).get(text);
            unseen |= code == null;
            columns[f].add(code == null ? Float.NaN : code);
          } else {
            CellText.Kind kind = CellText.classify(text);
            if (kind != CellText.Kind.NUMBER) {
              throw CellText.numericCellError(kind, rows.cell(c), text, false);
            }
            columns[f].add(CellText.parse(text));
          }
        }
        tally.unseenCategoryRows += unseen ? 1 : 0;
        tally.missingValueRows += missing ? 1 : 0;
      }
      rows.finish();
      if (count == 0) {
        throw LoadRules.headerOnly(rows.fileName());
      }
      float[][] values = new float[columns.length][];
      for (int f = 0; f < columns.length; f++) {
        values[f] = columns[f].toArray();
        columns[f] = null; // frees the growth slack before the next column is copied
      }
      return new LoadedData(
          Dataset.wrap(schema, values, labels.toArray()),
          LoadRules.sourceName(file),
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
          (absent.size() == 1 ? "missing column " : "missing columns ")
              + LoadRules.quoteAll(absent),
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

  private static void checkAgainstSchema(Schema schema, LoadOptions options) throws InputException {
    if (options.target().isPresent() && !options.target().get().equals(schema.target())) {
      throw new InputException(
          LoadOptions.OPTION_TARGET,
          "the model's target column is "
              + InputException.quote(schema.target())
              + ", not "
              + InputException.quote(options.target().get()),
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
}
