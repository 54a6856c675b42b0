package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.Classifier;
import dev.splitwright.train.PrunedTree;
import dev.splitwright.train.PruningPath;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * Grows one tree per depth limit (1 to D) and leaf size, takes each tree's whole cost-complexity
 * pruning path, and keeps every distinct subtree once, with the first settings that produced it:
 * depth limits ascending, then leaf sizes ascending, then alphas ascending. Each path is a {@link
 * TreeChain}. Then, for each ensemble kind searched, one {@link EnsembleChain} per member depth
 * ({@link SearchSettings#ensembleDepths()}) at the smallest leaf size, over the tree counts: those
 * are trained only when the search asks for them.
 */
final class CandidateGenerator {
  private CandidateGenerator() {}

  /**
   * The search's candidates as chains.
   *
   * @param settingsTried pruning-path entries over every depth and leaf-size limit, plus every
   *     ensemble kind, member depth and tree count
   * @param pool the distinct candidates built so far; the chains add to it as they are asked
   */
  record Chains(int settingsTried, List<CandidateChain> chains, CandidatePool pool) {
    Chains {
      chains = List.copyOf(chains);
    }
  }

  /** Settings tried and the distinct candidates they gave, all built. */
  record Result(int settingsTried, List<DistinctTree> trees) {
    Result {
      trees = List.copyOf(trees);
    }
  }

  /** Every candidate of the search, built; see {@link #chains} for the lazy form. */
  static Result generate(Dataset fitData, SearchSettings settings, SearchProgress progress) {
    Chains chains = chains(fitData, settings, progress);
    for (CandidateChain chain : chains.chains()) {
      chain.prepare(chain.length() - 1);
      for (int i = 0; i < chain.length(); i++) {
        chain.member(i);
      }
    }
    return new Result(chains.settingsTried(), chains.pool().all());
  }

  /** The trees grown and in chains; the ensembles in chains, not yet trained. */
  static Chains chains(Dataset fitData, SearchSettings settings, SearchProgress progress) {
    Grower grower = new Grower(fitData, settings);
    double[] weights = grower.weights();
    CandidatePool pool = new CandidatePool();
    List<CandidateChain> chains = new ArrayList<>();
    int tried = 0;
    boolean trees = settings.kinds().contains(ModelKind.TREE);
    int grids = trees ? settings.maxDepth() * settings.minLeafs().size() : 0;
    int grown = 0;
    for (int depth = 1; trees && depth <= settings.maxDepth(); depth++) {
      for (int minLeaf : settings.minLeafs()) {
        List<PrunedTree> path = PruningPath.of(grower.grow(depth, minLeaf), weights);
        List<DistinctTree> members = new ArrayList<>();
        for (int k = 0; k < path.size(); k++) {
          double next = k + 1 < path.size() ? path.get(k + 1).alpha() : Double.POSITIVE_INFINITY;
          CandidateRecipe recipe = new CandidateRecipe(depth, minLeaf, path.get(k).alpha(), next);
          members.add(pool.intern(recipe, path.get(k).tree()));
          tried++;
        }
        Collections.reverse(members);
        chains.add(new TreeChain(members));
        progress.update("growing", ++grown, grids);
      }
    }
    int minLeaf = settings.minLeafs().get(0);
    for (ModelKind kind : settings.kinds()) {
      if (kind == ModelKind.TREE) {
        continue;
      }
      for (int depth : settings.ensembleDepths()) {
        chains.add(new EnsembleChain(fitData, settings, kind, depth, minLeaf, pool));
        tried += settings.ensembleSizes().size();
      }
    }
    return new Chains(tried, chains, pool);
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
