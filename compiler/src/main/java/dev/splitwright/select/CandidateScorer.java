package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.eval.Fold;
import dev.splitwright.eval.StratifiedSplit;
import dev.splitwright.model.DecisionTree;
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
      scores[i] = Evaluator.score(candidates.get(i).tree(), validation).get(settings.metric());
    }
    return scores;
  }

  /**
   * The mean over k stratified folds of {@code pool} of the metric of each candidate's settings
   * refitted on the fold's training rows: grown with the candidate's depth and leaf-size limits,
   * pruned at its {@link CandidateRecipe#representativeAlpha()}, scored on the held-out rows.
   */
  static double[] crossValidated(List<DistinctTree> candidates, Dataset pool,
      SearchSettings settings, SearchProgress progress) {
    Map<List<Integer>, List<Integer>> byLimits = new LinkedHashMap<>();
    for (int i = 0; i < candidates.size(); i++) {
      CandidateRecipe s = candidates.get(i).recipe();
      byLimits.computeIfAbsent(List.of(s.maxDepth(), s.minLeaf()), key -> new ArrayList<>())
          .add(i);
    }
    double[] sums = new double[candidates.size()];
    List<Fold> folds = StratifiedSplit.kFold(pool, settings.folds(), settings.seed());
    int total = folds.size() * byLimits.size();
    int done = 0;
    for (Fold fold : folds) {
      Grower grower = new Grower(fold.train(), settings);
      double[] weights = grower.weights();
      Dataset held = fold.validation();
      for (Map.Entry<List<Integer>, List<Integer>> e : byLimits.entrySet()) {
        DecisionTree full = grower.grow(e.getKey().get(0), e.getKey().get(1));
        List<PrunedTree> path = PruningPath.of(full, weights);
        Map<DecisionTree, Double> scored = new HashMap<>();
        for (int i : e.getValue()) {
          DecisionTree pruned =
              PruningPath.at(path, candidates.get(i).recipe().representativeAlpha());
          sums[i] += scored.computeIfAbsent(pruned,
              t -> Evaluator.score(t, held).get(settings.metric()));
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
}
