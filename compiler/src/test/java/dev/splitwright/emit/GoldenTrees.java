package dev.splitwright.emit;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import java.util.List;

/** A small hand-built tree: a numeric split, a categorical one, missing values going left. */
final class GoldenTrees {
  private GoldenTrees() {}

  static final Schema SCHEMA = new Schema(
      List.of(Feature.numeric("rms velocity"),
          Feature.categorical("mode", List.of("auto", "manual", "service"))),
      "state", List.of("normal", "worn"));

  /**
   * {@code rms velocity <= 2.5} (missing goes right), then on the left {@code mode in {auto,
   * service}} (missing goes left), on the right {@code rms velocity <= 7.25} (missing goes left);
   * the leaves say normal, worn, normal, worn.
   */
  static DecisionTree pump() {
    CategoricalSplit mode = new CategoricalSplit(1, CategoricalSplit.CodeSet.of(0, 2), true,
        new Leaf(0, ClassCounts.of(6, 0)), new Leaf(1, ClassCounts.of(1, 3)),
        ClassCounts.of(7, 3));
    NumericSplit high = new NumericSplit(0, 7.25f, true, new Leaf(0, ClassCounts.of(3, 1)),
        new Leaf(1, ClassCounts.of(0, 5)), ClassCounts.of(3, 6));
    return new DecisionTree(SCHEMA,
        new NumericSplit(0, 2.5f, false, mode, high, ClassCounts.of(10, 9)));
  }
}
