package dev.splitwright.verify;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.util.Arrays;
import java.util.function.BiConsumer;

/**
 * What the path from the root to a node demands of each feature, shared by the float, int and
 * double probe builders: numeric feature f must satisfy {@code low[f] < x <= high[f]} (bounds are
 * thresholds, in float32), a categorical one must hold a code still allowed, and a missing value
 * passes only while every split on the path sent missing values this way. Immutable; each step
 * copies what it changes.
 */
record PathState(float[] low, float[] high, boolean[][] allowed, boolean[] missingAllowed) {

  /** Calls {@code action} for every split in pre-order with the demands of the path to it. */
  static void forEachSplit(DecisionTree tree, BiConsumer<Split, PathState> action) {
    visit(tree.root(), initial(tree.schema()), action);
  }

  private static void visit(Node node, PathState state, BiConsumer<Split, PathState> action) {
    if (!(node instanceof Split split)) {
      return;
    }
    action.accept(split, state);
    visit(split.left(), state.then(split, true), action);
    visit(split.right(), state.then(split, false), action);
  }

  static PathState initial(Schema schema) {
    int n = schema.featureCount();
    float[] low = new float[n];
    float[] high = new float[n];
    Arrays.fill(low, Float.NEGATIVE_INFINITY);
    Arrays.fill(high, Float.POSITIVE_INFINITY);
    boolean[][] allowed = new boolean[n][];
    for (int f = 0; f < n; f++) {
      Feature feature = schema.feature(f);
      if (feature.isCategorical()) {
        allowed[f] = new boolean[feature.categories().size()];
        Arrays.fill(allowed[f], true);
      }
    }
    boolean[] missing = new boolean[n];
    Arrays.fill(missing, true);
    return new PathState(low, high, allowed, missing);
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
      newAllowed = allowed.clone();
      boolean[] codes = allowed[f].clone();
      CategoricalSplit categorical = (CategoricalSplit) split;
      for (int code = 0; code < codes.length; code++) {
        if (categorical.leftCodes().contains(code) != left) {
          codes[code] = false;
        }
      }
      newAllowed[f] = codes;
    }
    boolean[] newMissing = missingAllowed;
    if (split.missingLeft() != left && missingAllowed[f]) {
      newMissing = missingAllowed.clone();
      newMissing[f] = false;
    }
    return new PathState(newLow, newHigh, newAllowed, newMissing);
  }

  boolean isCategorical(int f) {
    return allowed[f] != null;
  }

  /** The smallest code of categorical feature f still allowed, or -1 if none is. */
  int firstAllowedCode(int f) {
    for (int code = 0; code < allowed[f].length; code++) {
      if (allowed[f][code]) {
        return code;
      }
    }
    return -1;
  }
}
