package dev.splitwright.model;

import dev.splitwright.data.Schema;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * An immutable ensemble of decision trees over one {@link Schema}, each tree voting for the class
 * of the leaf an input reaches. {@link #predict} and {@link #probabilities} are the oracle emitted
 * code must reproduce bit for bit, so the combination is one fixed sequence of float32 operations:
 *
 * <ol>
 *   <li>{@code score[c] = 0.0f} for every class; then for tree {@code t = 0, 1, 2, ...} in order,
 *       {@code score[p] = score[p] + weight(t)} in float32, where {@code p} is the class of the
 *       leaf tree {@code t} reaches (the other classes are left as they are);
 *   <li>the prediction is the class with the largest score, the lowest class index on ties;
 *   <li>{@code total = weight(0) + weight(1) + ...} in float32, in tree order (a constant of the
 *       model, {@link #totalWeight()});
 *   <li>probability {@code p[c] = score[c] / total}, one float32 division per class.
 * </ol>
 *
 * <p>Every step is a correctly rounded IEEE 754 binary32 operation, so Java (strict since JEP 306)
 * and C compiled with {@code FLT_EVAL_METHOD == 0} and {@code -ffp-contract=off} give the same
 * bits; no {@code exp} or other library function is involved. All weights are positive, so
 * every score lies in {@code [0, total]} (float addition is monotone) and every probability in
 * {@code [0, 1]}.
 *
 * <p>The two kinds differ only in their weights:
 *
 * <ul>
 *   <li>{@link Kind#FOREST}: a voting forest (Breiman 2001, "Random Forests"); every weight is
 *       {@code 1.0f}, so the scores are the vote counts (exact integers below 2^24), the
 *       prediction is the class with the most votes and the probabilities are the vote shares
 *       {@code votes[c] / trees}, each one correctly rounded division;
 *   <li>{@link Kind#BOOSTED}: SAMME, the multiclass AdaBoost of Zhu, Zou, Rosset and Hastie
 *       (2009), "Multi-class AdaBoost": each tree has its own positive float32 weight (its
 *       {@code alpha}), and the probabilities are the weighted vote shares.
 * </ul>
 */
public final class TreeEnsemble implements Classifier {
  /** Most trees an ensemble may have, trained or read from a model file. */
  public static final int MAX_TREES = 4096;

  /** How the trees were trained, which fixes the meaning of the weights. */
  public enum Kind {
    /** Bootstrap samples and a random subset of features per split, unit weights. */
    FOREST,
    /** SAMME boosting: each tree weighted by its accuracy on the reweighted training rows. */
    BOOSTED;

    /** The lower-case name a model file and a report use: {@code forest} or {@code boosted}. */
    public String fileName() {
      return name().toLowerCase(Locale.ROOT);
    }
  }

  private final Kind kind;
  private final Schema schema;
  private final List<DecisionTree> trees;
  private final float[] weights;
  private final float totalWeight;

  private TreeEnsemble(Kind kind, List<DecisionTree> trees, float[] weights) {
    this.kind = kind;
    this.trees = List.copyOf(trees);
    if (this.trees.isEmpty() || this.trees.size() > MAX_TREES) {
      throw new IllegalArgumentException(
          "an ensemble needs 1 to " + MAX_TREES + " trees, not " + this.trees.size());
    }
    this.schema = this.trees.get(0).schema();
    for (int t = 1; t < this.trees.size(); t++) {
      if (!this.trees.get(t).schema().equals(schema)) {
        throw new IllegalArgumentException("tree " + t + " has another schema than tree 0");
      }
    }
    if (weights.length != this.trees.size()) {
      throw new IllegalArgumentException(
          "expected " + this.trees.size() + " tree weights but got " + weights.length);
    }
    float total = 0f;
    for (int t = 0; t < weights.length; t++) {
      if (!(weights[t] > 0f) || Float.isInfinite(weights[t])) {
        throw new IllegalArgumentException(
            "weight of tree " + t + " must be positive and finite, but it is " + weights[t]);
      }
      total += weights[t];
    }
    if (Float.isInfinite(total)) {
      throw new IllegalArgumentException("the tree weights sum beyond the float32 range");
    }
    this.weights = weights;
    this.totalWeight = total;
  }

  /** Creates a voting forest of {@code trees}; every tree's vote counts once. */
  public static TreeEnsemble forest(List<DecisionTree> trees) {
    Objects.requireNonNull(trees, "trees");
    float[] ones = new float[trees.size()];
    Arrays.fill(ones, 1f);
    return new TreeEnsemble(Kind.FOREST, trees, ones);
  }

  /**
   * Creates a boosted ensemble: tree {@code t} votes with {@code weights[t]}.
   *
   * @throws IllegalArgumentException if the counts differ, a weight is not positive and finite,
   *     or the weights' float32 sum overflows
   */
  public static TreeEnsemble boosted(List<DecisionTree> trees, float[] weights) {
    Objects.requireNonNull(trees, "trees");
    Objects.requireNonNull(weights, "weights");
    return new TreeEnsemble(Kind.BOOSTED, trees, weights.clone());
  }

  public Kind kind() {
    return kind;
  }

  @Override
  public Schema schema() {
    return schema;
  }

  /** Returns the trees in combination order. */
  public List<DecisionTree> trees() {
    return trees;
  }

  public int treeCount() {
    return trees.size();
  }

  /** Returns the vote weight of tree {@code t}: {@code 1.0f} in a forest. */
  public float weight(int t) {
    return weights[t];
  }

  /** Returns the float32 sum of all weights in tree order: the divisor of the probabilities. */
  public float totalWeight() {
    return totalWeight;
  }

  /** Returns each tree's predicted class for {@code x}, in tree order. */
  public int[] votes(float[] x) {
    int[] votes = new int[trees.size()];
    for (int t = 0; t < votes.length; t++) {
      votes[t] = trees.get(t).predict(x);
    }
    return votes;
  }

  /**
   * Returns each class's float32 score for {@code x}, summed in tree order as the class comment
   * says: vote counts in a forest, weighted votes in a boosted ensemble.
   */
  public float[] scores(float[] x) {
    float[] score = new float[schema.classCount()];
    for (int t = 0; t < weights.length; t++) {
      int c = trees.get(t).predict(x);
      score[c] = score[c] + weights[t];
    }
    return score;
  }

  /** Returns the class with the largest score, the lowest class index on ties. */
  @Override
  public int predict(float[] x) {
    float[] score = scores(x);
    int best = 0;
    for (int c = 1; c < score.length; c++) {
      if (score[c] > score[best]) {
        best = c;
      }
    }
    return best;
  }

  /** The same as {@link #probabilities}: the shares are float32 already. */
  @Override
  public float[] floatProbabilities(float[] x) {
    return probabilities(x);
  }

  /** Returns {@code score[c] / totalWeight()} per class, each one float32 division. */
  public float[] probabilities(float[] x) {
    float[] p = scores(x);
    for (int c = 0; c < p.length; c++) {
      p[c] = p[c] / totalWeight;
    }
    return p;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof TreeEnsemble other
        && kind == other.kind
        && trees.equals(other.trees)
        && Arrays.equals(weights, other.weights);
  }

  @Override
  public int hashCode() {
    return Objects.hash(kind, trees, Arrays.hashCode(weights));
  }

  @Override
  public String toString() {
    return kind.fileName() + " of " + trees.size() + (trees.size() == 1 ? " tree" : " trees");
  }
}
