package dev.splitwright.data;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.OptionalLong;

/**
 * Where in an input file something is: the file name as the user gave it, and optionally a 1-based
 * line, a 1-based column (cell index within the row) and that column's header name. An unknown line
 * or column is 0; an unknown header is the empty string. Prefer the {@code optional...} accessors.
 */
public record SourcePosition(String file, long line, int column, String header) {

  public SourcePosition {
    Objects.requireNonNull(file, "file");
    header = header == null ? "" : header;
    if (line < 0) {
      throw new IllegalArgumentException("line must be 1-based or 0 for unknown: " + line);
    }
    if (column < 0) {
      throw new IllegalArgumentException("column must be 1-based or 0 for unknown: " + column);
    }
    if (column > 0 && line == 0) {
      throw new IllegalArgumentException("a column needs a line");
    }
  }

  /** Names a whole file. */
  public static SourcePosition ofFile(String file) {
    return new SourcePosition(file, 0, 0, "");
  }

  /** Names one line of a file. */
  public static SourcePosition ofLine(String file, long line) {
    requirePositive(line, "line");
    return new SourcePosition(file, line, 0, "");
  }

  /** Names one cell: line, column and the column's header name. */
  public static SourcePosition ofCell(String file, long line, int column, String header) {
    requirePositive(line, "line");
    requirePositive(column, "column");
    return new SourcePosition(file, line, column, Objects.requireNonNull(header, "header"));
  }

  public OptionalLong optionalLine() {
    return line == 0 ? OptionalLong.empty() : OptionalLong.of(line);
  }

  public OptionalInt optionalColumn() {
    return column == 0 ? OptionalInt.empty() : OptionalInt.of(column);
  }

  public Optional<String> optionalHeader() {
    return header.isEmpty() ? Optional.empty() : Optional.of(header);
  }

  /** Renders {@code file[:line[:column]]}, numbers in plain ASCII digits. */
  public String render() {
    StringBuilder out = new StringBuilder(file);
    if (line > 0) {
      out.append(':').append(Long.toString(line));
      if (column > 0) {
        out.append(':').append(Integer.toString(column));
      }
    }
    return out.toString();
  }

  private static void requirePositive(long value, String name) {
    if (value < 1) {
      throw new IllegalArgumentException(name + " must be 1-based, but it is " + value);
    }
  }
}
