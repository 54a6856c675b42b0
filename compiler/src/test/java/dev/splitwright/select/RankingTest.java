package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class RankingTest {
  private static final BudgetUnit UNIT = BudgetUnit.CLASS;

  @Test
  void prefersBetterScoreThenSmallerSizeThenFewerLeavesThenEarlierIndex() {
    Candidate best = Trees.candidate(5, 900, 0.9, 6);
    Candidate smaller = Trees.candidate(4, 800, 0.8, 6);
    Candidate larger = Trees.candidate(3, 850, 0.8, 6);
    Candidate fewerLeaves = Trees.candidate(2, 800, 0.8, 3);
    Candidate earlier = Trees.candidate(1, 800, 0.8, 3);

    List<Candidate> ranked = Ranking.withinBudget(
        List.of(best, smaller, larger, fewerLeaves, earlier), UNIT, 1000);

    assertThat(ranked).containsExactly(best, earlier, fewerLeaves, smaller, larger);
  }

  @Test
  void keepsOnlyCandidatesWithinTheBudgetInclusive() {
    Candidate fits = Trees.candidate(0, 1000, 0.7, 2);
    Candidate over = Trees.candidate(1, 1001, 0.9, 4);

    assertThat(Ranking.withinBudget(List.of(fits, over), UNIT, 1000)).containsExactly(fits);
    assertThat(Ranking.withinBudget(List.of(fits, over), UNIT, 999)).isEmpty();
  }

  @Test
  void frontierDropsDominatedAndEqualPoints() {
    Candidate a = Trees.candidate(0, 500, 0.5, 1);
    Candidate b = Trees.candidate(1, 600, 0.7, 2);
    Candidate dominated = Trees.candidate(2, 650, 0.6, 3); // b is smaller and better
    Candidate sameAsB = Trees.candidate(3, 600, 0.7, 2); // equal point, later index
    Candidate sameSizeWorse = Trees.candidate(4, 600, 0.65, 2);
    Candidate c = Trees.candidate(5, 900, 0.8, 5);

    List<Candidate> frontier =
        Ranking.frontier(List.of(c, sameSizeWorse, sameAsB, dominated, b, a), UNIT);

    assertThat(frontier).containsExactly(a, b, c);
  }

  @Test
  void frontierHasNoDominatedPointAndHoldsEveryChoice() {
    SplittableRandom random = new SplittableRandom(4);
    for (int round = 0; round < 200; round++) {
      List<Candidate> all = new ArrayList<>();
      int n = 1 + random.nextInt(40);
      for (int i = 0; i < n; i++) {
        // Few distinct sizes and scores, so that ties are common.
        all.add(Trees.candidate(i, 400 + 10 * random.nextInt(20), random.nextInt(8) / 8.0,
            1 + random.nextInt(6)));
      }
      List<Candidate> frontier = Ranking.frontier(all, UNIT);

      for (Candidate p : frontier) {
        for (Candidate q : all) {
          assertThat(dominates(q, p)).as("%s dominates frontier point %s", q, p).isFalse();
        }
      }
      for (Candidate q : all) {
        assertThat(frontier).as("every candidate is matched or beaten by the frontier")
            .anyMatch(p -> p.size(UNIT) <= q.size(UNIT) && p.score() >= q.score());
      }
      for (int i = 1; i < frontier.size(); i++) {
        assertThat(frontier.get(i).size(UNIT)).isGreaterThan(frontier.get(i - 1).size(UNIT));
        assertThat(frontier.get(i).score()).isGreaterThan(frontier.get(i - 1).score());
      }
      for (int budget = 390; budget <= 600; budget += 5) {
        List<Candidate> ranked = Ranking.withinBudget(all, UNIT, budget);
        if (!ranked.isEmpty()) {
          assertThat(frontier).as("budget %d", budget).contains(ranked.get(0));
        }
      }
    }
  }

  private static boolean dominates(Candidate q, Candidate p) {
    return q.size(UNIT) <= p.size(UNIT) && q.score() >= p.score()
        && (q.size(UNIT) < p.size(UNIT) || q.score() > p.score());
  }
}
