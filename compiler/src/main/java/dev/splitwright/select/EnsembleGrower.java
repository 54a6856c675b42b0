package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.train.BoostingOptions;
import dev.splitwright.train.BoostingTrainer;
import dev.splitwright.train.ForestOptions;
import dev.splitwright.train.ForestTrainer;
import dev.splitwright.train.TrainingOptions;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Trains the search's ensembles. Both trainers draw tree t's randomness from the t-th split of one
 * seeded generator and boosting's rounds are sequential, so the first k trees of an ensemble of n
 * are exactly the ensemble of k: one ensemble of the largest size wanted is trained per kind,
 * depth and leaf size, and every smaller size is its prefix.
 */
final class EnsembleGrower {
  private EnsembleGrower() {}

  /**
   * The ensembles of {@code kind} of every size in {@code settings.ensembleSizes()} up to {@code
   * mostTrees} that training reached, ascending by size.
   */
  static List<TreeEnsemble> grow(Dataset rows, SearchSettings settings, ModelKind kind,
      int maxDepth, int minLeaf, int mostTrees) {
    TreeEnsemble largest = train(rows, settings, kind, mostTrees, maxDepth, minLeaf);
    List<TreeEnsemble> ensembles = new ArrayList<>();
    for (int size : settings.ensembleSizes()) {
      if (size <= largest.treeCount()) {
        ensembles.add(prefix(largest, size));
      }
    }
    return ensembles;
  }

  /** The ensemble of {@code recipe}, trained on {@code rows}. */
  static TreeEnsemble refit(Dataset rows, SearchSettings settings, CandidateRecipe recipe) {
    return train(rows, settings, recipe.kind(), recipe.trees(), recipe.maxDepth(),
        recipe.minLeaf());
  }

  /** An ensemble of {@code trees} trees, or fewer if boosting stops early. */
  static TreeEnsemble train(Dataset rows, SearchSettings settings, ModelKind kind,
      int trees, int maxDepth, int minLeaf) {
    TrainingOptions tree = settings.training().toBuilder().maxDepth(maxDepth).minLeaf(minLeaf)
        .build();
    return switch (kind) {
      case FOREST -> ForestTrainer.train(rows, ForestOptions.of(trees, settings.seed(), tree));
      case BOOSTED ->
          BoostingTrainer.train(rows, new BoostingOptions(trees, settings.seed(), tree));
      case TREE -> throw new IllegalArgumentException("a single tree is not an ensemble");
    };
  }

  /** The first {@code size} trees of {@code e} (all of them if it has no more). */
  static TreeEnsemble prefix(TreeEnsemble e, int size) {
    if (size >= e.treeCount()) {
      return e;
    }
    if (e.kind() == TreeEnsemble.Kind.FOREST) {
      return TreeEnsemble.forest(e.trees().subList(0, size));
    }
    float[] weights = new float[size];
    for (int t = 0; t < size; t++) {
      weights[t] = e.weight(t);
    }
    return TreeEnsemble.boosted(e.trees().subList(0, size), Arrays.copyOf(weights, size));
  }
}
