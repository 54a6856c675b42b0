package dev.splitwright.cgen;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * Hand-built trees for the C back end, and every combination of the values where their
 * comparisons can go wrong (IEEE 754: neighbours of each threshold, NaN with several payloads and
 * signs, signed zeros, infinities, the largest and smallest magnitudes; invalid category codes).
 */
final class HandTrees {
  private HandTrees() {}

  private static final ClassCounts ANY = ClassCounts.of(1, 1, 1);

  /** Numeric and categorical splits (one set past 32 codes), NaN going left and right. */
  static DecisionTree mixed() {
    List<String> zones = new ArrayList<>();
    for (int z = 0; z < 40; z++) {
      zones.add("z" + z);
    }
    Schema schema = new Schema(List.of(Feature.numeric("speed"), Feature.numeric("temp"),
        Feature.categorical("mode", List.of("auto", "boost", "eco", "manual", "off")),
        Feature.categorical("zone", zones)), "state", List.of("normal", "worn", "broken"));
    Node root = num(0, 0.1f, true,
        cat(2, new int[] {0, 3}, false,
            leaf(0, 5, 1, 0),
            num(1, -0.0f, false, leaf(1, 0, 3, 1), leaf(2, 1, 1, 1))),
        num(1, Float.MIN_VALUE, true,
            num(0, Float.POSITIVE_INFINITY, false, leaf(2, 0, 0, 7), leaf(0, 0, 0, 0)),
            cat(3, new int[] {1, 33, 39}, true,
                num(0, Float.NEGATIVE_INFINITY, true, leaf(1, 2, 9, 0), leaf(0, 4, 0, 0)),
                num(1, 16777218f, false,
                    num(0, 3e9f, false, leaf(1, 1, 2, 3),
                        num(1, -3e9f, true, leaf(0, 3, 2, 2), leaf(2, 1, 5, 7))),
                    num(0, Float.POSITIVE_INFINITY, true, leaf(2, 0, 1, 6),
                        num(1, Float.MAX_VALUE, false, leaf(1, 1, 6, 0),
                            leaf(0, 7, 0, 1)))))));
    return new DecisionTree(schema, root);
  }

  /** A single leaf: the input is never read. */
  static DecisionTree singleLeaf() {
    Schema schema = new Schema(List.of(Feature.numeric("x")), "y", List.of("a", "b", "c"));
    return new DecisionTree(schema, leaf(1, 2, 5, 0));
  }

  /** Only categorical splits, one with an empty code set: no thresholds at all. */
  static DecisionTree categoricalOnly() {
    Schema schema = new Schema(List.of(Feature.categorical("colour", List.of("red", "green",
        "blue"))), "y", List.of("a", "b", "c"));
    Node root = cat(0, new int[] {}, true, leaf(2, 0, 0, 0),
        cat(0, new int[] {1}, false, leaf(0, 3, 0, 0), leaf(1, 0, 3, 0)));
    return new DecisionTree(schema, root);
  }

  static List<DecisionTree> all() {
    return List.of(mixed(), singleLeaf(), categoricalOnly());
  }

  /** Every combination of each feature's interesting float values. */
  static List<float[]> floatInputs(DecisionTree tree) {
    List<float[]> perFeature = new ArrayList<>();
    for (int f = 0; f < tree.schema().featureCount(); f++) {
      Set<Float> values = new LinkedHashSet<>();
      Feature feature = tree.schema().feature(f);
      if (feature.isCategorical()) {
        int k = feature.categories().size();
        for (int code : new int[] {0, 1, 2, 3, 4, 31, 32, 33, 34, 38, 39, 40}) {
          if (code <= k) {
            values.add((float) code);
          }
        }
        values.add((float) k);
        for (float v : new float[] {-1f, 0.5f, k - 0.5f, -0.0f, 1e10f, -1e10f, 0x1p31f,
            0x1p32f, Float.MAX_VALUE, Float.MIN_VALUE}) {
          values.add(v);
        }
      } else {
        for (Split split : tree.splitsPreOrder()) {
          if (split.feature() == f && split instanceof NumericSplit numeric) {
            float t = numeric.threshold();
            values.add(t);
            values.add(Math.nextUp(t));
            values.add(Math.nextDown(t));
          }
        }
        for (float v : new float[] {0.0f, -0.0f, 1f, -1f, Float.MAX_VALUE, -Float.MAX_VALUE,
            Float.MIN_VALUE, -Float.MIN_VALUE, Float.POSITIVE_INFINITY,
            Float.NEGATIVE_INFINITY}) {
          values.add(v);
        }
      }
      // Set<Float> keeps one NaN; these are distinct bit patterns: quiet, negative, signalling.
      float[] list = new float[values.size() + 3];
      int i = 0;
      for (float v : values) {
        list[i++] = v;
      }
      list[i++] = Float.intBitsToFloat(0x7fc00000);
      list[i++] = Float.intBitsToFloat(0xffc00001);
      list[i] = Float.intBitsToFloat(0x7f800001);
      perFeature.add(list);
    }
    List<float[]> out = new ArrayList<>();
    product(perFeature, 0, new float[perFeature.size()], out);
    return out;
  }

  private static void product(List<float[]> perFeature, int f, float[] row, List<float[]> out) {
    if (f == perFeature.size()) {
      out.add(row.clone());
      return;
    }
    for (float v : perFeature.get(f)) {
      row[f] = v;
      product(perFeature, f + 1, row, out);
    }
  }

  /** Every combination of each feature's interesting int values. */
  static List<int[]> intInputs(DecisionTree tree) {
    List<int[]> perFeature = new ArrayList<>();
    for (int f = 0; f < tree.schema().featureCount(); f++) {
      Set<Integer> values = new LinkedHashSet<>(List.of(Integer.MIN_VALUE, Integer.MAX_VALUE,
          -1, 0, 1, Integer.MIN_VALUE + 1, Integer.MAX_VALUE - 1));
      Feature feature = tree.schema().feature(f);
      if (feature.isCategorical()) {
        for (int code = 0; code <= feature.categories().size(); code++) {
          values.add(code);
        }
      } else {
        for (Split split : tree.splitsPreOrder()) {
          if (split.feature() == f && split instanceof NumericSplit numeric) {
            long n = dev.splitwright.emit.Thresholds.forInt(numeric.threshold());
            for (long v = n - 1; v <= n + 1; v++) {
              values.add((int) Math.max(Integer.MIN_VALUE, Math.min(Integer.MAX_VALUE, v)));
            }
          }
        }
        // Past 2^24 ints convert to float with rounding (IEEE 754 round to nearest, ties even).
        for (int v : new int[] {16777217, 16777219, 16777220, 16777221}) {
          values.add(v);
        }
      }
      perFeature.add(values.stream().mapToInt(Integer::intValue).toArray());
    }
    List<int[]> out = new ArrayList<>();
    intProduct(perFeature, 0, new int[perFeature.size()], out);
    return out;
  }

  private static void intProduct(List<int[]> perFeature, int f, int[] row, List<int[]> out) {
    if (f == perFeature.size()) {
      out.add(row.clone());
      return;
    }
    for (int v : perFeature.get(f)) {
      row[f] = v;
      intProduct(perFeature, f + 1, row, out);
    }
  }

  static Leaf leaf(int prediction, int... counts) {
    return new Leaf(prediction, ClassCounts.of(counts));
  }

  static NumericSplit num(int feature, float t, boolean missingLeft, Node left, Node right) {
    return new NumericSplit(feature, t, missingLeft, left, right, ANY);
  }

  static CategoricalSplit cat(int feature, int[] codes, boolean missingLeft, Node left,
      Node right) {
    return new CategoricalSplit(feature, CategoricalSplit.CodeSet.of(codes), missingLeft, left,
        right, ANY);
  }
}
