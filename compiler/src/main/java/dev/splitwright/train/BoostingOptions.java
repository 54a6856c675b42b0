package dev.splitwright.train;

import dev.splitwright.model.TreeEnsemble;
import java.util.Objects;

/**
 * Settings for {@link BoostingTrainer}.
 *
 * @param trees the most boosting rounds, 1 to {@link TreeEnsemble#MAX_TREES}; training may stop
 *     earlier (see {@link BoostingTrainer})
 * @param seed the seed of the weighted resampling
 * @param tree the limits and impurity of each tree (shallow trees: a small depth); its class
 *     weights set the rows' starting weights
 */
public record BoostingOptions(int trees, long seed, TrainingOptions tree) {

  public BoostingOptions {
    if (trees < 1 || trees > TreeEnsemble.MAX_TREES) {
      throw new IllegalArgumentException(
          "trees must be from 1 to " + TreeEnsemble.MAX_TREES + ", but it is " + trees);
    }
    Objects.requireNonNull(tree, "tree");
  }
}
