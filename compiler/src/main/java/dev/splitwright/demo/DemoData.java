package dev.splitwright.demo;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;

/** Entry point for the command line: writes a demo scenario's CSV by name. */
public final class DemoData {

  private DemoData() {}

  /** The scenario names, sorted. */
  public static List<String> scenarios() {
    return List.of(GestureBandScenario.NAME, PumpVibrationScenario.NAME);
  }

  /**
   * The row count a scenario is meant to be used with.
   *
   * @throws IllegalArgumentException if the name is not one of {@link #scenarios()}
   */
  public static int defaultRows(String scenario) {
    return switch (checkName(scenario)) {
      case PumpVibrationScenario.NAME -> PumpVibrationScenario.DEFAULT_ROWS;
      default -> GestureBandScenario.DEFAULT_ROWS;
    };
  }

  /**
   * Writes {@code rows} rows of the named scenario, generated from {@code seed}, to {@code out} as
   * UTF-8 CSV with a header row and {@code \n} line endings. The same arguments always give the
   * same bytes.
   *
   * @throws IllegalArgumentException if the name is not one of {@link #scenarios()} or {@code rows
   *     < 1}; the command line should check both first
   * @throws IOException if the file cannot be written
   */
  public static void write(String scenario, Path out, int rows, long seed) throws IOException {
    Objects.requireNonNull(out, "out");
    switch (checkName(scenario)) {
      case PumpVibrationScenario.NAME -> new PumpVibrationScenario().writeCsv(out, rows, seed);
      default -> new GestureBandScenario().writeCsv(out, rows, seed);
    }
  }

  private static String checkName(String scenario) {
    Objects.requireNonNull(scenario, "scenario");
    if (!scenarios().contains(scenario)) {
      throw new IllegalArgumentException(
          "unknown scenario '" + scenario + "'; use one of " + String.join(", ", scenarios()));
    }
    return scenario;
  }
}
