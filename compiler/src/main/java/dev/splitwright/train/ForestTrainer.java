package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * Trains a voting forest (Breiman 2001, "Random Forests"): each tree is a CART tree grown on a
 * bootstrap sample of the training rows (as many draws as rows, with replacement), and each of its
 * nodes searches only a fresh random subset of the features ({@link FeatureSampler}). The trees
 * are capped by the depth, leaf and leaf-size limits of {@link ForestOptions#tree()}; there is no
 * pruning. A tree's node counts count its sample's rows, repeats included.
 *
 * <p>Deterministic: the generator seeded with {@link ForestOptions#seed()} is split once per tree
 * in tree order ({@link SplittableRandom#split()}), and that tree's stream draws first its sample,
 * then its features, in the grower's fixed node order. The training rows are sorted once, and each
 * tree's sorted columns are copied from them by {@link SortedColumns#resample}.
 */
public final class ForestTrainer {
  private ForestTrainer() {}

  /**
   * Trains a forest on every row of {@code train}.
   *
   * @throws IllegalArgumentException if {@code train} has no rows or no features, or the class
   *     weights name a label the schema lacks
   */
  public static TreeEnsemble train(Dataset train, ForestOptions options) {
    Objects.requireNonNull(train, "train");
    Objects.requireNonNull(options, "options");
    int n = train.rows();
    if (n == 0) {
      throw new IllegalArgumentException("cannot train on a data set with no rows");
    }
    int features = train.featureCount();
    int perNode = options.featuresFor(features);
    double[] classWeights = options.tree().weights().resolve(train);
    int[] labels = train.labels();
    SortedColumns sorted = SortedColumns.of(train);
    SplittableRandom root = new SplittableRandom(options.seed());
    List<DecisionTree> trees = new ArrayList<>(options.trees());
    for (int t = 0; t < options.trees(); t++) {
      SplittableRandom random = root.split();
      int[] copies = new int[n];
      int[] counts = new int[train.schema().classCount()];
      for (int i = 0; i < n; i++) {
        int row = random.nextInt(n);
        copies[row]++;
        counts[labels[row]]++;
      }
      // Drawing every feature would only reorder them and with it the ties: search all, as CART.
      FeatureSampler sampler =
          perNode < features ? new FeatureSampler(features, perNode, random) : null;
      trees.add(new TreeGrower(train.schema(), sorted.resample(copies, n), counts, n,
          options.tree(), classWeights, sampler).grow());
    }
    return TreeEnsemble.forest(trees);
  }
}
