package dev.splitwright.select;

import dev.splitwright.emit.Layout;
import dev.splitwright.model.Classifier;
import java.util.Objects;

/**
 * One distinct candidate, a tree or an ensemble, with its validation score and measured sizes.
 *
 * @param index position in generation order, the last tie-breaker
 * @param score validation score, or the mean over folds with cross-validation
 * @param layout the layout measured (the smallest in the budget's unit with {@code smallest})
 */
public record Candidate(int index, CandidateRecipe recipe, Classifier model, double score,
    Sizes sizes, Layout layout) {

  public Candidate {
    Objects.requireNonNull(recipe, "recipe");
    Objects.requireNonNull(model, "model");
    if (!(score >= 0 && score <= 1)) {
      throw new IllegalArgumentException("score must be in [0, 1], but it is " + score);
    }
    Objects.requireNonNull(sizes, "sizes");
    Objects.requireNonNull(layout, "layout");
  }

  /** Its kind, trees, depth and leaves. */
  public Shape shape() {
    return Shape.of(model);
  }

  /** The size counted by {@code unit}. */
  public int size(BudgetUnit unit) {
    return sizes.in(unit);
  }
}
