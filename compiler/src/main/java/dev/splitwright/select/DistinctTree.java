package dev.splitwright.select;

import dev.splitwright.model.Classifier;
import java.util.Objects;

/**
 * A candidate of the search (a tree or an ensemble) kept once however many settings produce it,
 * before it is scored and measured.
 *
 * @param index position in generation order
 * @param recipe the first settings that produced it
 */
record DistinctTree(int index, CandidateRecipe recipe, Classifier model) {

  DistinctTree {
    Objects.requireNonNull(recipe, "recipe");
    Objects.requireNonNull(model, "model");
  }
}
