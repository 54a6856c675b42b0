package dev.splitwright.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.FeatureKind;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class PumpVibrationScenarioTest {

  @TempDir Path dir;

  private final PumpVibrationScenario scenario = new PumpVibrationScenario();

  @Test
  void sameSeedGivesIdenticalText() {
    assertThat(scenario.csv(500, 3)).isEqualTo(new PumpVibrationScenario().csv(500, 3));
  }

  @Test
  void anotherSeedGivesOtherText() {
    assertThat(scenario.csv(500, 3)).isNotEqualTo(scenario.csv(500, 4));
  }

  @Test
  void loadsAsSixNumericFeaturesWithEveryStatePresent() throws Exception {
    Path file = dir.resolve("pump.csv");
    scenario.writeCsv(file, PumpVibrationScenario.DEFAULT_ROWS, 7);

    Dataset data = CsvLoader.load(file).dataset();

    assertThat(data.rows()).isEqualTo(3_000);
    assertThat(data.schema().featureNames())
        .containsExactlyElementsOf(PumpVibrationScenario.FEATURES);
    assertThat(data.schema().features()).allMatch(f -> f.kind() == FeatureKind.NUMERIC);
    assertThat(data.schema().classes())
        .containsExactlyInAnyOrderElementsOf(PumpVibrationScenario.STATES);
    int[] counts = data.classCounts();
    int normal = data.schema().classes().indexOf("normal");
    for (int c = 0; c < counts.length; c++) {
      assertThat(counts[c]).isGreaterThan(150);
      if (c != normal) {
        assertThat(counts[normal]).isGreaterThan(3 * counts[c]);
      }
    }
  }

  @Test
  void writesPlainDecimalsWithUnixLineEndings() {
    String csv = scenario.csv(200, 1);

    assertThat(csv).doesNotContain("\r").endsWith("\n");
    String[] lines = csv.split("\n");
    assertThat(lines[0])
        .isEqualTo(
            "vibration_rms_mm_s,peak_accel_g,crest_factor,kurtosis,bearing_temp_c,"
                + "motor_current_a,state");
    for (String line : List.of(lines).subList(1, lines.length)) {
      assertThat(line)
          .matches(
              "\\d+\\.\\d{2},\\d+\\.\\d{3},\\d+\\.\\d{2},\\d+\\.\\d{2},"
                  + "(\\d+\\.\\d)?,\\d+\\.\\d{2},[a-z_]+");
    }
  }

  @Test
  void mislabelsAboutTheConfiguredShareOfRows() {
    List<DemoRow> rows = new PumpVibrationScenario(0.05).generate(20_000, 5);

    double rate = rows.stream().filter(DemoRow::mislabelled).count() / 20_000.0;
    // Binomial standard deviation sqrt(0.05 * 0.95 / 20000) = 0.0015; allow about 3.3 of them.
    assertThat(rate).isBetween(0.045, 0.055);
    assertThat(new PumpVibrationScenario(0).generate(2_000, 5)).noneMatch(DemoRow::mislabelled);
  }

  @Test
  void faultsShiftTheReadingsTheWayVibrationPracticeExpects() {
    List<DemoRow> rows = new PumpVibrationScenario(0).generate(20_000, 9);

    // ISO 10816-3 (from memory): for medium machines on rigid foundations, 2.8 mm/s RMS is the
    // boundary between "unrestricted long-term operation" and "restricted"; a healthy pump sits
    // below it, an imbalanced one above.
    assertThat(median(rows, "normal", 0)).isLessThan(2.8);
    assertThat(median(rows, "imbalance", 0)).isGreaterThan(2.8);
    // Gaussian vibration has kurtosis 3 (textbook); bearing defects make it impulsive, > 3.
    assertThat(median(rows, "normal", 3)).isBetween(2.7, 3.3);
    assertThat(median(rows, "bearing_wear", 3)).isGreaterThan(4.5);
    assertThat(median(rows, "bearing_wear", 2)).isGreaterThan(median(rows, "normal", 2) + 1.5);
    assertThat(median(rows, "cavitation", 1)).isGreaterThan(4 * median(rows, "normal", 1));
    assertThat(median(rows, "misalignment", 4)).isGreaterThan(median(rows, "normal", 4) + 5);
    // Peak over RMS is at least 1 for any signal (1 for a square wave); the scenario floors it at
    // 1.45, about a pure sine's sqrt(2), the least peaky a pump's vibration gets.
    assertThat(rows)
        .allSatisfy(r -> assertThat(Double.parseDouble(r.cells().get(2))).isGreaterThan(1.41));
  }

  @Test
  void dropsAFewTemperatureReadings() {
    List<DemoRow> rows = scenario.generate(20_000, 2);

    long missing = rows.stream().filter(r -> r.cells().get(4).isEmpty()).count();
    assertThat(missing).isBetween(40L, 130L); // 0.4% of 20000 = 80, binomial sd about 9
  }

  @Test
  void rejectsBadArguments() {
    assertThatThrownBy(() -> new PumpVibrationScenario(1.0))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("labelNoise must be in [0, 1), but it is 1.0");
    assertThatThrownBy(() -> scenario.generate(0, 1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("rows must be positive, but it is 0");
  }

  static double median(List<DemoRow> rows, String state, int column) {
    double[] values =
        rows.stream()
            .filter(r -> r.trueLabel().equals(state) && !r.cells().get(column).isEmpty())
            .mapToDouble(r -> Double.parseDouble(r.cells().get(column)))
            .sorted()
            .toArray();
    return values[values.length / 2];
  }

  @Test
  void writesTheFileItIsAsked() throws Exception {
    Path file = dir.resolve("p.csv");
    scenario.writeCsv(file, 10, 1);

    assertThat(Files.readString(file)).isEqualTo(scenario.csv(10, 1));
  }
}
