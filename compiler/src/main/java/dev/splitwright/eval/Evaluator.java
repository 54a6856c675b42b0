package dev.splitwright.eval;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.Classifier;

/** Scores a tree or an ensemble on a data set. */
public final class Evaluator {
  private Evaluator() {}

  /** Predicts every row of {@code data} and scores the predictions. */
  public static Scores score(Classifier tree, Dataset data) {
    int k = tree.schema().classCount();
    int[][] confusion = new int[k][k];
    float[] x = new float[data.featureCount()];
    for (int r = 0; r < data.rows(); r++) {
      for (int f = 0; f < x.length; f++) {
        x[f] = data.value(r, f);
      }
      confusion[data.label(r)][tree.predict(x)]++;
    }
    return Scores.fromConfusion(confusion);
  }
}
