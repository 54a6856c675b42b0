package dev.splitwright.data;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Every bad input gives an {@link InputException} with a one-line message naming the place. */
class CsvLoaderErrorTest {

  @TempDir Path dir;

  private Path file;

  private Path write(String content) throws IOException {
    return write(content.getBytes(StandardCharsets.UTF_8));
  }

  private Path write(byte[] content) throws IOException {
    file = Files.write(dir.resolve("t.csv"), content);
    return file;
  }

  private void assertLoadFails(LoadOptions options, String expectedAfterFileName) {
    assertThatThrownBy(() -> CsvLoader.load(file, options))
        .isInstanceOf(InputException.class)
        .hasMessage(file + expectedAfterFileName);
  }

  private void assertLoadFails(String expectedAfterFileName) {
    assertLoadFails(LoadOptions.defaults(), expectedAfterFileName);
  }

  @Test
  void rejectsRowWithMissingLabel() throws Exception {
    write("a,b,label\n1,2,x\n3,4,\n");

    assertLoadFails(
        ":3:3: missing class label (column 'label'); --target was not given, so the target is "
            + "the last column 'label'; name the label column with --target, or give every row a "
            + "label, or remove the row");
  }

  @Test
  void rejectsLabelGivenAsMissingToken() throws Exception {
    write("label,a\nx,1\nNA,2\n");

    assertLoadFails(
        LoadOptions.builder().target("label").missingTokens(List.of("NA")).build(),
        ":3:1: missing class label (column 'label'); give every row a label, or remove the row");
  }

  @Test
  void rejectsUnknownTargetListingTheColumns() throws Exception {
    write("a,b,label\n1,2,x\n");

    assertThatThrownBy(() -> CsvLoader.load(file, LoadOptions.builder().target("species").build()))
        .isInstanceOf(InputException.class)
        .hasMessage(
            "option --target: " + file + " has no column 'species'; use one of a, b, label");
  }

  @Test
  void rejectsRowWithTooManyCells() throws Exception {
    write("a,b,label\n1,2,x\n3,4,y,5\n");

    assertLoadFails(
        ":3: row has 4 cells but the header has 3 columns;"
            + " give every row one cell per column; leave a cell empty for a missing value");
  }

  @Test
  void rejectsRowWithTooFewCells() throws Exception {
    write("a,b,label\n1,2,x\n3,y\n");

    assertLoadFails(
        ":3: row has 2 cells but the header has 3 columns;"
            + " give every row one cell per column; leave a cell empty for a missing value");
  }

  @Test
  void rejectsTextInDeclaredNumericColumn() throws Exception {
    write("a,b,label\n1,2,x\n3,n/a,y\n");

    assertLoadFails(
        LoadOptions.builder().numericColumns(List.of("b")).build(),
        ":3:2: 'n/a' is not a number (column 'b'); fix the cell, leave it empty for a missing"
            + " value, or do not declare the column numeric");
  }

  @Test
  void rejectsNaNTextInNumericColumn() throws Exception {
    write("a,b,label\n1,2,x\n3,4,y\nNaN,5,x\n");

    assertLoadFails(
        ":4:1: 'NaN' is not a reading but a logging fault marker (column 'a'); export missing"
            + " readings as empty cells, or declare 'NaN' a missing-value token (--missing)");
  }

  @Test
  void rejectsMinusInfinityTextInNumericColumn() throws Exception {
    write("a,b,label\n1,-Infinity,x\n");

    assertLoadFails(
        ":2:2: '-Infinity' is not a reading but a logging fault marker (column 'b'); export missing"
            + " readings as empty cells, or declare '-Infinity' a missing-value token (--missing)");
  }

  @Test
  void rejectsNumberThatOverflowsFloat32InsteadOfClamping() throws Exception {
    write("a,b,label\n1,2,x\n3,-1e39,y\n");

    assertLoadFails(
        ":3:2: '-1e39' is too large for a 32-bit float (largest 3.4028235E38) (column 'b');"
            + " rescale the column or fix the cell; values are not clamped");
  }

  @Test
  void rejectsHexadecimalFloat() throws Exception {
    write("a,b,label\n0x1p3,2,x\n");

    assertLoadFails(
        ":2:1: '0x1p3' is not a plain decimal number (column 'a');"
            + " write numbers as plain decimals such as 12.5 or -3.1e-4");
  }

  @Test
  void rejectsFloatSuffix() throws Exception {
    write("a,b,label\n1,2.5f,x\n");

    assertLoadFails(
        ":2:2: '2.5f' is not a plain decimal number (column 'b');"
            + " write numbers as plain decimals such as 12.5 or -3.1e-4");
  }

  @Test
  void reportsTheEarliestBadNumberAcrossColumns() throws Exception {
    write("a,b,label\n1,2,x\n3,NaN,x\n1e40,4,y\n");

    assertLoadFails(
        ":3:2: 'NaN' is not a reading but a logging fault marker (column 'b'); export missing"
            + " readings as empty cells, or declare 'NaN' a missing-value token (--missing)");
  }

  @Test
  void rejectsUnterminatedQuote() throws Exception {
    write("a,label\n1,x\n\"2,y\n3,z\n");

    assertLoadFails(
        ":3: a quoted cell starting in this row is never closed;"
            + " close the quote; write a quote inside a quoted cell as two quotes (\"\")");
  }

  @Test
  void rejectsTextAfterClosingQuote() throws Exception {
    write("a,label\n\"1\"2,x\n");

    assertLoadFails(
        ":2: text follows a closing quote in this row;"
            + " put the whole cell inside the quotes; write a quote inside a quoted cell as \"\"");
  }

  @Test
  void rejectsLatin1BytesWithLineAndOffset() throws Exception {
    // "café" in ISO-8859-1: é is the single byte 0xE9, never valid alone in UTF-8 (RFC 3629).
    write(bytes("a,label\n1,x\n2,caf", new byte[] {(byte) 0xE9}, "\n"));

    // Offset worked by hand: 8 bytes "a,label\n" + 4 bytes "1,x\n" + 5 bytes "2,caf".
    assertLoadFails(":3: invalid UTF-8 byte 0xE9 at byte offset 17; save the file as UTF-8");
  }

  @Test
  void findsTheLineOfABadByteFarIntoTheFile() throws Exception {
    StringBuilder text = new StringBuilder("a,label\r\n");
    for (int i = 0; i < 20_000; i++) {
      text.append(i).append(",\"x\ny\"\r\n");
    }
    byte[] head = text.toString().getBytes(StandardCharsets.UTF_8);
    // Header line 1, then two physical lines per record: the bad row starts on line 40002.
    write(bytes(text.toString(), new byte[] {(byte) 0xC3, (byte) 0x28}, ",x\n"));

    assertLoadFails(
        ":40002: invalid UTF-8 byte 0xC3 at byte offset "
            + head.length
            + "; save the file as UTF-8");
  }

  @Test
  void reportsLaterLinesRightAfterQuotedNewlines() throws Exception {
    // Lines worked by hand: header 1, records on 2-3, 4, 5-7, and the short row on 8.
    write("a,b,label\n\"x\ny\",1,p\n\"q,r\",2,p\n\"s\n\nt\",3,p\nu,4\n");

    assertLoadFails(
        ":8: row has 2 cells but the header has 3 columns;"
            + " give every row one cell per column; leave a cell empty for a missing value");
  }

  @Test
  void reportsLaterLinesRightAfterCrlfAndBlankLines() throws Exception {
    write("a,b,label\r\n1,2,x\r\n\r\n3,4,y\r\n5,,\r\n");

    assertLoadFails(
        ":5:3: missing class label (column 'label'); --target was not given, so the target is "
            + "the last column 'label'; name the label column with --target, or give every row a "
            + "label, or remove the row");
  }

  @Test
  void rejectsDuplicateColumnName() throws Exception {
    write("a,b,a,label\n1,2,3,x\n");

    assertLoadFails(
        ":1:3: duplicate column name 'a' (also column 1); give every column a distinct name");
  }

  @Test
  void rejectsBlankColumnName() throws Exception {
    write("a, ,label\n1,2,x\n");

    assertLoadFails(":1:2: blank column name; give every column a name in the header row");
  }

  @Test
  void rejectsHeaderOnly() throws Exception {
    write("a,b,label\n\n");

    assertLoadFails(": header only, no data rows; add data rows below the header row");
  }

  @Test
  void rejectsEmptyFile() throws Exception {
    write("");

    assertLoadFails(": the file is empty; start the file with a header row naming the columns");
  }

  @Test
  void rejectsBlankFirstLine() throws Exception {
    write("\na,label\n1,x\n");

    assertLoadFails(
        ":1: the header row is blank; start the file with a header row naming the columns");
  }

  @Test
  void rejectsSingleColumnFile() throws Exception {
    write("label\nx\n");

    assertLoadFails(
        ":1: the header names only one column;"
            + " a labelled table needs at least one feature column and a target column");
  }

  @Test
  void rejectsMissingFile() {
    file = dir.resolve("absent.csv");

    assertLoadFails(": no such file; check the path");
  }

  @Test
  void rejectsTooManyDistinctClassLabels() throws Exception {
    StringBuilder text = new StringBuilder("a,label\n");
    for (int i = 0; i <= CsvLoader.MAX_CLASSES; i++) {
      text.append("1,c").append(i).append('\n');
    }
    write(text.toString());

    assertLoadFails(
        ":65537:2: more than 65535 distinct class labels (column 'label');"
            + " choose a target column with fewer classes");
  }

  @Test
  void rejectsColumnDeclaredBothWays() throws Exception {
    write("a,label\n1,x\n");

    assertThatThrownBy(
            () ->
                CsvLoader.load(
                    file,
                    LoadOptions.builder()
                        .categoricalColumns(List.of("a"))
                        .numericColumns(List.of("a"))
                        .build()))
        .isInstanceOf(InputException.class)
        .hasMessage(
            "option --numeric: column 'a' is also declared categorical; declare each column at most"
                + " once");
  }

  @Test
  void rejectsDeclaringTheTarget() throws Exception {
    write("a,label\n1,x\n");

    assertThatThrownBy(
            () ->
                CsvLoader.load(
                    file, LoadOptions.builder().categoricalColumns(List.of("label")).build()))
        .isInstanceOf(InputException.class)
        .hasMessage(
            "option --categorical: 'label' is the target column;"
                + " declare only feature columns; class labels are always read as text");
  }

  @Test
  void rejectsUnknownClassLabelInTestFile() throws Exception {
    Schema schema = trainingSchema();
    write("a,label\n1,x\n2,z\n");

    assertThatThrownBy(() -> CsvLoader.loadWithSchema(file, schema, LoadOptions.defaults()))
        .isInstanceOf(InputException.class)
        .hasMessage(
            file + ":3:2: unknown class label 'z' (column 'label'); the model knows only x, y");
  }

  @Test
  void rejectsTestFileWithoutATrainingColumn() throws Exception {
    Schema schema = trainingSchema();
    write("b,label\n1,x\n");

    assertThatThrownBy(() -> CsvLoader.loadWithSchema(file, schema, LoadOptions.defaults()))
        .isInstanceOf(InputException.class)
        .hasMessage(file + ":1: missing column 'a'; the model was trained on a, label");
  }

  @Test
  void rejectsTextInNumericColumnOfTestFile() throws Exception {
    Schema schema = trainingSchema();
    write("label,a\nx,1\ny,high\n");

    assertThatThrownBy(() -> CsvLoader.loadWithSchema(file, schema, LoadOptions.defaults()))
        .isInstanceOf(InputException.class)
        .hasMessage(
            file
                + ":3:2: 'high' is not a number (column 'a'); fix the cell, or leave it empty for a"
                + " missing value");
  }

  private Schema trainingSchema() throws Exception {
    Path train = Files.writeString(dir.resolve("train.csv"), "a,label\n1,x\n2,y\n");
    return CsvLoader.load(train).dataset().schema();
  }

  private static byte[] bytes(String before, byte[] raw, String after) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    out.writeBytes(before.getBytes(StandardCharsets.UTF_8));
    out.writeBytes(raw);
    out.writeBytes(after.getBytes(StandardCharsets.UTF_8));
    return out.toByteArray();
  }

  @Test
  void neverLeaksAStackTraceWorthyExceptionForGarbageInput() throws Exception {
    // Random bytes: whatever is wrong, it must surface as an InputException or load.
    java.util.SplittableRandom random = new java.util.SplittableRandom(1);
    byte[] alphabet = "ab,\"\n\r1.e-x".getBytes(StandardCharsets.US_ASCII);
    for (int trial = 0; trial < 300; trial++) {
      byte[] junk = new byte[random.nextInt(1, 200)];
      for (int i = 0; i < junk.length; i++) {
        // One in twelve bytes is 0xFF, never valid in UTF-8.
        int pick = random.nextInt(alphabet.length + 1);
        junk[i] = pick == alphabet.length ? (byte) 0xFF : alphabet[pick];
      }
      write(junk);
      try {
        CsvLoader.load(file);
      } catch (InputException expected) {
        assertThat(expected.getMessage()).doesNotContain("\n").startsWith(file.toString());
      }
    }
  }
}
