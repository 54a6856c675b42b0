package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/** Seeded synthetic tables for tests and timing: noisy non-linear classes, no outside data. */
final class SyntheticData {
  private SyntheticData() {}

  /**
   * Generates {@code rows} rows of {@code numeric} Gaussian features and {@code categorical}
   * features with {@code categories} codes each; {@code missingRate} of the cells are missing.
   */
  static Dataset generate(
      int rows,
      int numeric,
      int categorical,
      int categories,
      int classes,
      double missingRate,
      long seed) {
    Random random = new Random(seed);
    List<Feature> features = new ArrayList<>();
    for (int f = 0; f < numeric; f++) {
      features.add(Feature.numeric("x" + f));
    }
    List<String> codes = new ArrayList<>();
    for (int c = 0; c < categories; c++) {
      codes.add("c" + c);
    }
    for (int f = 0; f < categorical; f++) {
      features.add(Feature.categorical("k" + f, codes));
    }
    List<String> labels = new ArrayList<>();
    for (int c = 0; c < classes; c++) {
      labels.add("class" + c);
    }
    Schema schema = new Schema(features, "label", labels);
    int width = numeric + categorical;
    float[][] columns = new float[width][rows];
    int[] y = new int[rows];
    double[] categoryEffect = new double[categories];
    for (int c = 0; c < categories; c++) {
      categoryEffect[c] = random.nextGaussian();
    }
    for (int r = 0; r < rows; r++) {
      double[] x = new double[Math.max(numeric, 5)];
      for (int f = 0; f < numeric; f++) {
        // Two decimals: many ties, like real sensor readings.
        float v = (float) (Math.round(random.nextGaussian() * 100) / 100.0);
        columns[f][r] = v;
        x[f] = v;
      }
      // A few features matter a lot, the rest a little.
      double score = 3 * Math.sin(2 * x[0]) + 0.7 * x[1] * x[2] + 0.5 * x[3] - 0.3 * x[4] * x[4];
      for (int f = 5; f < numeric; f++) {
        score += 0.03 * x[f];
      }
      for (int f = 0; f < categorical; f++) {
        int code = random.nextInt(categories);
        columns[numeric + f][r] = code;
        score += categoryEffect[code] * (f % 2 == 0 ? 1 : -0.5);
      }
      score += 0.2 * random.nextGaussian();
      // Class by interleaved bands of the score, so more than one split is needed per class.
      int label = (int) Math.floor(score / 1.5) % classes;
      y[r] = label < 0 ? label + classes : label;
      for (int f = 0; f < width; f++) {
        if (missingRate > 0 && random.nextDouble() < missingRate) {
          columns[f][r] = Float.NaN;
        }
      }
    }
    return Dataset.of(schema, columns, y);
  }
}
