package dev.splitwright.demo;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;

/** Formats generated rows as CSV (Commons CSV): header row, {@code \n} endings, plain decimals. */
final class DemoCsv {
  private DemoCsv() {}

  /** Rounds half-even to {@code decimals} places, written without exponent or negative zero. */
  static String decimal(double value, int decimals) {
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException("not finite: " + value);
    }
    BigDecimal rounded = new BigDecimal(value).setScale(decimals, RoundingMode.HALF_EVEN);
    return rounded.signum() == 0
        ? BigDecimal.ZERO.setScale(decimals).toPlainString()
        : rounded.toPlainString();
  }

  /** Quotes only where CSV needs it; {@code \n} line endings on every platform. */
  private static final CSVFormat FORMAT =
      CSVFormat.DEFAULT.builder().setRecordSeparator('\n').get();

  static String csv(List<String> features, String target, List<DemoRow> rows) {
    StringBuilder out = new StringBuilder(rows.size() * 64);
    try {
      List<String> header = new ArrayList<>(features);
      header.add(target);
      printRecord(out, header);
      for (DemoRow row : rows) {
        List<String> record = new ArrayList<>(row.cells());
        record.add(row.loggedLabel());
        printRecord(out, record);
      }
    } catch (IOException e) {
      throw new UncheckedIOException("writing to memory cannot fail", e);
    }
    return out.toString();
  }

  /**
   * One record through the format's own printing (what {@code CSVPrinter} does, without its class,
   * whose SpotBugs annotation javac cannot resolve and would warn about).
   */
  private static void printRecord(StringBuilder out, List<String> values) throws IOException {
    for (int i = 0; i < values.size(); i++) {
      FORMAT.print(values.get(i), out, i == 0);
    }
    FORMAT.println(out);
  }

  static void write(Path out, String csv) throws IOException {
    Files.writeString(out, csv, StandardCharsets.UTF_8);
  }
}
