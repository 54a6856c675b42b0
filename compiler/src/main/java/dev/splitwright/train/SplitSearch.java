package dev.splitwright.train;

import dev.splitwright.data.Schema;
import java.util.Arrays;

/**
 * Finds a node's best split over all features. Candidates are scored on the rows where the feature
 * is present; for the winner per feature the missing rows are then tried on both sides (see {@link
 * #finish}), and features compete on the resulting total cost. Ties keep the earliest candidate:
 * lowest feature index, lowest threshold, lexicographically smallest left code set.
 *
 * <p>A tie is decided up to rounding: costs that are equal mathematically may differ in their last
 * bits when they are summed from different parts (the Gini masses 1 + 5/3 and 0 + 8/3 are both
 * 8/3, but come out one ulp apart). So candidates are scanned in that order and one replaces the
 * best so far only when its cost is lower by more than {@link #TIE_TOLERANCE} times the node's
 * {@link Criterion#roundingScale rounding scale}; the scan order makes the choice deterministic.
 */
final class SplitSearch {
  /**
   * Relative tolerance of cost comparisons: about 4,500 ulps of the largest term the costs sum,
   * well above their rounding error (a few ulps per class); candidates closer than that differ by
   * less than 10^-12 of the node's weighted row count, which no choice should hinge on.
   */
  static final double TIE_TOLERANCE = 1e-12;

  /**
   * Margin of the division-free Gini pretest, relative to the rows scanned: about 450 ulps, far
   * above its rounding error (a few ulps of that row count), so no candidate that could win fails
   * it.
   */
  private static final double ESTIMATE_MARGIN = 1e-13;

  private final SortedColumns columns;
  private final Criterion criterion;
  private final int minLeaf;
  private final int classes;
  /** Category count per feature; -1 for numeric features. */
  private final int[] categoryCounts;

  private final int[] missing;
  private final int[] present;
  private final int[] left;
  private final int[] bestLeft;
  private final int[] right;
  /** Per category code: rows of each class, and rows, at the node being searched. */
  private final int[] codeClassCounts;
  private final int[] codeRows;
  /** Costs of the node being searched that differ by at most this count as equal. */
  private double tolerance;

  /** Restricts each node to a random subset of features; {@code null} searches them all. */
  private final FeatureSampler sampler;
  private final Schema schema;
  /** A search of its own for the second share of the features (see {@link TwoShares}). */
  private SplitSearch helper;

  SplitSearch(SortedColumns columns, Schema schema, Criterion criterion, int minLeaf) {
    this(columns, schema, criterion, minLeaf, null);
  }

  /**
   * A search that, with a {@code sampler}, tries the features in the sampler's random order
   * instead of all of them: at least {@link FeatureSampler#perNode()}, and more only while none
   * of those drawn has an admissible split. Ties then keep the feature drawn first.
   */
  SplitSearch(SortedColumns columns, Schema schema, Criterion criterion, int minLeaf,
      FeatureSampler sampler) {
    this.sampler = sampler;
    this.schema = schema;
    this.columns = columns;
    this.criterion = criterion;
    this.minLeaf = minLeaf;
    this.classes = schema.classCount();
    this.categoryCounts = new int[schema.featureCount()];
    int maxCategories = 0;
    for (int f = 0; f < categoryCounts.length; f++) {
      boolean categorical = schema.feature(f).isCategorical();
      categoryCounts[f] = categorical ? schema.feature(f).categories().size() : -1;
      maxCategories = Math.max(maxCategories, categoryCounts[f]);
    }
    this.codeClassCounts = new int[maxCategories * classes];
    this.codeRows = new int[maxCategories];
    this.missing = new int[classes];
    this.present = new int[classes];
    this.left = new int[classes];
    this.bestLeft = new int[classes];
    this.right = new int[classes];
  }

  /** Returns the lowest-cost split of {@code node}, or {@code null} if no split is admissible. */
  SplitChoice best(GrowingNode node) {
    tolerance = TIE_TOLERANCE * criterion.roundingScale(node.counts);
    SplitChoice best = null;
    if (sampler == null) {
      // Every feature's candidate first, in two shares on a large node; then the same choice, in
      // feature order, as one pass would make.
      int features = categoryCounts.length;
      long cells = (long) node.rows() * features;
      if (TwoShares.splits(cells) && helper == null) {
        helper = new SplitSearch(columns, schema, criterion, minLeaf, null);
      }
      SplitChoice[] found = new SplitChoice[features];
      TwoShares.run(features, cells,
          (from, to, share) -> (share == 0 ? this : helper).candidates(node, from, to, found));
      for (SplitChoice challenger : found) {
        best = better(best, challenger);
      }
      return best;
    }
    for (int i = 0; i < categoryCounts.length && (i < sampler.perNode() || best == null); i++) {
      best = better(best, candidate(sampler.draw(i), node));
    }
    return best;
  }

  /** Each feature's best split of {@code node} in {@code [from, to)}, into {@code found}. */
  private void candidates(GrowingNode node, int from, int to, SplitChoice[] found) {
    tolerance = TIE_TOLERANCE * criterion.roundingScale(node.counts);
    for (int f = from; f < to; f++) {
      found[f] = candidate(f, node);
    }
  }

  private SplitChoice candidate(int f, GrowingNode node) {
    return categoryCounts[f] < 0
        ? numeric(f, node.lo, node.hi, node.counts)
        : categorical(f, node.lo, node.hi, node.counts);
  }

  /** The challenger if it is cheaper beyond the tolerance, else the best so far. */
  private SplitChoice better(SplitChoice best, SplitChoice challenger) {
    return challenger != null && (best == null || challenger.cost < best.cost - tolerance)
        ? challenger : best;
  }

  /** Counts the missing rows at the segment's end; returns where they start. */
  private int countMissing(char[] labels, float[] values, int lo, int hi, int[] nodeCounts) {
    Arrays.fill(missing, 0);
    int p = hi;
    while (p > lo && Float.isNaN(values[p - 1])) {
      p--;
      missing[labels[p]]++;
    }
    for (int c = 0; c < classes; c++) {
      present[c] = nodeCounts[c] - missing[c];
    }
    return p;
  }

  private boolean admissible(int nLeft, int nRight, int nMissing) {
    return (nLeft + nMissing >= minLeaf && nRight >= minLeaf)
        || (nLeft >= minLeaf && nRight + nMissing >= minLeaf);
  }

  private SplitChoice numeric(int f, int lo, int hi, int[] nodeCounts) {
    char[] labels = columns.labels[f];
    float[] values = columns.values[f];
    int p = countMissing(labels, values, lo, hi, nodeCounts);
    int nMissing = hi - p;
    if (p - lo < 2 || values[lo] == values[p - 1]) {
      return null;
    }
    Arrays.fill(left, 0);
    int bestI = criterion.integerGini()
        ? scanGini(labels, values, lo, p, nMissing)
        : scan(labels, values, lo, p, nMissing);
    if (bestI < 0) {
      return null;
    }
    float threshold = ThresholdChooser.between(values[bestI], values[bestI + 1]);
    int nLeft = bestI - lo + 1;
    return finish(f, threshold, null, nLeft, p - lo - nLeft, nMissing);
  }

  /**
   * Scores every boundary between distinct present values of {@code [lo, p)}; returns the last
   * position left of the best one, or -1, with its left counts in {@link #bestLeft}.
   */
  private int scan(char[] labels, float[] values, int lo, int p, int nMissing) {
    double bestCost = Double.POSITIVE_INFINITY;
    int bestI = -1;
    int nPresent = p - lo;
    for (int i = lo; i < p - 1; i++) {
      left[labels[i]]++;
      if (values[i] == values[i + 1]) {
        continue; // not a boundary between distinct values
      }
      int nLeft = i - lo + 1;
      if (!admissible(nLeft, nPresent - nLeft, nMissing)) {
        continue;
      }
      double cost = criterion.cost(left) + criterion.costOfDifference(present, left);
      if (cost < bestCost - tolerance) {
        bestCost = cost;
        bestI = i;
        System.arraycopy(left, 0, bestLeft, 0, classes);
      }
    }
    return bestI;
  }

  /**
   * {@link #scan} for {@link Criterion#integerGini}: keeps the sums of squared class counts on
   * both sides up to date in O(1) per row instead of summing over the classes at each boundary;
   * the costs are the same to the bit.
   */
  private int scanGini(char[] labels, float[] values, int lo, int p, int nMissing) {
    int bestI = -1;
    int nPresent = p - lo;
    long leftSquares = 0;
    long rightSquares = 0;
    for (int c = 0; c < classes; c++) {
      rightSquares += (long) present[c] * present[c];
    }
    int[] counts = left;
    int[] totals = present;
    double bound = Double.POSITIVE_INFINITY;
    // What sL / nL + sR / nR must at least be for the cost to beat the bound, less a margin.
    double need = Double.NEGATIVE_INFINITY;
    double margin = ESTIMATE_MARGIN * nPresent;
    for (int i = lo; i < p - 1; i++) {
      int c = labels[i];
      long a = counts[c];
      counts[c] = (int) a + 1;
      // (a + 1)^2 - a^2 on the left; (t - a)^2 - (t - a - 1)^2 on the right.
      leftSquares += 2 * a + 1;
      rightSquares -= 2 * (totals[c] - a) - 1;
      int nLeft = i - lo + 1;
      int nRight = nPresent - nLeft;
      // The cost is nPresent - (sL / nL + sR / nR). Multiplied out by nL * nR, the test whether
      // it may beat the bound needs no division, and errs by far less than the margin; only the
      // few candidates that pass pay for the exact cost. It comes first, for every row: it
      // rarely passes, so its branch is well predicted, whereas whether two neighbouring values
      // are equal is a coin toss on quantised readings.
      if ((double) leftSquares * nRight + (double) rightSquares * nLeft
          >= need * ((double) nLeft * nRight)
          && values[i] != values[i + 1] // a boundary between distinct values
          && admissible(nLeft, nRight, nMissing)) {
        double cost =
            Criterion.giniMass(nLeft, leftSquares) + Criterion.giniMass(nRight, rightSquares);
        if (cost < bound) {
          bound = cost - tolerance;
          need = nPresent - bound - margin;
          bestI = i;
          System.arraycopy(counts, 0, bestLeft, 0, classes);
        }
      }
    }
    return bestI;
  }

  private SplitChoice categorical(int f, int lo, int hi, int[] nodeCounts) {
    char[] labels = columns.labels[f];
    float[] values = columns.values[f];
    int p = countMissing(labels, values, lo, hi, nodeCounts);
    int nMissing = hi - p;
    int nPresent = p - lo;
    if (nPresent < 2 || values[lo] == values[p - 1]) {
      return null;
    }
    // Rows are sorted by code, so the present codes come out ascending.
    int[] codes = new int[Math.min(categoryCounts[f], nPresent)];
    int m = 0;
    for (int i = lo; i < p; i++) {
      int code = (int) values[i];
      if (codeRows[code]++ == 0) {
        codes[m++] = code;
      }
      codeClassCounts[code * classes + labels[i]]++;
    }
    double bestCost = Double.POSITIVE_INFINITY;
    int[] bestSet = null;
    int bestNLeft = 0;
    int[] order = new int[m];
    double[] share = new double[m];
    int[] sortBuffer = new int[m];
    // Two classes: ordering by the share of class 1 makes the best prefix optimal among all
    // subsets (Breiman et al. 1984, section 9.4). More classes: a heuristic, every class's order.
    int firstOrder = classes == 2 ? 1 : 0;
    for (int oc = firstOrder; oc < classes; oc++) {
      for (int j = 0; j < m; j++) {
        int base = codes[j] * classes;
        double total = 0;
        for (int c = 0; c < classes; c++) {
          total += criterion.weight(c, codeClassCounts[base + c]);
        }
        share[j] = criterion.weight(oc, codeClassCounts[base + oc]) / total;
        order[j] = j;
      }
      mergeSortByShare(order, sortBuffer, share, 0, m);
      Arrays.fill(left, 0);
      int nLeft = 0;
      for (int e = 0; e < m - 1; e++) {
        int code = codes[order[e]];
        for (int c = 0; c < classes; c++) {
          left[c] += codeClassCounts[code * classes + c];
        }
        nLeft += codeRows[code];
        if (!admissible(nLeft, nPresent - nLeft, nMissing)) {
          continue;
        }
        double cost = criterion.cost(left) + criterion.costOfDifference(present, left);
        if (cost < bestCost - tolerance || (cost <= bestCost + tolerance
            && Arrays.compare(prefixSet(codes, order, e), bestSet) < 0)) {
          bestCost = cost;
          bestSet = prefixSet(codes, order, e);
          bestNLeft = nLeft;
          System.arraycopy(left, 0, bestLeft, 0, classes);
        }
      }
    }
    for (int j = 0; j < m; j++) {
      codeRows[codes[j]] = 0;
      Arrays.fill(codeClassCounts, codes[j] * classes, (codes[j] + 1) * classes, 0);
    }
    if (bestSet == null) {
      return null;
    }
    return finish(f, Float.NaN, bestSet, bestNLeft, nPresent - bestNLeft, nMissing);
  }

  private static int[] prefixSet(int[] codes, int[] order, int last) {
    int[] set = new int[last + 1];
    for (int e = 0; e <= last; e++) {
      set[e] = codes[order[e]];
    }
    Arrays.sort(set);
    return set;
  }

  /** Stable ascending sort of {@code order[lo, hi)} by {@code share}; equal shares keep order. */
  private static void mergeSortByShare(int[] order, int[] buffer, double[] share, int lo, int hi) {
    if (hi - lo < 2) {
      return;
    }
    int mid = (lo + hi) >>> 1;
    mergeSortByShare(order, buffer, share, lo, mid);
    mergeSortByShare(order, buffer, share, mid, hi);
    int i = lo;
    int j = mid;
    int o = lo;
    while (i < mid && j < hi) {
      buffer[o++] = share[order[j]] < share[order[i]] ? order[j++] : order[i++];
    }
    while (i < mid) {
      buffer[o++] = order[i++];
    }
    while (j < hi) {
      buffer[o++] = order[j++];
    }
    System.arraycopy(buffer, lo, order, lo, hi - lo);
  }

  /**
   * Places the missing rows: on the side giving the lower total cost among the sides that keep
   * {@code minLeaf}; on a tie (up to rounding), or when no row is missing, with the side holding
   * more weight of the present rows (left on a tie), so that unseen missing values follow the
   * majority.
   */
  private SplitChoice finish(
      int f, float threshold, int[] leftCodes, int nLeft, int nRight, int nMissing) {
    for (int c = 0; c < classes; c++) {
      right[c] = present[c] - bestLeft[c];
    }
    boolean majorityLeft = criterion.weight(bestLeft) >= criterion.weight(right);
    double costLeft =
        nLeft + nMissing >= minLeaf && nRight >= minLeaf
            ? criterion.costOfSum(bestLeft, missing) + criterion.cost(right)
            : Double.POSITIVE_INFINITY;
    double costRight =
        nLeft >= minLeaf && nRight + nMissing >= minLeaf
            ? criterion.cost(bestLeft) + criterion.costOfSum(right, missing)
            : Double.POSITIVE_INFINITY;
    // At most one side is inadmissible (infinite), so the difference is never NaN.
    boolean tie = Math.abs(costLeft - costRight) <= tolerance;
    boolean missingLeft = tie ? majorityLeft : costLeft < costRight;
    return new SplitChoice(
        f, threshold, leftCodes, missingLeft, missingLeft ? costLeft : costRight);
  }
}
