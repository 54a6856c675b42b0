package dev.splitwright.bench;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.demo.DemoRow;
import dev.splitwright.demo.PumpVibrationScenario;
import dev.splitwright.train.TrainingOptions;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * The trees the prediction benchmark measures: what each is trained on, at which depth, and the
 * fresh readings (never seen in training) it is asked about.
 */
enum BenchModel {
  /** The pump demo: the committed 3,000-row CSV, depth 6. */
  PUMP("pump", 6),
  /** A deep tree: 200,000 x 16 synthetic rows, depth 14 (thousands of leaves). */
  SYNTHETIC("synthetic", 14),
  /** The same synthetic rows at depth 10: a mid-sized tree between the other two. */
  SYNTHETIC_10("synthetic10", 10);

  /** Distinct input rows per benchmark: 16 times the cycle a branch predictor can learn. */
  static final int INPUT_ROWS = 65_536;

  /** Rows and seed of the synthetic training set (also the training benchmark's set). */
  static final int SYNTHETIC_ROWS = 200_000;
  static final int SYNTHETIC_FEATURES = 16;
  static final long SYNTHETIC_SEED = 20_261_201L;

  /** The system property that overrides where the pump demo CSV is read from. */
  static final String PUMP_CSV_PROPERTY = "splitwright.bench.pumpCsv";
  static final String PUMP_CSV_DEFAULT = "compiler/demo-data/pump-vibration.csv";

  /** Seeds of the fresh readings; the committed pump CSV uses seed 7. */
  private static final long PUMP_READINGS_SEED = 8;
  private static final long SYNTHETIC_READINGS_SEED = SYNTHETIC_SEED + 1;
  private static final long SHUFFLE_SEED = 3;

  private final String paramName;
  private final int depth;

  BenchModel(String paramName, int depth) {
    this.paramName = paramName;
    this.depth = depth;
  }

  String paramName() {
    return paramName;
  }

  /** Depth limit for our trainer and for REPTree's {@code -L}. */
  int depth() {
    return depth;
  }

  static BenchModel ofParam(String name) {
    for (BenchModel model : values()) {
      if (model.paramName.equals(name)) {
        return model;
      }
    }
    throw new IllegalArgumentException(String.format(Locale.ROOT,
        "unknown model '%s'; use one of %s", name,
        Arrays.stream(values()).map(BenchModel::paramName).toList()));
  }

  TrainingOptions trainingOptions() {
    return TrainingOptions.builder().maxDepth(depth).build();
  }

  /** The rows every learner is trained on. */
  Dataset trainingSet() {
    return switch (this) {
      case PUMP -> loadPumpCsv();
      case SYNTHETIC, SYNTHETIC_10 -> syntheticTrainingSet();
    };
  }

  static Dataset syntheticTrainingSet() {
    return SyntheticTable.generate(SYNTHETIC_ROWS, SYNTHETIC_FEATURES, SYNTHETIC_SEED);
  }

  /**
   * {@link #INPUT_ROWS} fresh independent readings in logged order, with their labels. The pump
   * readings are coded with {@code training}'s schema; the synthetic ones ignore it (may be null).
   */
  LabelledRows freshReadings(Dataset training) {
    return switch (this) {
      case PUMP -> pumpReadings(training);
      case SYNTHETIC, SYNTHETIC_10 -> {
        Dataset d = SyntheticTable.generate(INPUT_ROWS, SYNTHETIC_FEATURES,
            SYNTHETIC_READINGS_SEED);
        float[][] rows = new float[d.rows()][];
        for (int r = 0; r < rows.length; r++) {
          rows[r] = d.row(r);
        }
        yield new LabelledRows(rows, d.labels());
      }
    };
  }

  /** The benchmark's input rows: fresh readings in the given order. */
  LabelledRows inputs(Dataset training, InputOrder order) {
    return order.arrange(freshReadings(training), INPUT_ROWS, SHUFFLE_SEED);
  }

  private static Dataset loadPumpCsv() {
    Path csv = Path.of(System.getProperty(PUMP_CSV_PROPERTY, PUMP_CSV_DEFAULT));
    if (!Files.isRegularFile(csv)) {
      throw new IllegalStateException("pump demo CSV not found at " + csv.toAbsolutePath()
          + ": run from the repository root or set -D" + PUMP_CSV_PROPERTY + "=<file>");
    }
    try {
      LoadOptions options = LoadOptions.builder().target(PumpVibrationScenario.TARGET).build();
      return CsvLoader.load(csv, options).dataset();
    } catch (InputException e) {
      throw new IllegalStateException("cannot load the pump demo CSV: " + e.getMessage(), e);
    }
  }

  private static LabelledRows pumpReadings(Dataset training) {
    List<String> names = training.schema().featureNames();
    if (!names.equals(PumpVibrationScenario.FEATURES)) {
      throw new IllegalStateException("pump CSV columns " + names + " differ from the scenario's "
          + PumpVibrationScenario.FEATURES);
    }
    List<String> classes = training.schema().classes();
    try {
      return BenchStore.fromSystemProperty().readings("pump-readings", INPUT_ROWS,
          PUMP_READINGS_SEED, n -> pumpReadings(classes, n));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Generates the readings, formatted as the scenario writes them and parsed back. */
  private static LabelledRows pumpReadings(List<String> classes, int count) {
    List<String> names = PumpVibrationScenario.FEATURES;
    List<DemoRow> generated = new PumpVibrationScenario().generate(count, PUMP_READINGS_SEED);
    float[][] rows = new float[generated.size()][];
    int[] labels = new int[generated.size()];
    for (int r = 0; r < rows.length; r++) {
      DemoRow row = generated.get(r);
      float[] x = new float[names.size()];
      for (int f = 0; f < x.length; f++) {
        String cell = row.cells().get(f);
        x[f] = cell.isEmpty() ? Float.NaN : Float.parseFloat(cell);
      }
      rows[r] = x;
      labels[r] = classes.indexOf(row.loggedLabel());
      if (labels[r] < 0) {
        throw new IllegalStateException("label " + row.loggedLabel() + " not in " + classes);
      }
    }
    return new LabelledRows(rows, labels);
  }
}
