package dev.splitwright.verify;

import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
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
    PathState.forEachSplit(tree, (split, state) -> action.accept(split, witness(state)));
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

  /** An input that satisfies every comparison on the path, preferring present values. */
  private static float[] witness(PathState state) {
    float[] x = new float[state.low().length];
    for (int f = 0; f < x.length; f++) {
      if (state.isCategorical(f)) {
        int code = state.firstAllowedCode(f);
        x[f] = code < 0 ? Float.NaN : code;
      } else {
        x[f] = numeric(state.low()[f], state.high()[f]);
      }
    }
    return x;
  }

  /** A value v with {@code low < v <= high}, or NaN if there is none. */
  private static float numeric(float low, float high) {
    if (low < high) {
      if (high != Float.POSITIVE_INFINITY) {
        return high;
      }
      return low == Float.NEGATIVE_INFINITY ? 0f : Math.nextUp(low);
    }
    return Float.NaN;
  }
}
