package dev.splitwright.verify;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import java.util.Arrays;

/**
 * The categorical half of a path constraint, shared by the float and int probe builders: for
 * each categorical feature, the codes that still reach the node ({@code null} for numeric ones).
 */
final class CategoryPath {
  private CategoryPath() {}

  /** Every code of every categorical feature allowed; {@code null} rows for numeric features. */
  static boolean[][] allAllowed(Schema schema) {
    boolean[][] allowed = new boolean[schema.featureCount()][];
    for (int f = 0; f < allowed.length; f++) {
      Feature feature = schema.feature(f);
      if (feature.isCategorical()) {
        allowed[f] = new boolean[feature.categories().size()];
        Arrays.fill(allowed[f], true);
      }
    }
    return allowed;
  }

  /** A copy of {@code allowed} keeping, for the split's feature, only codes sent that way. */
  static boolean[][] narrow(boolean[][] allowed, CategoricalSplit split, boolean left) {
    boolean[][] out = allowed.clone();
    boolean[] codes = allowed[split.feature()].clone();
    for (int code = 0; code < codes.length; code++) {
      if (split.leftCodes().contains(code) != left) {
        codes[code] = false;
      }
    }
    out[split.feature()] = codes;
    return out;
  }
}
