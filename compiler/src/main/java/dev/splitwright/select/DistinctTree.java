package dev.splitwright.select;

import dev.splitwright.model.DecisionTree;
import java.util.Objects;

/**
 * A tree of the search kept once however many settings produce it, before it is scored and
 * measured.
 *
 * @param index position in generation order
 * @param recipe the first settings that produced it
 */
record DistinctTree(int index, CandidateRecipe recipe, DecisionTree tree) {

  DistinctTree {
    Objects.requireNonNull(recipe, "recipe");
    Objects.requireNonNull(tree, "tree");
  }
}
