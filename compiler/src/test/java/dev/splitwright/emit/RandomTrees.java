package dev.splitwright.emit;

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

/**
 * Seeded random trees for property tests: random shapes up to a depth and node count, numeric and
 * categorical features, and thresholds drawn from values where float comparisons are easy to get
 * wrong (IEEE 754: subnormals, signed zeros, neighbouring floats, the largest finite values and the
 * infinities, integers past 2^24 and past the int range).
 */
public final class RandomTrees {
  private RandomTrees() {}

  /** How big a tree to grow. */
  public record Shape(int maxDepth, int maxNodes, int features, int classes) {}

  /**
   * A random shape: depth 0-20; mostly small trees, one in twenty up to 20,000 nodes (sizes
   * log-uniform, so most of those still have a few hundred).
   */
  public static Shape shape(SplittableRandom random) {
    int depth = random.nextInt(21);
    double logMax = random.nextInt(20) == 0 ? Math.log(20_000) : Math.log(300);
    int nodes = (int) Math.exp(random.nextDouble() * logMax);
    return new Shape(depth, Math.max(1, nodes), 1 + random.nextInt(random.nextBoolean() ? 8 : 200),
        1 + random.nextInt(random.nextInt(4) == 0 ? 40 : 6));
  }

  /** A schema: one feature in five categorical, with 1 to 100 categories (past 64 sometimes). */
  public static Schema schema(SplittableRandom random, int features, int classes) {
    List<Feature> list = new ArrayList<>();
    for (int f = 0; f < features; f++) {
      if (random.nextInt(5) == 0) {
        int k = 1 + random.nextInt(random.nextBoolean() ? 8 : 100);
        List<String> categories = new ArrayList<>();
        for (int c = 0; c < k; c++) {
          categories.add("c" + c);
        }
        list.add(Feature.categorical("f" + f, categories));
      } else {
        list.add(Feature.numeric("f" + f));
      }
    }
    List<String> labels = new ArrayList<>();
    for (int c = 0; c < classes; c++) {
      labels.add("class" + c);
    }
    return new Schema(list, "target", labels);
  }

  public static DecisionTree tree(SplittableRandom random, Shape shape) {
    Schema schema = schema(random, shape.features(), shape.classes());
    return tree(random, schema, shape.maxDepth(), shape.maxNodes());
  }

  /**
   * Grows a tree by splitting random leaves of the frontier until it has about {@code maxNodes}
   * nodes or every leaf is at {@code maxDepth}.
   */
  public static DecisionTree tree(SplittableRandom random, Schema schema, int maxDepth,
      int maxNodes) {
    float[][] pools = new float[schema.featureCount()][];
    for (int f = 0; f < pools.length; f++) {
      pools[f] = thresholdPool(random);
    }
    Proto root = new Proto(0);
    List<Proto> frontier = new ArrayList<>(List.of(root));
    int nodes = 1;
    while (nodes + 2 <= maxNodes && !frontier.isEmpty()) {
      Proto leaf = frontier.remove(random.nextInt(frontier.size()));
      if (leaf.depth >= maxDepth) {
        continue;
      }
      leaf.left = new Proto(leaf.depth + 1);
      leaf.right = new Proto(leaf.depth + 1);
      frontier.add(leaf.left);
      frontier.add(leaf.right);
      nodes += 2;
    }
    return new DecisionTree(schema, build(root, schema, pools, random));
  }

  private static final class Proto {
    final int depth;
    Proto left;
    Proto right;

    Proto(int depth) {
      this.depth = depth;
    }
  }

  private static Node build(Proto proto, Schema schema, float[][] pools,
      SplittableRandom random) {
    ClassCounts counts = counts(random, schema.classCount());
    if (proto.left == null) {
      return new Leaf(random.nextInt(schema.classCount()), counts);
    }
    Node left = build(proto.left, schema, pools, random);
    Node right = build(proto.right, schema, pools, random);
    // A split's rows are its children's, as in a trained tree (model files are checked for it);
    // the draw above stays, so the random stream and every other choice are as before.
    counts = sum(left.counts(), right.counts());
    int f = random.nextInt(schema.featureCount());
    boolean missingLeft = random.nextBoolean();
    Feature feature = schema.feature(f);
    if (feature.isCategorical()) {
      int k = feature.categories().size();
      List<Integer> codes = new ArrayList<>();
      for (int c = 0; c < k; c++) {
        if (random.nextBoolean()) {
          codes.add(c);
        }
      }
      int[] array = codes.stream().mapToInt(Integer::intValue).toArray();
      return new CategoricalSplit(f, CategoricalSplit.CodeSet.of(array), missingLeft, left, right,
          counts);
    }
    float[] pool = pools[f];
    return new NumericSplit(f, pool[random.nextInt(pool.length)], missingLeft, left, right, counts);
  }

  private static ClassCounts sum(ClassCounts a, ClassCounts b) {
    int[] total = a.toArray();
    for (int c = 0; c < total.length; c++) {
      total[c] = Math.addExact(total[c], b.get(c));
    }
    return ClassCounts.of(total);
  }

  private static ClassCounts counts(SplittableRandom random, int classes) {
    int[] counts = new int[classes];
    if (random.nextInt(20) != 0) {
      // Mostly a few classes present; now and then an empty leaf (total 0).
      for (int i = 0; i < 1 + random.nextInt(3); i++) {
        counts[random.nextInt(classes)] += 1 + random.nextInt(random.nextBoolean() ? 7 : 5000);
      }
    }
    return ClassCounts.of(counts);
  }

  /** About a dozen thresholds for one feature, so that paths compare neighbours on one feature. */
  static float[] thresholdPool(SplittableRandom random) {
    int size = 1 + random.nextInt(12);
    float[] pool = new float[size];
    float base = (float) (random.nextGaussian() * Math.pow(10, random.nextInt(-3, 6)));
    for (int i = 0; i < size; i++) {
      pool[i] = switch (random.nextInt(10)) {
        case 0 -> SPECIALS[random.nextInt(SPECIALS.length)];
        case 1, 2 -> {
          // Neighbouring floats: a few ulps from a shared base.
          float v = base;
          for (int steps = random.nextInt(-3, 4); steps != 0; steps -= Integer.signum(steps)) {
            v = steps > 0 ? Math.nextUp(v) : Math.nextDown(v);
          }
          yield v;
        }
        case 3 -> (float) random.nextInt(-5, 6);
        case 4 -> random.nextInt(-5, 6) + 0.5f;
        case 5 -> Float.intBitsToFloat(random.nextInt(1, 0x800000) * (random.nextBoolean() ? 1 : -1)
            & 0x807fffff);
        default -> (float) (random.nextGaussian() * Math.pow(10, random.nextInt(-3, 6)));
      };
    }
    return pool;
  }

  /**
   * A full tree of {@code depth} on one feature with thresholds 0.5, 1.5, 2.5 ... in order, so
   * every split has a threshold (and a class-file constant) of its own.
   */
  public static DecisionTree distinctThresholds(int depth) {
    Schema schema = new Schema(List.of(Feature.numeric("x")), "y", List.of("a", "b"));
    return new DecisionTree(schema, distinct(depth, new int[1]));
  }

  private static Node distinct(int depth, int[] next) {
    ClassCounts counts = ClassCounts.of(1, 1);
    if (depth == 0) {
      return new Leaf(next[0] % 2, counts);
    }
    Node left = distinct(depth - 1, next);
    float threshold = next[0]++ + 0.5f;
    return new NumericSplit(0, threshold, false, left, distinct(depth - 1, next), counts);
  }

  /** Values where comparisons in float, double and int conversions are easy to get wrong. */
  private static final float[] SPECIALS = {
    0.0f, -0.0f, Float.MIN_VALUE, -Float.MIN_VALUE, Float.MIN_NORMAL,
    Math.nextDown(Float.MIN_NORMAL), Float.MAX_VALUE, -Float.MAX_VALUE,
    Float.POSITIVE_INFINITY, Float.NEGATIVE_INFINITY, 0x1p24f, Math.nextUp(0x1p24f), 0x1p31f,
    Math.nextDown(0x1p31f), -0x1p31f, Math.nextDown(-0x1p31f), Math.nextUp(-0x1p31f), 0.5f, -0.5f,
    1.0f, 2.0f
  };
}
