package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * Trains a boosted ensemble by SAMME, the multiclass AdaBoost of Zhu, Zou, Rosset and Hastie
 * (2009), "Multi-class AdaBoost", Algorithm 2. Each round fits a shallow CART tree to the rows'
 * current weights, measures its weighted error {@code err} on all training rows, gives it the
 * weight {@code alpha = ln((1 - err) / err) + ln(K - 1)} for {@code K} classes, and multiplies the
 * weight of every row it gets wrong by {@code exp(alpha)}.
 *
 * <p>A tree is fitted to the weights by resampling (boosting by resampling, Freund and Schapire
 * 1996): it is grown on as many rows as there are, drawn with replacement with probability
 * proportional to their weights, so the unweighted CART trainer serves unchanged. Rounds stop
 * early when a tree is no better than chance ({@code err >= 1 - 1/K}, so {@code alpha <= 0}; the
 * tree is dropped unless it is the first, which is then kept with weight 1) or makes no error on
 * the training rows ({@code err = 0}; kept with the weight of {@code err = 1 / (2n)}, half a row,
 * since its own alpha would be infinite, and nothing is left to reweight).
 *
 * <p>Deterministic on every JDK: weights are updated with {@link StrictMath} in row order, the
 * resampling draws come from a {@link SplittableRandom} seeded with {@link BoostingOptions#seed()}
 * and split once per round, and the alphas are stored as float32 ({@link TreeEnsemble}).
 */
public final class BoostingTrainer {
  private BoostingTrainer() {}

  /**
   * Trains a boosted ensemble on every row of {@code train}.
   *
   * @throws IllegalArgumentException if {@code train} has no rows, or the class weights name a
   *     label the schema lacks
   */
  public static TreeEnsemble train(Dataset train, BoostingOptions options) {
    Objects.requireNonNull(train, "train");
    Objects.requireNonNull(options, "options");
    int n = train.rows();
    if (n == 0) {
      throw new IllegalArgumentException("cannot train on a data set with no rows");
    }
    int classes = train.schema().classCount();
    int[] labels = train.labels();
    double[] classWeights = options.tree().weights().resolve(train);
    double[] unit = new double[classes];
    Arrays.fill(unit, 1.0);
    // The class weights live in the rows' starting weights; the trees see plain resampled rows.
    TrainingOptions treeOptions = options.tree().toBuilder().weights(ClassWeights.none()).build();
    double[] weight = new double[n];
    for (int i = 0; i < n; i++) {
      weight[i] = classWeights[labels[i]];
    }
    float[][] rows = new float[n][];
    for (int i = 0; i < n; i++) {
      rows[i] = train.row(i);
    }
    SortedColumns sorted = SortedColumns.of(train);
    SplittableRandom root = new SplittableRandom(options.seed());
    double chance = 1.0 - 1.0 / classes;
    double lnClassesLess1 = classes > 1 ? StrictMath.log(classes - 1.0) : 0.0;
    List<DecisionTree> trees = new ArrayList<>();
    List<Float> alphas = new ArrayList<>();
    boolean[] wrong = new boolean[n];
    double[] cumulative = new double[n];
    for (int round = 0; round < options.trees(); round++) {
      SplittableRandom random = root.split();
      double total = 0;
      for (int i = 0; i < n; i++) {
        total += weight[i];
        cumulative[i] = total;
      }
      int[] copies = new int[n];
      int[] counts = new int[classes];
      for (int draw = 0; draw < n; draw++) {
        int row = firstAbove(cumulative, random.nextDouble() * total);
        copies[row]++;
        counts[labels[row]]++;
      }
      DecisionTree tree = new TreeGrower(train.schema(), sorted.resample(copies, n), counts, n,
          treeOptions, unit, null).grow();
      double wrongWeight = 0;
      for (int i = 0; i < n; i++) {
        wrong[i] = tree.predict(rows[i]) != labels[i];
        wrongWeight += wrong[i] ? weight[i] : 0;
      }
      double err = wrongWeight / total;
      if (err >= chance || classes == 1) {
        if (trees.isEmpty()) {
          trees.add(tree);
          alphas.add(1f);
        }
        break;
      }
      boolean perfect = wrongWeight == 0;
      double e = perfect ? 0.5 / n : err;
      float alpha = (float) (StrictMath.log((1 - e) / e) + lnClassesLess1);
      if (!(alpha > 0f)) {
        if (trees.isEmpty()) {
          trees.add(tree);
          alphas.add(1f);
        }
        break;
      }
      trees.add(tree);
      alphas.add(alpha);
      if (perfect) {
        break;
      }
      // Multiplying by exp(alpha) and renormalising so the weights sum to 1 keeps them in range.
      double factor = StrictMath.exp((double) alpha);
      double sum = 0;
      for (int i = 0; i < n; i++) {
        if (wrong[i]) {
          weight[i] *= factor;
        }
        sum += weight[i];
      }
      for (int i = 0; i < n; i++) {
        weight[i] /= sum;
      }
    }
    float[] w = new float[alphas.size()];
    for (int t = 0; t < w.length; t++) {
      w[t] = alphas.get(t);
    }
    return TreeEnsemble.boosted(trees, w);
  }

  /** The first index whose cumulative weight exceeds {@code u}, the last one if none does. */
  private static int firstAbove(double[] cumulative, double u) {
    int lo = 0;
    int hi = cumulative.length - 1;
    while (lo < hi) {
      int mid = (lo + hi) >>> 1;
      if (cumulative[mid] > u) {
        hi = mid;
      } else {
        lo = mid + 1;
      }
    }
    return lo;
  }
}
