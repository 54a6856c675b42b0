package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class FlatTreeTest {
  private static final Schema ONE = new Schema(List.of(Feature.numeric("v")), "y",
      List.of("left", "right"));
  private static final ClassCounts ANY = ClassCounts.of(1, 1);

  /** Floats where comparisons change: signed zeros, subnormals, extremes, NaNs of both signs. */
  private static List<Float> edges() {
    List<Float> out = new ArrayList<>();
    float[] base = {0f, -0f, Float.MIN_VALUE, -Float.MIN_VALUE, Float.MIN_NORMAL,
        -Float.MIN_NORMAL, Math.nextDown(Float.MIN_NORMAL), 1f, -1f, 2.5f, -2.5f, 0x1p24f,
        Float.MAX_VALUE, -Float.MAX_VALUE, Float.POSITIVE_INFINITY, Float.NEGATIVE_INFINITY};
    for (float b : base) {
      out.add(b);
      out.add(Math.nextUp(b));
      out.add(Math.nextDown(b));
    }
    out.add(Float.NaN);
    out.add(Float.intBitsToFloat(0xffc00000)); // a NaN with the sign bit set
    out.add(Float.intBitsToFloat(0x7f800001)); // the smallest signalling NaN payload
    out.add(Float.intBitsToFloat(0xffffffff));
    return out;
  }

  @Test
  void orderKeysCompareAsIeee754OnEveryEdgePair() {
    for (float a : edges()) {
      for (float b : edges()) {
        if (Float.isNaN(a) || Float.isNaN(b) || a == 0f && b == 0f) {
          continue;
        }
        // IEEE 754-2019 §5.11: the order of non-NaN values; JLS §15.20.1 gives Java's "<".
        assertThat(FlatTree.floatKey(a) < FlatTree.floatKey(b)).as(a + " < " + b).isEqualTo(a < b);
        assertThat(FlatTree.doubleKey(a) < FlatTree.doubleKey(b)).isEqualTo(a < b);
      }
    }
    // -0.0 == +0.0 (IEEE 754-2019 §5.11): a threshold of either zero has one key.
    assertThat(FlatTree.floatKey(-0f)).isEqualTo(FlatTree.floatKey(0f)).isZero();
  }

  @Test
  void oneSplitSendsEveryEdgeInputWhereTheComparisonDoes() {
    for (float t : edges()) {
      if (Float.isNaN(t)) {
        continue;
      }
      for (boolean missingLeft : new boolean[] {false, true}) {
        DecisionTree tree = new DecisionTree(ONE, new NumericSplit(0, t, missingLeft,
            new Leaf(0, ANY), new Leaf(1, ANY), ANY));
        FlatTree flat = FlatTree.of(tree, InputKind.FLOAT, Leaf::prediction);
        for (float x : edges()) {
          // JLS §15.20.1: "x <= t" is false when either is NaN; NaN takes the stored side.
          int expected = Float.isNaN(x) ? (missingLeft ? 0 : 1) : x <= t ? 0 : 1;
          assertThat(flat.walk(new float[] {x})).as(x + " vs " + t).isEqualTo(expected)
              .isEqualTo(tree.predict(new float[] {x}));
        }
      }
    }
  }

  @Test
  void categoricalSlotsSendMissingAndUnknownCodesToTheMissingSide() {
    Schema schema = new Schema(List.of(Feature.categorical("c", List.of("a", "b", "c"))), "y",
        List.of("left", "right"));
    for (boolean missingLeft : new boolean[] {false, true}) {
      DecisionTree tree = new DecisionTree(schema, new CategoricalSplit(0,
          CategoricalSplit.CodeSet.of(0, 2), missingLeft, new Leaf(0, ANY), new Leaf(1, ANY),
          ANY));
      FlatTree flat = FlatTree.of(tree, InputKind.FLOAT, Leaf::prediction);
      float[] inputs = {0f, -0f, 1f, 2f, 3f, -1f, 0.5f, 1.5f, 2.0000002f, Float.NaN, 1e10f,
          0x1p31f, -0x1p31f, Float.POSITIVE_INFINITY, Float.NEGATIVE_INFINITY, Float.MIN_VALUE};
      for (float x : inputs) {
        assertThat(flat.walk(new float[] {x})).as("code " + x)
            .isEqualTo(tree.predict(new float[] {x}));
      }
    }
  }

  @Test
  void randomTreesWalkAsTheModelPredicts() {
    SplittableRandom random = new SplittableRandom(17);
    for (int n = 0; n < 300; n++) {
      RandomTrees.Shape drawn = RandomTrees.shape(random);
      DecisionTree tree = RandomTrees.tree(random, new RandomTrees.Shape(
          Math.min(12, drawn.maxDepth()), drawn.maxNodes(), drawn.features(), drawn.classes()));
      FlatTree flat = FlatTree.of(tree, InputKind.FLOAT, Leaf::prediction);
      // Padded deeper, as an ensemble's trees are to share one step count: the same leaves.
      int deeper = flat.depth() + 1 + random.nextInt(3);
      FlatTree padded = FlatTree.of(tree, InputKind.FLOAT, Leaf::prediction, deeper);
      assertThat(padded.depth()).isEqualTo(deeper);
      assertThat(FlatTree.of(tree, InputKind.FLOAT, Leaf::prediction,
          Math.max(0, flat.depth() - 1)).depth())
          .isEqualTo(flat.depth());
      List<Float> edges = edges();
      for (int probe = 0; probe < 200; probe++) {
        float[] x = new float[tree.schema().featureCount()];
        for (int f = 0; f < x.length; f++) {
          x[f] = random.nextBoolean() ? edges.get(random.nextInt(edges.size()))
              : (float) (random.nextGaussian() * 10);
        }
        assertThat(flat.walk(x)).isEqualTo(tree.predict(x));
        assertThat(padded.walk(x)).isEqualTo(tree.predict(x));
      }
    }
  }

  @Test
  void refusesAPaddingDepthOutsideTheLayoutsRange() {
    DecisionTree tree = new DecisionTree(ONE, new Leaf(0, ANY));
    assertThatThrownBy(() -> FlatTree.of(tree, InputKind.FLOAT, Leaf::prediction, 17))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("depth must be between 0 and 16, but it is 17");
    assertThatThrownBy(() -> FlatTree.of(tree, InputKind.FLOAT, Leaf::prediction, -1))
        .hasMessage("depth must be between 0 and 16, but it is -1");
  }

  @Test
  void refusesTreesDeeperThanSixteenNamingTheOption() {
    Node node = new Leaf(0, ANY);
    for (int d = 0; d < 17; d++) {
      node = new NumericSplit(0, d, true, node, new Leaf(1, ANY), ANY);
    }
    DecisionTree tree = new DecisionTree(ONE, node);
    assertThatThrownBy(() -> FlatTree.of(tree, InputKind.FLOAT, Leaf::prediction))
        .isInstanceOfSatisfying(EmitLimitException.class, e -> assertThat(e.option())
            .isEqualTo("layout"))
        .hasMessage("the flat layout pads the tree to a complete tree of its depth, at most 16,"
            + " but the tree has depth 17: use --layout table");
  }
}
