package dev.splitwright.select;

import dev.splitwright.model.Classifier;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The search's distinct candidates, each kept once with the first recipe that built it. */
final class CandidatePool {
  private final Map<Classifier, DistinctTree> distinct = new LinkedHashMap<>();

  /** The candidate equal to {@code model}, added with {@code recipe} if it is new. */
  DistinctTree intern(CandidateRecipe recipe, Classifier model) {
    return distinct.computeIfAbsent(model,
        m -> new DistinctTree(distinct.size(), recipe, m));
  }

  /** Every candidate built so far, in the order they were first built. */
  List<DistinctTree> all() {
    return new ArrayList<>(distinct.values());
  }
}
