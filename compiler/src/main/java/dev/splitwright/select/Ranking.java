package dev.splitwright.select;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/** Orders candidates by preference and finds the size/score Pareto frontier. */
final class Ranking {
  private Ranking() {}

  /** Best score first; ties to the smaller size, then fewer leaves, then generation order. */
  static Comparator<Candidate> preference(BudgetUnit unit) {
    return Comparator.comparingDouble(Candidate::score).reversed()
        .thenComparingInt((Candidate c) -> c.size(unit))
        .thenComparingInt(c -> c.shape().leaves())
        .thenComparingInt(Candidate::index);
  }

  /** The candidates of at most {@code budget} bytes, most preferred first. */
  static List<Candidate> withinBudget(List<Candidate> candidates, BudgetUnit unit, int budget) {
    return candidates.stream()
        .filter(c -> c.size(unit) <= budget)
        .sorted(preference(unit))
        .toList();
  }

  /**
   * Every candidate that no other beats: none is at most as large and scores at least as well
   * while being smaller or better. Sorted by size ascending; scores then rise strictly. Of equal
   * points only the one {@link #preference} ranks first is kept.
   */
  static List<Candidate> frontier(List<Candidate> candidates, BudgetUnit unit) {
    List<Candidate> sorted = new ArrayList<>(candidates);
    sorted.sort(Comparator.comparingInt((Candidate c) -> c.size(unit))
        .thenComparing(preference(unit)));
    List<Candidate> frontier = new ArrayList<>();
    double best = Double.NEGATIVE_INFINITY;
    for (Candidate c : sorted) {
      if (c.score() > best) {
        frontier.add(c);
        best = c.score();
      }
    }
    return List.copyOf(frontier);
  }
}
