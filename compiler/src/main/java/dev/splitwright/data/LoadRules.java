package dev.splitwright.data;

import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Checks and messages that both ways of loading share. */
final class LoadRules {

  // Java arrays cannot be much longer than this.
  static final long MAX_ROWS = Integer.MAX_VALUE - 8;

  private LoadRules() {}

  static InputException tooManyRows(CsvRows rows) {
    return new InputException(
        SourcePosition.ofLine(rows.fileName(), rows.line()),
        "more than " + MAX_ROWS + " data rows",
        "split the file");
  }

  static int resolveTarget(String fileName, List<String> header, LoadOptions options)
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

  static void checkDeclaredColumns(
      String fileName, List<String> header, int target, LoadOptions options) throws InputException {
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

  static void checkDeclared(
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

  static InputException unknownColumn(
      String option, String fileName, String name, List<String> header) {
    return new InputException(
        option,
        fileName + " has no column " + InputException.quote(name),
        "use one of " + String.join(", ", header));
  }

  static void requireLabel(CsvRows rows, int c, String text, LoadOptions options)
      throws InputException {
    requireLabel(rows, c, text, options, List.of(), "");
  }

  /**
   * Like {@link #requireLabel(CsvRows, int, String, LoadOptions)}; when {@code --target} was not
   * given, a missing label also says that the target defaulted to the last column and names the
   * first column if this row's cell there ({@code firstCell}) looks like a label.
   */
  static void requireLabel(CsvRows rows, int c, String text, LoadOptions options,
      List<String> header, String firstCell) throws InputException {
    if (options.isMissing(text)) {
      String remedy = "give every row a label, or remove the row";
      if (options.target().isEmpty() && !header.isEmpty()) {
        remedy = "--target was not given, so the target is the last column "
            + InputException.quote(header.get(header.size() - 1))
            + (looksLikeLabel(firstCell, options) && c != 0
                ? "; the first column " + InputException.quote(header.get(0)) + " holds text such "
                    + "as " + InputException.quote(firstCell) + ": if it holds the labels, give "
                    + "--target " + header.get(0)
                : "; name the label column with --target, or " + remedy);
      }
      throw new InputException(rows.cell(c), "missing class label", remedy);
    }
    if (text.length() > CsvLoader.MAX_NAME_LENGTH) {
      throw new InputException(
          rows.cell(c),
          String.format(
              Locale.ROOT,
              "class label %s has %d characters, more than the %d allowed",
              InputException.quote(text),
              text.length(),
              CsvLoader.MAX_NAME_LENGTH),
          "check that --target names the class-label column");
    }
  }

  /** Text that is neither missing nor a number, as class labels usually are. */
  private static boolean looksLikeLabel(String text, LoadOptions options) {
    if (text.isEmpty() || options.isMissing(text)) {
      return false;
    }
    try {
      Double.parseDouble(text);
      return false;
    } catch (NumberFormatException e) {
      return true;
    }
  }

  static InputException headerOnly(String fileName) {
    return new InputException(
        SourcePosition.ofFile(fileName),
        "header only, no data rows",
        "add data rows below the header row");
  }

  static InputException changedWhileReading(String fileName) {
    return new InputException(
        SourcePosition.ofFile(fileName),
        "the file changed while it was being read",
        "load it again once nothing is writing to it");
  }

  static String quoteAll(Iterable<String> names) {
    List<String> quoted = new ArrayList<>();
    names.forEach(n -> quoted.add(InputException.quote(n)));
    return String.join(", ", quoted);
  }

  static String sourceName(Path file) {
    Path name = file.getFileName();
    return name == null ? file.toString() : name.toString();
  }

  static MessageDigest sha256() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      // Every Java platform must provide SHA-256 (java.security.MessageDigest javadoc).
      throw new IllegalStateException("SHA-256 unavailable", e);
    }
  }
}
