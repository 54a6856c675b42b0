package dev.splitwright.verify;

import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.List;

/**
 * Boundary probes for classifiers that take {@code int} inputs, which float probes cannot express
 * above 2^24 (floats there are more than 1 apart). For every split, an int input that reaches it
 * puts the split's feature at {@code n - 1}, {@code n} and {@code n + 1}, where {@code n} is the
 * largest int whose float conversion is {@code <= t}, and at {@link Integer#MIN_VALUE}, 0 and
 * {@link Integer#MAX_VALUE}; a categorical split gets a code in its set, one outside, -1, k and the
 * int extremes. {@code n} is found by binary search on Java's own int-to-float conversion (JLS
 * §5.1.2), independently of how the emitter computes its integer thresholds.
 */
final class IntProbes {
  /** Stands for "no int": every int converts to a float above the threshold. */
  static final long NONE = Integer.MIN_VALUE - 1L;

  private final Schema schema;
  private final List<int[]> out = new ArrayList<>();

  private IntProbes(Schema schema) {
    this.schema = schema;
  }

  static List<int[]> of(DecisionTree tree) {
    IntProbes probes = new IntProbes(tree.schema());
    PathState.forEachSplit(tree, (split, state) -> {
      int[] base = witness(state);
      for (int v : probes.valuesAround(split)) {
        int[] probe = base.clone();
        probe[split.feature()] = v;
        probes.out.add(probe);
      }
    });
    return probes.out;
  }

  /** The largest int n with {@code (float) n <= t}, or {@link #NONE}. */
  static long largestIntAtOrBelow(float t) {
    if (!((float) Integer.MIN_VALUE <= t)) {
      return NONE;
    }
    long lo = Integer.MIN_VALUE; // (float) lo <= t holds
    long hi = Integer.MAX_VALUE + 1L; // treated as failing
    while (hi - lo > 1) {
      long mid = lo + (hi - lo) / 2;
      if ((float) (int) mid <= t) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    return lo;
  }

  private int[] valuesAround(Split split) {
    if (split instanceof NumericSplit numeric) {
      long n = largestIntAtOrBelow(numeric.threshold());
      return new int[] {clamp(n - 1), clamp(n), clamp(n + 1), Integer.MIN_VALUE, 0,
          Integer.MAX_VALUE};
    }
    CategoricalSplit categorical = (CategoricalSplit) split;
    int k = schema.feature(split.feature()).categories().size();
    int inside = -1;
    int outside = -1;
    for (int code = k - 1; code >= 0; code--) {
      if (categorical.leftCodes().contains(code)) {
        inside = code;
      } else {
        outside = code;
      }
    }
    return new int[] {inside, outside, -1, k, Integer.MIN_VALUE, Integer.MAX_VALUE};
  }

  private static int clamp(long v) {
    return (int) Math.max(Integer.MIN_VALUE, Math.min(Integer.MAX_VALUE, v));
  }

  /**
   * An int input satisfying the path where one exists, any value where none does. The float
   * bound {@code low < x <= high} becomes {@code n(low) < x <= n(high)} with n as in {@link
   * #largestIntAtOrBelow}; a categorical feature with no code left takes -1 (missing) if missing
   * values may still pass.
   */
  private static int[] witness(PathState state) {
    int[] x = new int[state.low().length];
    for (int f = 0; f < x.length; f++) {
      if (state.isCategorical(f)) {
        int code = state.firstAllowedCode(f);
        x[f] = code >= 0 ? code : state.missingAllowed()[f] ? -1 : 0;
      } else {
        x[f] = numeric(largestIntAtOrBelow(state.low()[f]),
            largestIntAtOrBelow(state.high()[f]));
      }
    }
    return x;
  }

  private static int numeric(long low, long high) {
    if (high < Integer.MAX_VALUE) {
      return clamp(high);
    }
    return low == NONE ? 0 : clamp(low + 1);
  }
}
