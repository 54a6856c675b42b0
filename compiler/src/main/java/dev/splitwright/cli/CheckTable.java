package dev.splitwright.cli;

import dev.splitwright.eval.Scores;
import dev.splitwright.job.FieldCheck;
import dev.splitwright.report.FieldCheckReport;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Prints the result of {@code splitwright check} as aligned plain-text tables. */
final class CheckTable {
  private CheckTable() {}

  static void print(PrintWriter out, FieldCheck.Result result) {
    FieldCheckReport report = result.report();
    Scores s = result.scores();
    List<String> classes = report.classes().stream().map(CheckTable::printable).toList();
    out.printf(Locale.ROOT, "model %s on %s: %d rows%n", printable(report.model()),
        printable(report.data()), s.rows());
    out.printf(Locale.ROOT, "model trained on %s (SHA-256 %s)%n",
        printable(report.modelTrainedOn().name()), report.modelTrainedOn().sha256());
    out.printf(Locale.ROOT, "rows with a category the model never saw: %d (scored as missing)%n",
        report.rowsWithUnseenCategory());
    out.printf(Locale.ROOT, "rows with a missing value: %d%n", report.rowsWithMissingValue());
    out.println();
    out.printf(Locale.ROOT, "%-18s %.4f%n", "accuracy", s.accuracy());
    out.printf(Locale.ROOT, "%-18s %.4f%n", "balanced accuracy", s.balancedAccuracy());
    out.printf(Locale.ROOT, "%-18s %.4f%n", "macro-F1", s.macroF1());
    out.println();

    int[] actual = new int[classes.size()];
    for (int a = 0; a < actual.length; a++) {
      for (int n : s.confusion().get(a)) {
        actual[a] += n;
      }
    }
    List<List<String>> perClass = new ArrayList<>();
    perClass.add(List.of("class", "precision", "recall", "rows"));
    for (int c = 0; c < classes.size(); c++) {
      perClass.add(List.of(classes.get(c), fixed(s.precision().get(c)),
          fixed(s.recall().get(c)), Integer.toString(actual[c])));
    }
    table(out, perClass);
    out.println();

    out.println("confusion matrix (rows: actual class, columns: predicted class)");
    List<List<String>> matrix = new ArrayList<>();
    List<String> head = new ArrayList<>();
    head.add("");
    head.addAll(classes);
    matrix.add(head);
    for (int a = 0; a < classes.size(); a++) {
      List<String> row = new ArrayList<>();
      row.add(classes.get(a));
      s.confusion().get(a).forEach(n -> row.add(Integer.toString(n)));
      matrix.add(row);
    }
    table(out, matrix);
    if (!report.floors().isEmpty()) {
      out.println();
      for (FieldCheckReport.FloorResult f : report.floors()) {
        out.printf(Locale.ROOT, "floor %s %.4f: %.4f, %s%n", f.metric(), f.floor(), f.value(),
            f.met() ? "met" : "NOT MET");
      }
    }
  }

  /** The first column left-aligned, the others right-aligned, two blanks apart. */
  private static void table(PrintWriter out, List<List<String>> rows) {
    int columns = rows.get(0).size();
    int[] width = new int[columns];
    for (List<String> row : rows) {
      for (int c = 0; c < columns; c++) {
        width[c] = Math.max(width[c], row.get(c).length());
      }
    }
    for (List<String> row : rows) {
      StringBuilder line = new StringBuilder();
      for (int c = 0; c < columns; c++) {
        String cell = row.get(c);
        String pad = " ".repeat(width[c] - cell.length());
        line.append(c == 0 ? cell + pad : "  " + pad + cell);
      }
      out.println(line.toString().stripTrailing());
    }
  }

  private static String fixed(double value) {
    return String.format(Locale.ROOT, "%.4f", value);
  }

  /** Control characters in a label would break the table's lines; they are shown escaped. */
  static String printable(String text) {
    StringBuilder out = new StringBuilder();
    text.codePoints().forEach(cp -> {
      if (Character.isISOControl(cp) || cp == 0x2028 || cp == 0x2029) {
        out.append(String.format(Locale.ROOT, "\\u%04x", cp));
      } else {
        out.appendCodePoint(cp);
      }
    });
    return out.toString();
  }
}
