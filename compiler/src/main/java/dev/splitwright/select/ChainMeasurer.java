package dev.splitwright.select;

import dev.splitwright.data.InputException;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.Classifier;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeMap;

/**
 * Measures the search's candidates chain by chain, in rounds of one batch each. A round takes, from
 * every chain not yet settled, the next members up to the first a {@link SizeGuess} puts over the
 * budget; once a member is measured over the budget, the members after it are neither built nor
 * measured, since each holds it ({@link CandidateChain}). Every member that can fit is measured,
 * so the choice is the one measuring all of them would make; the frontier lacks only candidates
 * larger than one already over the budget.
 */
final class ChainMeasurer {
  /** Node counts of candidates measured ahead of any guess: a handful of splits each. */
  static final int SMALL_NODES = 15;
  /** Candidates per call of {@link SearchMeter#measure}, between progress updates. */
  static final int CHUNK = 100;

  private final SearchSettings settings;
  private final SearchMeter<?> meter;
  private final SearchProgress progress;

  ChainMeasurer(SearchSettings settings, SearchMeter<?> meter, SearchProgress progress) {
    this.settings = Objects.requireNonNull(settings, "settings");
    this.meter = Objects.requireNonNull(meter, "meter");
    this.progress = Objects.requireNonNull(progress, "progress");
  }

  /**
   * The candidates measured, in generation order, with their sizes.
   *
   * @param skipped chain members not measured because an earlier member was over the budget
   */
  record Result(List<DistinctTree> measured, Map<Integer, SearchMeter.Measured> sizes,
      int skipped) {

    Result {
      measured = List.copyOf(measured);
      sizes = Map.copyOf(sizes);
    }
  }

  Result measure(List<CandidateChain> chains, HeaderInfo header) throws InputException {
    // By index, so that the candidates come out in generation order.
    Map<Integer, DistinctTree> built = new TreeMap<>();
    Map<Integer, SearchMeter.Measured> sizes = new HashMap<>();
    SizeGuess guess = new SizeGuess();
    int[] next = new int[chains.size()];
    int[] planned = new int[chains.size()];
    Arrays.fill(planned, -1);
    boolean[] settled = new boolean[chains.size()];
    int skipped = 0;
    while (true) {
      Map<Integer, DistinctTree> due = new LinkedHashMap<>();
      for (int c = 0; c < chains.size(); c++) {
        CandidateChain chain = chains.get(c);
        if (settled[c]) {
          continue;
        }
        // Settle what the last round measured.
        while (next[c] <= planned[c]) {
          Optional<DistinctTree> member = chain.member(next[c]);
          if (member.isEmpty()) {
            break;
          }
          int size = sizes.get(member.get().index()).sizes().in(settings.unit());
          if (size > settings.budget()) {
            // Members this round measured anyway are not counted.
            skipped += chain.length() - 1 - Math.max(next[c], planned[c]);
            settled[c] = true;
            break;
          }
          next[c]++;
        }
        if (settled[c] || next[c] >= chain.length()) {
          settled[c] = true;
          continue;
        }
        planned[c] = plan(chain, next[c], guess);
        chain.prepare(planned[c]);
        for (int i = next[c]; i <= planned[c]; i++) {
          chain.member(i).filter(t -> !sizes.containsKey(t.index()))
              .ifPresent(t -> due.put(t.index(), t));
        }
      }
      if (due.isEmpty()) {
        break;
      }
      measureRound(new ArrayList<>(due.values()), header, sizes, guess);
      due.values().forEach(t -> built.put(t.index(), t));
    }
    return new Result(new ArrayList<>(built.values()), sizes, skipped);
  }

  /** The last position to measure this round, from {@code first} on. */
  private int plan(CandidateChain chain, int first, SizeGuess guess) {
    int last = first;
    while (last + 1 < chain.length()
        && (settings.measureAll() || worthTheNext(chain, last, guess))) {
      last++;
    }
    return last;
  }

  /** Whether to measure the member after {@code i} in the same round as {@code i}. */
  private boolean worthTheNext(CandidateChain chain, int i, SizeGuess guess) {
    double size = guess.of(chain.kind(), chain.nodes(i));
    if (Double.isNaN(size)) {
      // No line to go by yet: members cheap to compile whatever their size, whose sizes then
      // draw the line for the next round.
      return chain.nodes(i + 1) <= SMALL_NODES;
    }
    return size <= settings.budget();
  }

  private void measureRound(List<DistinctTree> due, HeaderInfo header,
      Map<Integer, SearchMeter.Measured> sizes, SizeGuess guess) throws InputException {
    int done = sizes.size();
    int total = done + due.size();
    for (int start = 0; start < due.size(); start += CHUNK) {
      List<DistinctTree> chunk =
          due.subList(start, Math.min(due.size(), start + CHUNK));
      List<Classifier> models = chunk.stream().map(DistinctTree::model).toList();
      List<SearchMeter.Measured> measured = meter.measure(models, header);
      for (int i = 0; i < chunk.size(); i++) {
        DistinctTree t = chunk.get(i);
        sizes.put(t.index(), measured.get(i));
        Shape shape = Shape.of(t.model());
        guess.add(shape.kind(), 2.0 * shape.leaves() - shape.trees(),
            measured.get(i).sizes().in(settings.unit()));
      }
      progress.update("measuring", done + start + chunk.size(), total);
    }
  }
}
