package dev.splitwright.demo;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.FeatureKind;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class GestureBandScenarioTest {

  @TempDir Path dir;

  private final GestureBandScenario scenario = new GestureBandScenario();

  @Test
  void sameSeedGivesIdenticalText() {
    assertThat(scenario.csv(300, 11)).isEqualTo(new GestureBandScenario().csv(300, 11));
    assertThat(scenario.csv(300, 11)).isNotEqualTo(scenario.csv(300, 12));
  }

  @Test
  void loadsAsTwentyFourNumericFeaturesWithEveryGesturePresent() throws Exception {
    Path file = dir.resolve("g.csv");
    scenario.writeCsv(file, GestureBandScenario.DEFAULT_ROWS, 11);

    Dataset data = CsvLoader.load(file).dataset();

    assertThat(data.rows()).isEqualTo(2_500);
    assertThat(data.schema().featureCount()).isEqualTo(24);
    assertThat(data.schema().featureNames())
        .startsWith("acc_x_mean", "acc_x_var", "acc_x_p2p", "acc_x_zc")
        .endsWith("gyr_z_zc");
    assertThat(data.schema().features()).allMatch(f -> f.kind() == FeatureKind.NUMERIC);
    assertThat(data.schema().target()).isEqualTo("gesture");
    assertThat(data.schema().classes())
        .containsExactlyInAnyOrderElementsOf(GestureBandScenario.GESTURES);
    assertThat(java.util.Arrays.stream(data.classCounts()).min().orElseThrow()).isGreaterThan(200);
  }

  @Test
  void mislabelsAboutTheConfiguredShareOfWindows() {
    List<DemoRow> rows = new GestureBandScenario(0.1).generate(10_000, 3);

    double rate = rows.stream().filter(DemoRow::mislabelled).count() / 10_000.0;
    // Binomial standard deviation sqrt(0.1 * 0.9 / 10000) = 0.003.
    assertThat(rate).isBetween(0.09, 0.11);
  }

  @Test
  void idleBandReadsOneGOfGravity() {
    DemoRandom random = new DemoRandom(4);
    for (int i = 0; i < 50; i++) {
      double[][] window = GestureBandScenario.simulate(0, random);
      // At rest an accelerometer measures 1 g, whatever its orientation (physics).
      double x = mean(window[0]);
      double y = mean(window[1]);
      double z = mean(window[2]);
      assertThat(Math.sqrt(x * x + y * y + z * z)).isBetween(0.98, 1.02);
    }
  }

  @Test
  void raiseTurnsTheGravityVectorByTheIntegratedAngle() {
    DemoRandom random = new DemoRandom(8);
    for (int i = 0; i < 50; i++) {
      double[][] w = GestureBandScenario.simulate(4, random);
      double[] before = {w[0][0], w[1][0], w[2][0]};
      double[] after = {w[0][49], w[1][49], w[2][49]};
      double turned = angleDegrees(before, after);
      double integrated = 0;
      for (int k = 0; k < 49; k++) {
        double wx = w[3][k];
        double wy = w[4][k];
        integrated += Math.sqrt(wx * wx + wy * wy) / GestureBandScenario.SAMPLE_RATE_HZ;
      }
      // The turn is 50-90 degrees by construction; noise and the lift jolt blur the endpoints.
      assertThat(turned).isBetween(40.0, 100.0);
      assertThat(turned).isCloseTo(integrated, org.assertj.core.data.Offset.offset(25.0));
    }
  }

  @Test
  void shakeCrossesItsMeanAboutTwiceAPeriod() {
    List<DemoRow> rows = new GestureBandScenario(0).generate(3_000, 6);
    int accYCrossings = GestureBandScenario.FEATURES.indexOf("acc_y_zc");

    // Shaking at 4-7 Hz for one second crosses the mean 2 * f = 8-14 times (worked by hand).
    assertThat(rows.stream().filter(r -> r.trueLabel().equals("shake")))
        .allSatisfy(
            r -> assertThat(Integer.parseInt(r.cells().get(accYCrossings))).isBetween(6, 16));
  }

  @Test
  void computesFeaturesOfAKnownWindow() {
    double[][] window = new double[6][50];
    for (int k = 0; k < 50; k++) {
      window[0][k] = k % 2 == 0 ? 1 : -1; // square wave: mean 0, variance 1, 49 crossings
      window[1][k] = 0.5; // constant: no crossings
      // Ramp 0..49: mean 24.5, variance (50^2 - 1) / 12 = 208.25 (rounded half-even to 208.2),
      // one crossing.
      window[3][k] = k;
    }

    List<String> cells = GestureBandScenario.features(window);

    assertThat(cells.subList(0, 4)).containsExactly("0.000", "1.00000", "2.000", "49");
    assertThat(cells.subList(4, 8)).containsExactly("0.500", "0.00000", "0.000", "0");
    assertThat(cells.subList(12, 16)).containsExactly("24.5", "208.2", "49.0", "1");
  }

  private static double mean(double[] x) {
    double sum = 0;
    for (double v : x) {
      sum += v;
    }
    return sum / x.length;
  }

  private static double angleDegrees(double[] a, double[] b) {
    double dot = a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
    double na = Math.sqrt(a[0] * a[0] + a[1] * a[1] + a[2] * a[2]);
    double nb = Math.sqrt(b[0] * b[0] + b[1] * b[1] + b[2] * b[2]);
    return Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, dot / (na * nb)))));
  }
}
