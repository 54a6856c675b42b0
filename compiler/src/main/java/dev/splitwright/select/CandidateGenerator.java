package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.train.PrunedTree;
import dev.splitwright.train.PruningPath;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Grows one tree per depth limit (1 to D) and leaf size, takes each tree's whole cost-complexity
 * pruning path, and keeps every distinct subtree once, with the first settings that produced it:
 * depth limits ascending, then leaf sizes ascending, then alphas ascending. Then, for each
 * ensemble kind searched, one ensemble per member depth ({@link SearchSettings#ensembleDepths()})
 * and tree count, at the smallest leaf size ({@link EnsembleGrower}).
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
    Map<Classifier, DistinctTree> distinct = new LinkedHashMap<>();
    int tried = 0;
    boolean trees = settings.kinds().contains(ModelKind.TREE);
    int ensembleKinds = settings.kinds().size() - (trees ? 1 : 0);
    int grids = (trees ? settings.maxDepth() * settings.minLeafs().size() : 0)
        + ensembleKinds * settings.ensembleDepths().size();
    int grown = 0;
    for (int depth = 1; trees && depth <= settings.maxDepth(); depth++) {
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
    int minLeaf = settings.minLeafs().get(0);
    for (ModelKind kind : settings.kinds()) {
      if (kind == ModelKind.TREE) {
        continue;
      }
      for (int depth : settings.ensembleDepths()) {
        for (TreeEnsemble e : EnsembleGrower.grow(fitData, settings, kind, depth, minLeaf)) {
          if (!distinct.containsKey(e)) {
            distinct.put(e, new DistinctTree(distinct.size(),
                CandidateRecipe.ensemble(kind, e.treeCount(), depth, minLeaf), e));
          }
          tried++;
        }
        progress.update("growing", ++grown, grids);
      }
    }
    return new Result(tried, new ArrayList<>(distinct.values()));
  }

  /**
   * Refits {@code recipe} on {@code data}: a tree grown with its limits and pruned at its alpha,
   * or an ensemble trained with its kind, limits and tree count.
   */
  static Classifier refit(Dataset data, SearchSettings settings, CandidateRecipe recipe) {
    if (recipe.kind() != ModelKind.TREE) {
      return EnsembleGrower.refit(data, settings, recipe);
    }
    Grower grower = new Grower(data, settings);
    return PruningPath.prune(grower.grow(recipe.maxDepth(), recipe.minLeaf()),
        grower.weights(), recipe.representativeAlpha());
  }
}
