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
import java.util.function.BiConsumer;

/**
 * Builds, for every split, inputs that reach it (each comparison on its path satisfied) and then
 * put the split's own feature on and around its threshold: t, nextUp(t), nextDown(t), NaN, ±0 and
 * ±Infinity (IEEE 754 neighbours), or, for a categorical split, codes inside and outside its set
 * and invalid codes. Every comparison of the emitted code is thus taken both ways.
 */
final class BoundaryProbes {
  private final Schema schema;
  private final List<float[]> out = new ArrayList<>();

  private BoundaryProbes(Schema schema) {
    this.schema = schema;
  }

  static List<float[]> of(DecisionTree tree) {
    BoundaryProbes probes = new BoundaryProbes(tree.schema());
    forEachSplit(tree, (split, base) -> {
      for (float v : probes.valuesAround(split)) {
        float[] probe = base.clone();
        probe[split.feature()] = v;
        probes.out.add(probe);
      }
    });
    return probes.out;
  }

  /**
   * Calls {@code action} for every split in pre-order with an input that reaches it: every
   * comparison on the path is satisfied, present values preferred.
   */
  static void forEachSplit(DecisionTree tree, BiConsumer<Split, float[]> action) {
    visit(tree.root(), PathState.initial(tree.schema()), action);
  }

  private static void visit(Node node, PathState state, BiConsumer<Split, float[]> action) {
    if (!(node instanceof Split split)) {
      return;
    }
    action.accept(split, state.witness());
    visit(split.left(), state.then(split, true), action);
    visit(split.right(), state.then(split, false), action);
  }

  private float[] valuesAround(Split split) {
    if (split instanceof NumericSplit numeric) {
      float t = numeric.threshold();
      return new float[] {t, Math.nextUp(t), Math.nextDown(t), Float.NaN,
          Float.POSITIVE_INFINITY, Float.NEGATIVE_INFINITY, 0.0f, -0.0f};
    }
    CategoricalSplit categorical = (CategoricalSplit) split;
    int k = schema.feature(split.feature()).categories().size();
    int[] inside = categorical.leftCodes().toArray();
    float firstOutside = Float.NaN;
    for (int code = 0; code < k; code++) {
      if (!categorical.leftCodes().contains(code)) {
        firstOutside = code;
        break;
      }
    }
    float firstInside = inside.length == 0 ? Float.NaN : inside[0];
    return new float[] {firstInside, firstOutside, Float.NaN, -1f, k, 0.5f, -0.0f};
  }

  /** What the path so far demands of each feature; immutable, copied on each step. */
  private record PathState(Schema schema, float[] low, float[] high, boolean[][] allowed,
      boolean[] missingAllowed) {

    static PathState initial(Schema schema) {
      int n = schema.featureCount();
      float[] low = new float[n];
      float[] high = new float[n];
      Arrays.fill(low, Float.NEGATIVE_INFINITY);
      Arrays.fill(high, Float.POSITIVE_INFINITY);
      boolean[][] allowed = CategoryPath.allAllowed(schema);
      boolean[] missing = new boolean[n];
      Arrays.fill(missing, true);
      return new PathState(schema, low, high, allowed, missing);
    }

    /** The state after taking {@code split} to the left or right. */
    PathState then(Split split, boolean left) {
      int f = split.feature();
      float[] newLow = low;
      float[] newHigh = high;
      boolean[][] newAllowed = allowed;
      if (split instanceof NumericSplit numeric) {
        if (left) {
          newHigh = high.clone();
          newHigh[f] = Math.min(high[f], numeric.threshold());
        } else {
          newLow = low.clone();
          newLow[f] = Math.max(low[f], numeric.threshold());
        }
      } else {
        newAllowed = CategoryPath.narrow(allowed, (CategoricalSplit) split, left);
      }
      boolean[] newMissing = missingAllowed;
      if (split.missingLeft() != left && missingAllowed[f]) {
        newMissing = missingAllowed.clone();
        newMissing[f] = false;
      }
      return new PathState(schema, newLow, newHigh, newAllowed, newMissing);
    }

    /** An input that satisfies every comparison on the path, preferring present values. */
    float[] witness() {
      float[] x = new float[low.length];
      for (int f = 0; f < x.length; f++) {
        x[f] = allowed[f] == null ? numeric(f) : category(f);
      }
      return x;
    }

    private float numeric(int f) {
      // The path allows values v with low < v <= high.
      if (low[f] < high[f]) {
        if (high[f] != Float.POSITIVE_INFINITY) {
          return high[f];
        }
        return low[f] == Float.NEGATIVE_INFINITY ? 0f : Math.nextUp(low[f]);
      }
      return Float.NaN;
    }

    private float category(int f) {
      for (int code = 0; code < allowed[f].length; code++) {
        if (allowed[f][code]) {
          return code;
        }
      }
      return Float.NaN;
    }
  }
}
