package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.util.HashMap;
import java.util.Map;

/**
 * Grows the search's trees on one set of rows. Without a leaf cap the trainer splits every
 * splittable node whatever the order (see {@code TreeGrower}), so the tree grown to depth d is the
 * tree grown to depth D cut at d ({@link DepthCut}): one tree per leaf size is grown, not one per
 * depth and leaf size.
 */
final class Grower {
  private final Dataset rows;
  private final SearchSettings settings;
  private final double[] weights;
  private final boolean cut;
  private final Map<Integer, DecisionTree> deepest = new HashMap<>();

  Grower(Dataset rows, SearchSettings settings) {
    this.rows = rows;
    this.settings = settings;
    this.weights = settings.training().weights().resolve(rows);
    this.cut = settings.training().maxLeaves() == TrainingOptions.UNLIMITED_LEAVES;
  }

  /** The class weights resolved on these rows, as pruning needs them. */
  double[] weights() {
    return weights.clone();
  }

  /** The tree grown with these depth and leaf-size limits. */
  DecisionTree grow(int maxDepth, int minLeaf) {
    if (!cut || maxDepth > settings.maxDepth()) {
      return CartTrainer.train(rows, options(maxDepth, minLeaf));
    }
    DecisionTree full = deepest.computeIfAbsent(minLeaf,
        m -> CartTrainer.train(rows, options(settings.maxDepth(), m)));
    return DepthCut.cut(full, maxDepth, weights);
  }

  private TrainingOptions options(int maxDepth, int minLeaf) {
    return settings.training().toBuilder().maxDepth(maxDepth).minLeaf(minLeaf).build();
  }
}
