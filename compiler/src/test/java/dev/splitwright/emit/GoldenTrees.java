package dev.splitwright.emit;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import java.util.List;

/** A small hand-built tree with a numeric split, a categorical one and missing values going left. */
final class GoldenTrees {
  private GoldenTrees() {}

  static final Schema SCHEMA = new Schema(
      List.of(Feature.numeric("rms velocity"),
          Feature.categorical("mode", List.of("auto", "manual", "service"))),
      "state", List.of("normal", "worn"));

  /**
   * {@code rms velocity <= 2.5} (missing goes right), then on the left {@code mode in {auto,
   * service}} (missing goes left), on the right {@code rms velocity <= 7.25} (missing goes left).
   */
  static DecisionTree pump() {
    Leaf normalPure = new Leaf(0, ClassCounts.of(6, 0));
    Leaf mixed = new Leaf(0, ClassCounts.of(3, 1));
    Leaf wornMost = new Leaf(1, ClassCounts.of(1, 3));
    Leaf wornPure = new Leaf(1, ClassCounts.of(0, 5));
    CategoricalSplit mode = new CategoricalSplit(1, CategoricalSplit.CodeSet.of(0, 2), true,
        normalPure, mixed, ClassCounts.of(9, 1));
    NumericSplit high = new NumericSplit(0, 7.25f, true, wornMost, wornPure, ClassCounts.of(1, 8));
    return new DecisionTree(SCHEMA,
        new NumericSplit(0, 2.5f, false, mode, high, ClassCounts.of(10, 9)));
  }
}
