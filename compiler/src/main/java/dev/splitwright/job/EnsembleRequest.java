package dev.splitwright.job;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.train.BoostingOptions;
import dev.splitwright.train.BoostingTrainer;
import dev.splitwright.train.ForestOptions;
import dev.splitwright.train.ForestTrainer;
import dev.splitwright.train.TrainingOptions;
import java.util.Objects;

/**
 * Train an ensemble instead of one tree: its kind, how many trees and, for a forest, how many
 * features each split draws ({@link ForestOptions#AUTOMATIC} for Breiman's default). Each tree
 * gets the run's {@link TrainingOptions} (depth, leaf size, impurity, class weights).
 */
public record EnsembleRequest(TreeEnsemble.Kind kind, int trees, int featuresPerSplit) {

  public EnsembleRequest {
    Objects.requireNonNull(kind, "kind");
    if (trees < 1 || trees > TreeEnsemble.MAX_TREES) {
      throw new IllegalArgumentException(
          "trees must be from 1 to " + TreeEnsemble.MAX_TREES + ", but it is " + trees);
    }
    if (featuresPerSplit < 0) {
      throw new IllegalArgumentException(
          "featuresPerSplit must be at least 0 (automatic), but it is " + featuresPerSplit);
    }
    if (kind == TreeEnsemble.Kind.BOOSTED && featuresPerSplit != ForestOptions.AUTOMATIC) {
      throw new IllegalArgumentException("a boosted ensemble splits on every feature");
    }
  }

  /** Trains the ensemble on {@code train}, every random draw seeded with {@code seed}. */
  public TreeEnsemble train(Dataset train, long seed, TrainingOptions tree) {
    return switch (kind) {
      case FOREST -> ForestTrainer.train(train,
          new ForestOptions(trees, featuresPerSplit, seed, tree));
      case BOOSTED -> BoostingTrainer.train(train, new BoostingOptions(trees, seed, tree));
    };
  }
}
