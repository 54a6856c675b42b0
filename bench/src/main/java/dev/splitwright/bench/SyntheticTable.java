package dev.splitwright.bench;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A seeded synthetic sensor table, large and hard enough to grow deep trees with thousands of
 * leaves: four hidden factors drive the features (normal, log-normal, uniform and coarsely
 * quantised ones, so values repeat as with real sensor resolution), and the class is a
 * checkerboard of bands and curved boundaries over six of them, with 5% of labels wrong. An
 * axis-aligned tree can only approximate such boundaries with many small boxes, which is what the
 * prediction benchmark needs. Same arguments, same table.
 */
final class SyntheticTable {
  static final int CLASSES = 4;
  static final double LABEL_NOISE = 0.05;
  private static final int FACTORS = 4;

  private SyntheticTable() {}

  /** The schema: numeric features {@code s00, s01, ...} and classes {@code c0..c3}. */
  static Schema schema(int features) {
    if (features < 8) {
      throw new IllegalArgumentException("features must be at least 8, but it is " + features);
    }
    List<Feature> list = new ArrayList<>(features);
    for (int f = 0; f < features; f++) {
      list.add(Feature.numeric(String.format(Locale.ROOT, "s%02d", f)));
    }
    List<String> classes = new ArrayList<>(CLASSES);
    for (int c = 0; c < CLASSES; c++) {
      classes.add("c" + c);
    }
    return new Schema(list, "class", classes);
  }

  /** Generates {@code rows} rows of {@code features} (at least 8) columns from {@code seed}. */
  static Dataset generate(int rows, int features, long seed) {
    Schema schema = schema(features);
    if (rows < 1) {
      throw new IllegalArgumentException("rows must be positive, but it is " + rows);
    }
    BenchRandom random = new BenchRandom(seed);
    float[][] columns = new float[features][rows];
    int[] labels = new int[rows];
    double[] z = new double[FACTORS];
    double[] x = new double[features];
    for (int r = 0; r < rows; r++) {
      for (int k = 0; k < FACTORS; k++) {
        z[k] = random.gaussian();
      }
      for (int f = 0; f < features; f++) {
        x[f] = (float) feature(f, z, random);
        columns[f][r] = (float) x[f];
      }
      int label = hiddenClass(x);
      if (random.uniform() < LABEL_NOISE) {
        label = (label + 1 + random.below(CLASSES - 1)) % CLASSES;
      }
      labels[r] = label;
    }
    return Dataset.of(schema, columns, labels);
  }

  private static double feature(int f, double[] z, BenchRandom random) {
    double factor = z[(f / 4) % FACTORS];
    return switch (f % 4) {
      case 0 -> factor + 0.5 * random.gaussian();
      case 1 -> 10 * StrictMath.exp(0.5 * factor + 0.2 * random.gaussian());
      case 2 -> 100 * random.uniform();
      default -> StrictMath.rint(10 * factor * z[(f / 4 + 1) % FACTORS]) / 10;
    };
  }

  /** The noise-free class: a sum of band indices and curved half-planes, modulo the classes. */
  private static int hiddenClass(double[] x) {
    int bands = (int) StrictMath.floor(1.6 * x[0] + 0.8 * x[4]);
    int stripes = (int) StrictMath.floor(x[2] / 12.5);
    int curve = x[1] > 10 * StrictMath.exp(0.25 * x[5]) ? 2 : 0;
    int sign = x[3] > 0 ? 1 : 0;
    return Math.floorMod(bands + stripes + curve + sign, CLASSES);
  }
}
