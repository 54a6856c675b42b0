package dev.splitwright.demo;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * What the demo scenarios share: the label-noise setting, generating rows in logged order from
 * one seeded random stream, and writing them as CSV.
 */
abstract sealed class DemoScenario permits GestureBandScenario, PumpVibrationScenario {
  private final List<String> features;
  private final String target;
  /** Share of rows logged with a wrong label, in [0, 1). */
  final double labelNoise;

  DemoScenario(List<String> features, String target, double labelNoise) {
    if (!(labelNoise >= 0 && labelNoise < 1)) {
      throw new IllegalArgumentException("labelNoise must be in [0, 1), but it is " + labelNoise);
    }
    this.features = features;
    this.target = target;
    this.labelNoise = labelNoise;
  }

  /** Row {@code index} in logged order, drawn from {@code random}. */
  abstract DemoRow row(DemoRandom random, int index);

  /** Generates {@code rows} rows in logged order; the same seed gives the same rows. */
  public final List<DemoRow> generate(int rows, long seed) {
    if (rows < 1) {
      throw new IllegalArgumentException("rows must be positive, but it is " + rows);
    }
    DemoRandom random = new DemoRandom(seed);
    List<DemoRow> out = new ArrayList<>(rows);
    for (int i = 0; i < rows; i++) {
      out.add(row(random, i));
    }
    return out;
  }

  /** Generates the rows as CSV text: header row, then one line per row, {@code \n} endings. */
  public final String csv(int rows, long seed) {
    return DemoCsv.csv(features, target, generate(rows, seed));
  }

  /** Writes {@link #csv} to {@code out} in UTF-8. */
  public final void writeCsv(Path out, int rows, long seed) throws IOException {
    Objects.requireNonNull(out, "out");
    DemoCsv.write(out, csv(rows, seed));
  }
}
