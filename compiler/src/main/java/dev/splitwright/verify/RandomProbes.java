package dev.splitwright.verify;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Seeded random inputs that mix real feature values with values a few ulps from thresholds and
 * IEEE 754 specials, so comparisons are exercised off the data's own grid too.
 */
final class RandomProbes {
  private static final float[] SPECIALS = {
    Float.NaN, Float.POSITIVE_INFINITY, Float.NEGATIVE_INFINITY, 0.0f, -0.0f,
    Float.MIN_VALUE, -Float.MIN_VALUE, Float.MAX_VALUE, -Float.MAX_VALUE
  };

  private RandomProbes() {}

  static List<float[]> of(Classifier model, Dataset reference, int count, long seed) {
    Schema schema = model.schema();
    int n = schema.featureCount();
    List<List<Float>> thresholds = new ArrayList<>();
    for (int f = 0; f < n; f++) {
      thresholds.add(new ArrayList<>());
    }
    for (DecisionTree tree : Trees.of(model)) {
      for (Split split : tree.splitsPreOrder()) {
        if (split instanceof NumericSplit numeric) {
          thresholds.get(numeric.feature()).add(numeric.threshold());
        }
      }
    }
    SplittableRandom random = new SplittableRandom(seed);
    List<float[]> out = new ArrayList<>(count);
    for (int i = 0; i < count; i++) {
      float[] x = new float[n];
      for (int f = 0; f < n; f++) {
        x[f] = draw(schema.feature(f), thresholds.get(f), reference, f, random);
      }
      out.add(x);
    }
    return out;
  }

  private static float draw(Feature feature, List<Float> thresholds, Dataset reference, int f,
      SplittableRandom random) {
    int pick = random.nextInt(10);
    if (pick == 0) {
      return SPECIALS[random.nextInt(SPECIALS.length)];
    }
    if (feature.isCategorical()) {
      return random.nextInt(-1, feature.categories().size() + 1);
    }
    if (pick <= 3 && !thresholds.isEmpty()) {
      float t = thresholds.get(random.nextInt(thresholds.size()));
      for (int steps = random.nextInt(-2, 3); steps != 0; steps -= Integer.signum(steps)) {
        t = steps > 0 ? Math.nextUp(t) : Math.nextDown(t);
      }
      return t;
    }
    if (reference != null && reference.rows() > 0) {
      return reference.value(random.nextInt(reference.rows()), f);
    }
    return (float) random.nextGaussian() * 100f;
  }
}
