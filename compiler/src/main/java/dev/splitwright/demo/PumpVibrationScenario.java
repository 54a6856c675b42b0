package dev.splitwright.demo;

import java.util.List;

/**
 * An invented field log of a centrifugal pump's vibration monitor: one row every 10 minutes, in
 * logged order, with the state a technician later assigned.
 *
 * <p>The model behind it, per row: an ambient temperature with a daily cycle, a flow demand
 * ("load"), and a state drawn with unequal frequencies. Each state shifts the readings the way the
 * fault is known to (common practice in vibration analysis): imbalance raises velocity RMS at
 * running speed while the near-sinusoidal signal keeps crest factor and kurtosis low; misalignment
 * raises RMS less and warms the bearing through the coupling; bearing wear gives impulsive signals
 * (high crest factor and kurtosis) and heat; cavitation gives broadband high-frequency acceleration
 * and an unsteady, lower motor current. The distributions overlap, a few labels are wrong, and
 * about 0.4% of temperature readings are missing (thermocouple dropouts).
 */
public final class PumpVibrationScenario extends DemoScenario {

  /** Name used by {@link DemoData}. */
  public static final String NAME = "pump-vibration";

  public static final int DEFAULT_ROWS = 3_000;

  /** Share of rows whose logged state is a different, wrong state. */
  public static final double DEFAULT_LABEL_NOISE = 0.03;

  /** Share of rows whose bearing temperature is missing. */
  public static final double TEMPERATURE_DROPOUT = 0.004;

  public static final List<String> FEATURES =
      List.of(
          "vibration_rms_mm_s",
          "peak_accel_g",
          "crest_factor",
          "kurtosis",
          "bearing_temp_c",
          "motor_current_a");

  public static final String TARGET = "state";

  public static final List<String> STATES =
      List.of("normal", "imbalance", "misalignment", "bearing_wear", "cavitation");

  /** How often each state occurs, in {@link #STATES} order. */
  static final double[] STATE_FREQUENCIES = {0.52, 0.14, 0.12, 0.12, 0.10};

  private static final int NORMAL = 0;
  private static final int IMBALANCE = 1;
  private static final int MISALIGNMENT = 2;
  private static final int BEARING_WEAR = 3;
  private static final int CAVITATION = 4;

  private static final double MINUTES_PER_ROW = 10;

  /** A scenario with {@link #DEFAULT_LABEL_NOISE}. */
  public PumpVibrationScenario() {
    this(DEFAULT_LABEL_NOISE);
  }

  /**
   * @param labelNoise share of rows logged with a wrong state, in [0, 1)
   */
  public PumpVibrationScenario(double labelNoise) {
    super(FEATURES, TARGET, labelNoise);
  }

  @Override
  DemoRow row(DemoRandom random, int index) {
    double hourOfDay = (index * MINUTES_PER_ROW / 60.0) % 24.0;
    // Warmest mid-afternoon, coolest before dawn.
    double ambient =
        24 + 6 * StrictMath.sin(2 * StrictMath.PI * (hourOfDay - 9) / 24) + random.normal(0, 0.8);
    double load = clamp(random.normal(0.75, 0.12), 0.45, 1.0);
    int state = random.pick(STATE_FREQUENCIES);

    double rms;
    double accelRms;
    double crest;
    double kurtosis;
    double heat;
    double current;
    switch (state) {
      case NORMAL -> {
        rms = random.logNormal(1.2 + 0.5 * load, 0.28);
        accelRms = random.logNormal(0.12, 0.3);
        crest = random.normal(3.1, 0.25);
        kurtosis = 3 + 1.1 * (crest - 3.1) + random.normal(0, 0.35);
        heat = 0;
        current = random.normal(0, 0.5);
      }
      case IMBALANCE -> {
        rms = random.logNormal(4.0, 0.35);
        accelRms = random.logNormal(0.16, 0.3);
        crest = random.normal(2.6, 0.25);
        kurtosis = random.normal(2.4, 0.25);
        heat = 3;
        current = random.normal(0.4, 0.6);
      }
      case MISALIGNMENT -> {
        rms = random.logNormal(3.1, 0.3);
        accelRms = random.logNormal(0.2, 0.3);
        crest = random.normal(3.2, 0.3);
        kurtosis = 3 + 1.1 * (crest - 3.1) + random.normal(0, 0.4);
        heat = 8;
        current = random.normal(1.2, 0.6);
      }
      case BEARING_WEAR -> {
        rms = random.logNormal(2.2, 0.35);
        accelRms = random.logNormal(0.35, 0.4);
        crest = random.normal(5.2, 0.9);
        kurtosis = 3 + 1.3 * (crest - 3.1) + random.normal(0, 0.8);
        heat = 15;
        current = random.normal(0.6, 0.6);
      }
      case CAVITATION -> {
        rms = random.logNormal(2.6, 0.35);
        accelRms = random.logNormal(0.6, 0.35);
        crest = random.normal(4.3, 0.7);
        kurtosis = 3.4 + 0.8 * (crest - 3.1) + random.normal(0, 0.5);
        heat = 1;
        current = random.normal(-1.5, 1.8);
      }
      default -> throw new IllegalStateException("state " + state);
    }
    // Floors at about a pure sine's values (crest factor sqrt(2), kurtosis 1.5), the least peaky
    // a pump's vibration gets; only stranger signals go lower, down to 1 for both (a square wave).
    crest = Math.max(crest, 1.45);
    kurtosis = Math.max(kurtosis, 1.6);
    double peakAccel = crest * accelRms;
    double bearingTemp = ambient + 18 + 10 * load + heat + random.normal(0, 2.0);
    double motorCurrent = 9 + 13 * load + current;
    boolean dropout = random.chance(TEMPERATURE_DROPOUT);
    int logged = random.noisyLabel(state, STATES.size(), labelNoise);

    List<String> cells =
        List.of(
            DemoCsv.decimal(Math.max(rms, 0.05), 2),
            DemoCsv.decimal(peakAccel, 3),
            DemoCsv.decimal(crest, 2),
            DemoCsv.decimal(kurtosis, 2),
            dropout ? "" : DemoCsv.decimal(bearingTemp, 1),
            DemoCsv.decimal(Math.max(motorCurrent, 0.5), 2));
    return new DemoRow(cells, STATES.get(state), STATES.get(logged));
  }

  private static double clamp(double value, double low, double high) {
    return Math.max(low, Math.min(high, value));
  }
}
