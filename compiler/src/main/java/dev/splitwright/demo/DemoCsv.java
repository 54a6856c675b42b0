package dev.splitwright.demo;

import java.io.IOException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/** Formats generated rows as CSV: header row, {@code \n} endings, plain decimals. */
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

  static String csv(List<String> features, String target, List<DemoRow> rows) {
    StringBuilder out = new StringBuilder(rows.size() * 64);
    out.append(String.join(",", features)).append(',').append(target).append('\n');
    for (DemoRow row : rows) {
      out.append(String.join(",", row.cells())).append(',').append(row.loggedLabel()).append('\n');
    }
    return out.toString();
  }

  static void write(Path out, String csv) throws IOException {
    Files.writeString(out, csv, StandardCharsets.UTF_8);
  }
}
