package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.PrunedTree;
import dev.splitwright.train.PruningPath;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Grows one tree per depth limit (1 to D) and leaf size, takes each tree's whole cost-complexity
 * pruning path, and keeps every distinct subtree once, with the first settings that produced it:
 * depth limits ascending, then leaf sizes ascending, then alphas ascending.
 */
final class CandidateGenerator {
  private CandidateGenerator() {}

  /** Settings tried and the distinct trees they gave. */
  record Result(int settingsTried, List<DistinctTree> trees) {
    Result {
      trees = List.copyOf(trees);
    }
  }

  static Result generate(Dataset fitData, SearchSettings settings, SearchProgress progress) {
    Grower grower = new Grower(fitData, settings);
    double[] weights = grower.weights();
    Map<DecisionTree, DistinctTree> distinct = new LinkedHashMap<>();
    int tried = 0;
    int grids = settings.maxDepth() * settings.minLeafs().size();
    int grown = 0;
    for (int depth = 1; depth <= settings.maxDepth(); depth++) {
      for (int minLeaf : settings.minLeafs()) {
        List<PrunedTree> path = PruningPath.of(grower.grow(depth, minLeaf), weights);
        for (int k = 0; k < path.size(); k++) {
          double next = k + 1 < path.size() ? path.get(k + 1).alpha() : Double.POSITIVE_INFINITY;
          CandidateRecipe recipe = new CandidateRecipe(depth, minLeaf, path.get(k).alpha(), next);
          DecisionTree tree = path.get(k).tree();
          if (!distinct.containsKey(tree)) {
            distinct.put(tree, new DistinctTree(distinct.size(), recipe, tree));
          }
          tried++;
        }
        progress.update("growing", ++grown, grids);
      }
    }
    return new Result(tried, new ArrayList<>(distinct.values()));
  }

  /** Refits {@code recipe} on {@code data}: grows with its limits, prunes at its alpha. */
  static DecisionTree refit(Dataset data, SearchSettings settings, CandidateRecipe recipe) {
    Grower grower = new Grower(data, settings);
    return PruningPath.prune(grower.grow(recipe.maxDepth(), recipe.minLeaf()),
        grower.weights(), recipe.representativeAlpha());
  }
}
