package dev.splitwright.data;

import java.io.Closeable;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.csv.CSVException;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * Streams the records of one CSV file: a validated header row, then data rows of the header's
 * width, each with the physical line it starts on. Blank lines are skipped. Every failure is an
 * {@link InputException} naming the file and, where known, the line.
 */
final class CsvRows implements Closeable {

  // RFC 4180 quoting; empty lines come through as records so that line numbers stay exact.
  private static final CSVFormat FORMAT =
      CSVFormat.DEFAULT.builder().setIgnoreEmptyLines(false).setTrim(false).get();

  private final String fileName;
  private final Utf8FileReader reader;
  private final CSVParser parser;
  private final Iterator<CSVRecord> records;
  private long linesBefore;
  private long line;
  private List<String> header = List.of();

  private CsvRows(String fileName, Utf8FileReader reader, CSVParser parser) {
    this.fileName = fileName;
    this.reader = reader;
    this.parser = parser;
    this.records = parser.iterator();
  }

  /**
   * Opens {@code file}; {@code digest}, if not null, sees every byte of it.
   *
   * @throws InputException if the file cannot be opened
   */
  static CsvRows open(Path file, MessageDigest digest) throws InputException {
    String name = file.toString();
    if (Files.isDirectory(file)) {
      throw new InputException(
          SourcePosition.ofFile(name), "is a directory, not a CSV file", "give the path of a file");
    }
    InputStream in;
    try {
      in = Files.newInputStream(file);
    } catch (NoSuchFileException e) {
      throw new InputException(SourcePosition.ofFile(name), "no such file", "check the path", e);
    } catch (AccessDeniedException e) {
      throw new InputException(
          SourcePosition.ofFile(name), "permission denied", "make the file readable", e);
    } catch (IOException e) {
      throw readError(name, e);
    }
    Utf8FileReader reader = new Utf8FileReader(in, digest);
    try {
      return new CsvRows(name, reader, CSVParser.parse(reader, FORMAT));
    } catch (IOException e) {
      closeQuietly(reader);
      throw readError(name, e);
    }
  }

  private static InputException readError(String name, IOException e) {
    // A FileSystemException's message repeats the path; its reason alone is what went wrong.
    String detail =
        e instanceof FileSystemException fse && fse.getReason() != null
            ? fse.getReason()
            : e.getMessage();
    if (detail == null || detail.isBlank()) {
      detail = "input/output error";
    }
    return new InputException(
        SourcePosition.ofFile(name),
        "cannot read the file: " + detail,
        "check that the path names a readable regular file",
        e);
  }

  private static void closeQuietly(Closeable c) {
    try {
      c.close();
    } catch (IOException ignored) {
      // Already failing with a better message.
    }
  }

  String fileName() {
    return fileName;
  }

  /** The 1-based line on which the last returned record starts. */
  long line() {
    return line;
  }

  /** The header names, trimmed, once {@link #readHeader} has run. */
  List<String> header() {
    return header;
  }

  SourcePosition cell(int columnIndex) {
    return SourcePosition.ofCell(fileName, line, columnIndex + 1, header.get(columnIndex));
  }

  /**
   * Reads the first record as the header.
   *
   * @throws InputException if the file is empty or a name is blank or repeated
   */
  List<String> readHeader() throws InputException {
    CSVRecord record = nextRecord();
    if (record == null) {
      throw new InputException(
          SourcePosition.ofFile(fileName),
          "the file is empty",
          "start the file with a header row naming the columns");
    }
    if (record.size() == 1 && record.get(0).isEmpty()) {
      throw new InputException(
          SourcePosition.ofLine(fileName, 1),
          "the header row is blank",
          "start the file with a header row naming the columns");
    }
    List<String> names = new ArrayList<>(record.size());
    Map<String, Integer> seen = new HashMap<>();
    for (int c = 0; c < record.size(); c++) {
      String name = record.get(c).trim();
      SourcePosition where = SourcePosition.ofCell(fileName, 1, c + 1, "");
      if (name.isEmpty()) {
        throw new InputException(
            where, "blank column name", "give every column a name in the header row");
      }
      if (name.length() > CsvLoader.MAX_NAME_LENGTH) {
        throw new InputException(
            where,
            String.format(
                Locale.ROOT,
                "column name %s has %d characters, more than the %d allowed",
                InputException.quote(name),
                name.length(),
                CsvLoader.MAX_NAME_LENGTH),
            "check that the first row is the header row; shorten the name");
      }
      Integer earlier = seen.putIfAbsent(name, c + 1);
      if (earlier != null) {
        throw new InputException(
            where,
            "duplicate column name "
                + InputException.quote(name)
                + " (also column "
                + earlier
                + ")",
            "give every column a distinct name");
      }
      names.add(name);
    }
    header = List.copyOf(names);
    return header;
  }

  /**
   * Returns the next data row, or {@code null} at the end of the file.
   *
   * @throws InputException if the row's width differs from the header's, or the file is malformed
   */
  CSVRecord nextRow() throws InputException {
    CSVRecord record = nextRecord();
    if (record != null && record.size() != header.size()) {
      throw new InputException(
          SourcePosition.ofLine(fileName, line),
          String.format(
              Locale.ROOT,
              "row has %d cells but the header has %d columns",
              record.size(),
              header.size()),
          "give every row one cell per column; leave a cell empty for a missing value");
    }
    return record;
  }

  private CSVRecord nextRecord() throws InputException {
    try {
      while (records.hasNext()) {
        CSVRecord record = records.next();
        line = linesBefore + 1;
        linesBefore = parser.getCurrentLineNumber();
        if (!(record.size() == 1 && record.get(0).isEmpty()) || line == 1) {
          return record;
        }
      }
      return null;
    } catch (UncheckedIOException e) {
      throw translate(e.getCause(), linesBefore + 1);
    }
  }

  private InputException translate(IOException e, long recordLine) {
    if (e instanceof MalformedUtf8Exception bad) {
      return new InputException(
          SourcePosition.ofLine(fileName, bad.line()),
          String.format(
              Locale.ROOT,
              "invalid UTF-8 byte 0x%02X at byte offset %d",
              bad.badByte(),
              bad.byteOffset()),
          "save the file as UTF-8",
          e);
    }
    if (e instanceof CSVException) {
      String message = String.valueOf(e.getMessage()).toLowerCase(Locale.ROOT);
      SourcePosition where = SourcePosition.ofLine(fileName, recordLine);
      if (message.contains("eof reached before encapsulated token finished")) {
        return new InputException(
            where,
            "a quoted cell starting in this row is never closed",
            "close the quote; write a quote inside a quoted cell as two quotes (\"\")",
            e);
      }
      if (message.contains("invalid char")) {
        return new InputException(
            where,
            "text follows a closing quote in this row",
            "put the whole cell inside the quotes; write a quote inside a quoted cell as \"\"",
            e);
      }
      return new InputException(where, "malformed CSV row", "check the quoting of this row", e);
    }
    return readError(fileName, e);
  }

  /**
   * Reads any bytes the parser left, so a digest covers the whole file.
   *
   * @throws InputException if reading fails
   */
  void finish() throws InputException {
    try {
      reader.drain();
    } catch (IOException e) {
      throw readError(fileName, e);
    }
  }

  long bytesRead() {
    return reader.bytesRead();
  }

  @Override
  public void close() {
    closeQuietly(parser);
  }
}
