package dev.splitwright.verify;

import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.List;

/**
 * Double inputs for a classifier that takes {@code double[]}: the model decides on {@code (float)
 * x}, so what needs probing is where the rounding to float changes (JLS §5.1.3, IEEE 754 round to
 * nearest, ties to even). For each split, reached as in {@link BoundaryProbes}, the split's feature
 * takes the doubles at and next to the two halfway points around the threshold t: between {@code
 * nextDown(t)} and t, and between t and {@code nextUp(t)}. The emitted double threshold is the
 * largest double that rounds to t or below, so it is one of these; they are worked out here from
 * the float neighbours alone, independently of the emitter.
 */
final class DoubleProbes {
  /** Halfway between {@code Float.MAX_VALUE} and 2^128: from here on doubles round to infinity. */
  private static final double OVERFLOW = 0x1.ffffffp127;

  private static final double[] SPECIALS = {
    Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, 0.0, -0.0,
    Double.MIN_VALUE, -Double.MIN_VALUE, 1e-300, -1e-300, Double.MAX_VALUE, -Double.MAX_VALUE,
    OVERFLOW, Math.nextDown(OVERFLOW), Math.nextUp(OVERFLOW),
    -OVERFLOW, Math.nextDown(-OVERFLOW), Math.nextUp(-OVERFLOW)
  };

  private DoubleProbes() {}

  static List<double[]> of(DecisionTree tree) {
    List<double[]> out = new ArrayList<>();
    BoundaryProbes.forEachSplit(tree, (split, witness) -> {
      double[] base = new double[witness.length];
      for (int f = 0; f < base.length; f++) {
        base[f] = witness[f];
      }
      for (double v : valuesAround(tree, split)) {
        double[] probe = base.clone();
        probe[split.feature()] = v;
        out.add(probe);
      }
    });
    return out;
  }

  private static List<Double> valuesAround(DecisionTree tree, Split split) {
    List<Double> values = new ArrayList<>();
    for (double v : SPECIALS) {
      values.add(v);
    }
    if (split instanceof NumericSplit numeric) {
      float t = numeric.threshold();
      values.add((double) t);
      aroundHalfway(values, Math.nextDown(t), t);
      aroundHalfway(values, t, Math.nextUp(t));
      return values;
    }
    int k = tree.schema().feature(split.feature()).categories().size();
    int[] inside = ((CategoricalSplit) split).leftCodes().toArray();
    int[] codes = {0, k - 1, k, inside.length == 0 ? 0 : inside[0]};
    for (int code : codes) {
      // A hair off a code is the code once it is a float; a third off is not a code at all.
      for (double off : new double[] {0, 1e-9, -1e-9, 0.3, -0.3}) {
        values.add(code + off);
      }
    }
    return values;
  }

  /** Adds the double halfway between adjacent floats {@code low < high} and its neighbours. */
  private static void aroundHalfway(List<Double> values, float low, float high) {
    double half;
    if (Float.isInfinite(high)) {
      half = high > 0 ? OVERFLOW : Double.NEGATIVE_INFINITY;
    } else if (Float.isInfinite(low)) {
      half = -OVERFLOW;
    } else {
      // Exact: two floats' sum needs 25 significant bits, a double has 53.
      half = ((double) low + (double) high) / 2;
    }
    values.add(half);
    values.add(Math.nextDown(half));
    values.add(Math.nextUp(half));
  }

  /** The float input the model sees for a double input. */
  static float[] narrow(double[] x) {
    float[] out = new float[x.length];
    for (int f = 0; f < out.length; f++) {
      out[f] = (float) x[f];
    }
    return out;
  }
}
