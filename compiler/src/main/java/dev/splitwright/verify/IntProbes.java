package dev.splitwright.verify;

import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.Arrays;
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
    probes.visit(tree.root(), PathState.initial(tree.schema()));
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

  private void visit(Node node, PathState state) {
    if (!(node instanceof Split split)) {
      return;
    }
    int[] base = state.witness();
    for (int v : valuesAround(split)) {
      int[] probe = base.clone();
      probe[split.feature()] = v;
      out.add(probe);
    }
    visit(split.left(), state.then(split, true));
    visit(split.right(), state.then(split, false));
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
   * What the path so far demands, in ints: numeric feature f needs {@code low[f] < x <= high[f]};
   * a categorical one a code still allowed, or, if missing values may still pass, code -1.
   */
  private record PathState(long[] low, long[] high, boolean[][] allowed, boolean[] missingAllowed) {

    static PathState initial(Schema schema) {
      int n = schema.featureCount();
      long[] low = new long[n];
      long[] high = new long[n];
      Arrays.fill(low, NONE);
      Arrays.fill(high, Integer.MAX_VALUE);
      boolean[][] allowed = CategoryPath.allAllowed(schema);
      boolean[] missing = new boolean[n];
      Arrays.fill(missing, true);
      return new PathState(low, high, allowed, missing);
    }

    PathState then(Split split, boolean left) {
      int f = split.feature();
      long[] newLow = low;
      long[] newHigh = high;
      boolean[][] newAllowed = allowed;
      boolean[] newMissing = missingAllowed;
      if (split instanceof NumericSplit numeric) {
        long n = largestIntAtOrBelow(numeric.threshold());
        if (left) {
          newHigh = high.clone();
          newHigh[f] = Math.min(high[f], n);
        } else {
          newLow = low.clone();
          newLow[f] = Math.max(low[f], n);
        }
      } else {
        newAllowed = CategoryPath.narrow(allowed, (CategoricalSplit) split, left);
        if (split.missingLeft() != left) {
          newMissing = missingAllowed.clone();
          newMissing[f] = false;
        }
      }
      return new PathState(newLow, newHigh, newAllowed, newMissing);
    }

    /** An int input satisfying the path where one exists; any value where none does. */
    int[] witness() {
      int[] x = new int[low.length];
      for (int f = 0; f < x.length; f++) {
        x[f] = allowed[f] == null ? numeric(f) : category(f);
      }
      return x;
    }

    private int numeric(int f) {
      if (high[f] < Integer.MAX_VALUE) {
        return clamp(high[f]);
      }
      return low[f] == NONE ? 0 : clamp(low[f] + 1);
    }

    private int category(int f) {
      for (int code = 0; code < allowed[f].length; code++) {
        if (allowed[f][code]) {
          return code;
        }
      }
      return missingAllowed[f] ? -1 : 0;
    }
  }
}
