package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.eval.Fold;
import dev.splitwright.eval.StratifiedSplit;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.train.PrunedTree;
import dev.splitwright.train.PruningPath;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Scores candidates on the validation part, or by stratified k-fold cross-validation. */
final class CandidateScorer {
  private CandidateScorer() {}

  /** The metric of each candidate's own tree on {@code validation}, in candidate order. */
  static double[] onValidation(List<DistinctTree> candidates, Dataset validation,
      SearchSettings settings) {
    double[] scores = new double[candidates.size()];
    for (int i = 0; i < scores.length; i++) {
      scores[i] = Evaluator.score(candidates.get(i).model(), validation).get(settings.metric());
    }
    return scores;
  }

  /**
   * The mean over k stratified folds of {@code pool} of the metric of each candidate's settings
   * refitted on the fold's training rows, scored on the held-out rows: a tree grown with the
   * candidate's depth and leaf-size limits and pruned at its {@link
   * CandidateRecipe#representativeAlpha()}; an ensemble trained with its kind, limits and tree
   * count (boosting that stops early on a fold gives fewer trees).
   */
  static double[] crossValidated(List<DistinctTree> candidates, Dataset pool,
      SearchSettings settings, SearchProgress progress) {
    Map<List<Integer>, List<Integer>> byLimits = new LinkedHashMap<>();
    for (int i = 0; i < candidates.size(); i++) {
      CandidateRecipe s = candidates.get(i).recipe();
      byLimits.computeIfAbsent(List.of(s.kind().ordinal(), s.maxDepth(), s.minLeaf()),
          key -> new ArrayList<>()).add(i);
    }
    double[] sums = new double[candidates.size()];
    List<Fold> folds = StratifiedSplit.kFold(pool, settings.folds(), settings.seed());
    int total = folds.size() * byLimits.size();
    int done = 0;
    for (Fold fold : folds) {
      Grower grower = new Grower(fold.train(), settings);
      Dataset held = fold.validation();
      for (Map.Entry<List<Integer>, List<Integer>> e : byLimits.entrySet()) {
        ModelKind kind = ModelKind.values()[e.getKey().get(0)];
        int depth = e.getKey().get(1);
        int minLeaf = e.getKey().get(2);
        Map<Classifier, Double> scored = new HashMap<>();
        List<Classifier> models = kind == ModelKind.TREE
            ? treesAt(grower, depth, minLeaf, candidates, e.getValue())
            : ensemblesOf(fold.train(), settings, kind, depth, minLeaf, candidates,
                e.getValue());
        for (int j = 0; j < models.size(); j++) {
          sums[e.getValue().get(j)] += scored.computeIfAbsent(models.get(j),
              m -> Evaluator.score(m, held).get(settings.metric()));
        }
        progress.update("cross-validating", ++done, total);
      }
    }
    double[] means = new double[sums.length];
    for (int i = 0; i < means.length; i++) {
      means[i] = sums[i] / folds.size();
    }
    return means;
  }

  /** The fold's tree for each candidate of {@code members}, pruned at its alpha. */
  private static List<Classifier> treesAt(Grower grower, int depth, int minLeaf,
      List<DistinctTree> candidates, List<Integer> members) {
    List<PrunedTree> path = PruningPath.of(grower.grow(depth, minLeaf), grower.weights());
    List<Classifier> trees = new ArrayList<>();
    for (int i : members) {
      trees.add(PruningPath.at(path, candidates.get(i).recipe().representativeAlpha()));
    }
    return trees;
  }

  /** The fold's ensemble for each candidate of {@code members}, by its tree count. */
  private static List<Classifier> ensemblesOf(Dataset rows, SearchSettings settings,
      ModelKind kind, int depth, int minLeaf, List<DistinctTree> candidates,
      List<Integer> members) {
    int most = members.stream().mapToInt(i -> candidates.get(i).recipe().trees()).max()
        .orElseThrow();
    List<TreeEnsemble> grown = EnsembleGrower.grow(rows, settings, kind, depth, minLeaf, most);
    List<Classifier> ensembles = new ArrayList<>();
    for (int i : members) {
      int wanted = candidates.get(i).recipe().trees();
      TreeEnsemble pick = grown.get(0);
      for (TreeEnsemble e : grown) {
        if (e.treeCount() <= wanted) {
          pick = e;
        }
      }
      ensembles.add(pick);
    }
    return ensembles;
  }
}
