package dev.splitwright.demo;

import java.util.ArrayList;
import java.util.List;

/**
 * An invented log of a wrist-worn gesture band: each row summarises a one-second window of 50
 * samples at 50 Hz from a 3-axis accelerometer (g) and a 3-axis gyroscope (degrees per second),
 * with the gesture the wearer was asked to make. Rows are in logged order.
 *
 * <p>Each window is simulated sample by sample: the band's orientation is integrated from the
 * angular rate, the accelerometer reads the gravity direction in the band's frame (1 g at rest)
 * plus the gesture's own linear acceleration, and both sensors add noise, a per-window gyro bias
 * and their range limits (±8 g, ±2000 °/s). The 24 features are, per axis, the mean, the variance,
 * the peak-to-peak range and the number of crossings of the window mean.
 */
public final class GestureBandScenario extends DemoScenario {

  /** Name used by {@link DemoData}. */
  public static final String NAME = "gesture-band";

  public static final int DEFAULT_ROWS = 2_500;

  /** Share of windows logged with a wrong gesture (a missed cue, a late start). */
  public static final double DEFAULT_LABEL_NOISE = 0.02;

  public static final int SAMPLES = 50;
  public static final double SAMPLE_RATE_HZ = 50;

  public static final String TARGET = "gesture";

  public static final List<String> GESTURES =
      List.of("idle", "wrist_flick", "double_tap", "shake", "raise");

  /** How often each gesture occurs, in {@link #GESTURES} order. */
  static final double[] GESTURE_FREQUENCIES = {0.34, 0.17, 0.15, 0.14, 0.20};

  static final List<String> AXES = List.of("acc_x", "acc_y", "acc_z", "gyr_x", "gyr_y", "gyr_z");

  public static final List<String> FEATURES = featureNames();

  private static final int IDLE = 0;
  private static final int WRIST_FLICK = 1;
  private static final int DOUBLE_TAP = 2;
  private static final int SHAKE = 3;
  private static final int RAISE = 4;

  private static final double DT = 1 / SAMPLE_RATE_HZ;
  private static final double ACCEL_RANGE_G = 8;
  private static final double GYRO_RANGE_DPS = 2000;
  private static final double ACCEL_NOISE_G = 0.015;
  private static final double GYRO_NOISE_DPS = 1.5;

  /** A scenario with {@link #DEFAULT_LABEL_NOISE}. */
  public GestureBandScenario() {
    this(DEFAULT_LABEL_NOISE);
  }

  /**
   * @param labelNoise share of windows logged with a wrong gesture, in [0, 1)
   */
  public GestureBandScenario(double labelNoise) {
    super(FEATURES, TARGET, labelNoise);
  }

  private static List<String> featureNames() {
    List<String> names = new ArrayList<>();
    for (String axis : AXES) {
      for (String stat : List.of("mean", "var", "p2p", "zc")) {
        names.add(axis + "_" + stat);
      }
    }
    return List.copyOf(names);
  }

  /** One window: a gesture, its simulated samples and the logged label. */
  @Override
  DemoRow row(DemoRandom random, int index) {
    int gesture = random.pick(GESTURE_FREQUENCIES);
    double[][] window = simulate(gesture, random);
    int logged = random.noisyLabel(gesture, GESTURES.size(), labelNoise);
    return new DemoRow(features(window), GESTURES.get(gesture), GESTURES.get(logged));
  }

  /**
   * Simulates one window; returns {@code [axis][sample]} with axes in {@link #AXES} order. Visible
   * to tests, which check the raw signals against physics.
   */
  static double[][] simulate(int gesture, DemoRandom random) {
    // Resting orientation: band roughly face up on a forearm held level, tilted a little.
    double[] up =
        normalize(random.normal(0.1, 0.15), random.normal(-0.2, 0.2), random.normal(0.95, 0.05));
    double strength = random.logNormal(1.0, 0.2); // wearers differ in vigour
    double[] bias = {random.normal(0, 1), random.normal(0, 1), random.normal(0, 1)};
    Motion motion = motion(gesture, random, strength);

    double[][] signals = new double[6][SAMPLES];
    for (int k = 0; k < SAMPLES; k++) {
      double t = k * DT;
      double[] rate = motion.rateDps(t);
      double[] linear = motion.linearG(t);
      for (int a = 0; a < 3; a++) {
        double accel = up[a] + linear[a] + random.normal(0, ACCEL_NOISE_G);
        signals[a][k] = clamp(accel, ACCEL_RANGE_G);
        double gyro = rate[a] + bias[a] + random.normal(0, GYRO_NOISE_DPS);
        signals[3 + a][k] = clamp(gyro, GYRO_RANGE_DPS);
      }
      up = rotate(up, rate, DT);
    }
    return signals;
  }

  /** The wearer's movement: angular rate and linear acceleration over the window. */
  private interface Motion {
    double[] rateDps(double t);

    double[] linearG(double t);
  }

  private static Motion motion(int gesture, DemoRandom random, double strength) {
    return switch (gesture) {
      case IDLE -> idle(random);
      case WRIST_FLICK -> flick(random, strength);
      case DOUBLE_TAP -> doubleTap(random, strength);
      case SHAKE -> shake(random, strength);
      case RAISE -> raise(random, strength);
      default -> throw new IllegalStateException("gesture " + gesture);
    };
  }

  /** Slow drift and physiological tremor (8–12 Hz, a fraction of a degree per second). */
  private static Motion idle(DemoRandom random) {
    double[] drift = {random.normal(0, 2), random.normal(0, 2), random.normal(0, 2)};
    double tremorHz = random.uniform(8, 12);
    double tremor = random.uniform(0.2, 1.0);
    double phase = random.uniform(0, 2 * StrictMath.PI);
    return new Motion() {
      @Override
      public double[] rateDps(double t) {
        double w = tremor * StrictMath.sin(2 * StrictMath.PI * tremorHz * t + phase);
        return new double[] {drift[0] + w, drift[1] + 0.5 * w, drift[2]};
      }

      @Override
      public double[] linearG(double t) {
        return new double[3];
      }
    };
  }

  /** A quick twist about the forearm (x) axis and back: one full sine cycle of angular rate. */
  private static Motion flick(DemoRandom random, double strength) {
    double start = random.uniform(0.15, 0.55);
    double duration = random.uniform(0.18, 0.30);
    double peak = 450 * strength;
    return new Motion() {
      @Override
      public double[] rateDps(double t) {
        double s = (t - start) / duration;
        double wx = s >= 0 && s < 1 ? peak * StrictMath.sin(2 * StrictMath.PI * s) : 0;
        return new double[] {wx, 0.15 * wx, 0};
      }

      @Override
      public double[] linearG(double t) {
        double s = (t - start) / duration;
        // The band sits off the twist axis: a small tangential jolt.
        double ay = s >= 0 && s < 1 ? 0.6 * strength * StrictMath.cos(2 * StrictMath.PI * s) : 0;
        return new double[] {0, ay, 0};
      }
    };
  }

  /** Two taps on the band: short damped jolts along z, 0.18–0.35 s apart. */
  private static Motion doubleTap(DemoRandom random, double strength) {
    double first = random.uniform(0.1, 0.4);
    double second = first + random.uniform(0.18, 0.35);
    double amplitude = 2.2 * strength;
    double ringHz = random.uniform(12, 18);
    return new Motion() {
      @Override
      public double[] rateDps(double t) {
        double jolt = 30 * (pulse(t - first) + pulse(t - second));
        return new double[] {0.3 * jolt, jolt, 0};
      }

      @Override
      public double[] linearG(double t) {
        double az = amplitude * (ring(t - first) + 0.85 * ring(t - second));
        return new double[] {0.1 * az, 0, -az};
      }

      private double ring(double dt) {
        return dt < 0
            ? 0
            : StrictMath.exp(-dt / 0.02) * StrictMath.cos(2 * StrictMath.PI * ringHz * dt);
      }

      private double pulse(double dt) {
        return dt < 0 ? 0 : StrictMath.exp(-dt / 0.03);
      }
    };
  }

  /** Shaking the hand side to side at 4–7 Hz for the whole window. */
  private static Motion shake(DemoRandom random, double strength) {
    double hz = random.uniform(4, 7);
    double phase = random.uniform(0, 2 * StrictMath.PI);
    double accel = 1.3 * strength;
    double rate = 160 * strength;
    return new Motion() {
      @Override
      public double[] rateDps(double t) {
        double w = 2 * StrictMath.PI * hz * t + phase;
        return new double[] {0.2 * rate * StrictMath.sin(w), 0, rate * StrictMath.cos(w)};
      }

      @Override
      public double[] linearG(double t) {
        double w = 2 * StrictMath.PI * hz * t + phase;
        return new double[] {0.15 * accel * StrictMath.sin(2 * w), accel * StrictMath.sin(w), 0};
      }
    };
  }

  /** Raising the wrist to read the band: a smooth 50–90° turn about y over 0.4–0.8 s. */
  private static Motion raise(DemoRandom random, double strength) {
    double duration = random.uniform(0.4, 0.8);
    double start = random.uniform(0.05, 0.95 - duration); // the whole turn fits in the window
    double angle = random.uniform(50, 90);
    // Half-sine rate profile whose integral is the angle: peak = angle * pi / (2 * duration).
    double peak = angle * StrictMath.PI / (2 * duration);
    double lift = 0.35 * strength;
    return new Motion() {
      @Override
      public double[] rateDps(double t) {
        double s = (t - start) / duration;
        double wy = s >= 0 && s < 1 ? -peak * StrictMath.sin(StrictMath.PI * s) : 0;
        return new double[] {0.1 * wy, wy, 0};
      }

      @Override
      public double[] linearG(double t) {
        double s = (t - start) / duration;
        double ax = s >= 0 && s < 1 ? lift * StrictMath.sin(2 * StrictMath.PI * s) : 0;
        return new double[] {ax, 0, 0.5 * ax};
      }
    };
  }

  /**
   * Turns a world-fixed direction seen from the band by the band's own rotation: {@code du/dt =
   * -omega x u}, one Euler step, renormalised.
   */
  static double[] rotate(double[] u, double[] rateDps, double dt) {
    double wx = StrictMath.toRadians(rateDps[0]);
    double wy = StrictMath.toRadians(rateDps[1]);
    double wz = StrictMath.toRadians(rateDps[2]);
    double cx = wy * u[2] - wz * u[1];
    double cy = wz * u[0] - wx * u[2];
    double cz = wx * u[1] - wy * u[0];
    return normalize(u[0] - cx * dt, u[1] - cy * dt, u[2] - cz * dt);
  }

  private static double[] normalize(double x, double y, double z) {
    double norm = StrictMath.sqrt(x * x + y * y + z * z);
    return new double[] {x / norm, y / norm, z / norm};
  }

  private static double clamp(double value, double range) {
    return Math.max(-range, Math.min(range, value));
  }

  /** Mean, population variance, peak-to-peak and mean crossings of each axis, formatted. */
  static List<String> features(double[][] window) {
    List<String> cells = new ArrayList<>(24);
    for (int a = 0; a < window.length; a++) {
      double[] x = window[a];
      double sum = 0;
      double min = Double.POSITIVE_INFINITY;
      double max = Double.NEGATIVE_INFINITY;
      for (double v : x) {
        sum += v;
        min = Math.min(min, v);
        max = Math.max(max, v);
      }
      double mean = sum / x.length;
      double squares = 0;
      int crossings = 0;
      for (int k = 0; k < x.length; k++) {
        double d = x[k] - mean;
        squares += d * d;
        if (k > 0 && (x[k - 1] - mean) * d < 0) {
          crossings++;
        }
      }
      boolean accel = a < 3;
      cells.add(DemoCsv.decimal(mean, accel ? 3 : 1));
      cells.add(DemoCsv.decimal(squares / x.length, accel ? 5 : 1));
      cells.add(DemoCsv.decimal(max - min, accel ? 3 : 1));
      cells.add(Integer.toString(crossings));
    }
    return cells;
  }
}
