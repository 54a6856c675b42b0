package dev.splitwright.emit;

import dev.splitwright.data.Schema;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/** Seeded random ensembles over one random schema each, for the property tests of the back ends. */
public final class RandomEnsembles {
  private RandomEnsembles() {}

  /**
   * A forest or a boosted ensemble of 1 to 80 trees (mostly up to 8) of depth 0 to 6, over 1 to
   * 12 features (one in five categorical, see {@link RandomTrees#schema}); boosted weights of
   * many magnitudes, so that the float sums round and their order matters.
   */
  public static TreeEnsemble ensemble(SplittableRandom random) {
    Schema schema = RandomTrees.schema(random, 1 + random.nextInt(12),
        1 + random.nextInt(random.nextInt(4) == 0 ? 12 : 4));
    int count = 1 + random.nextInt(random.nextInt(5) == 0 ? 80 : 8);
    List<DecisionTree> trees = new ArrayList<>();
    for (int t = 0; t < count; t++) {
      trees.add(RandomTrees.tree(random, schema, random.nextInt(7), 1 + random.nextInt(60)));
    }
    if (random.nextBoolean()) {
      return TreeEnsemble.forest(trees);
    }
    float[] weights = new float[count];
    for (int t = 0; t < count; t++) {
      weights[t] = (float) (random.nextDouble() * Math.pow(10, random.nextInt(-3, 4)))
          + Float.MIN_NORMAL;
    }
    return TreeEnsemble.boosted(trees, weights);
  }
}
