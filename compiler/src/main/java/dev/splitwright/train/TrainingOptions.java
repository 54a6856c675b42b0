package dev.splitwright.train;

import java.util.Locale;
import java.util.Objects;

/**
 * Settings for {@link CartTrainer}: impurity measure, size limits and class weights. Immutable;
 * build with {@link #builder()} or change a copy with {@link #toBuilder()}.
 */
public final class TrainingOptions {
  /** The value of {@link #maxLeaves()} that means "no limit". */
  public static final int UNLIMITED_LEAVES = Integer.MAX_VALUE;

  private static final TrainingOptions DEFAULTS = new Builder().build();

  private final Impurity impurity;
  private final int maxDepth;
  private final int maxLeaves;
  private final int minLeaf;
  private final ClassWeights weights;

  private TrainingOptions(Builder b) {
    this.impurity = b.impurity;
    this.maxDepth = b.maxDepth;
    this.maxLeaves = b.maxLeaves;
    this.minLeaf = b.minLeaf;
    this.weights = b.weights;
  }

  /** Returns Gini impurity, depth 8, unlimited leaves, one row per leaf, no class weights. */
  public static TrainingOptions defaults() {
    return DEFAULTS;
  }

  /** Starts from the defaults. */
  public static Builder builder() {
    return new Builder();
  }

  /** Starts from these options. */
  public Builder toBuilder() {
    return new Builder()
        .impurity(impurity)
        .maxDepth(maxDepth)
        .maxLeaves(maxLeaves)
        .minLeaf(minLeaf)
        .weights(weights);
  }

  public Impurity impurity() {
    return impurity;
  }

  /** Most splits on any root-to-leaf path. */
  public int maxDepth() {
    return maxDepth;
  }

  /** Most leaves in the tree, or {@link #UNLIMITED_LEAVES}. */
  public int maxLeaves() {
    return maxLeaves;
  }

  /** Fewest training rows (not weights) in any leaf. */
  public int minLeaf() {
    return minLeaf;
  }

  public ClassWeights weights() {
    return weights;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof TrainingOptions other
        && impurity == other.impurity
        && maxDepth == other.maxDepth
        && maxLeaves == other.maxLeaves
        && minLeaf == other.minLeaf
        && weights.equals(other.weights);
  }

  @Override
  public int hashCode() {
    return Objects.hash(impurity, maxDepth, maxLeaves, minLeaf, weights);
  }

  @Override
  public String toString() {
    return String.format(
        Locale.ROOT,
        "impurity=%s, maxDepth=%d, maxLeaves=%s, minLeaf=%d, weights=%s",
        impurity.name().toLowerCase(Locale.ROOT),
        maxDepth,
        maxLeaves == UNLIMITED_LEAVES ? "unlimited" : Integer.toString(maxLeaves),
        minLeaf,
        weights);
  }

  /** Collects options; every setter rejects a bad value at once. */
  public static final class Builder {
    private Impurity impurity = Impurity.GINI;
    private int maxDepth = 8;
    private int maxLeaves = UNLIMITED_LEAVES;
    private int minLeaf = 1;
    private ClassWeights weights = ClassWeights.none();

    private Builder() {}

    public Builder impurity(Impurity impurity) {
      this.impurity = Objects.requireNonNull(impurity, "impurity");
      return this;
    }

    /**
     * Sets the depth limit.
     *
     * @throws IllegalArgumentException if {@code maxDepth < 1}
     */
    public Builder maxDepth(int maxDepth) {
      atLeast("maxDepth", maxDepth, 1);
      this.maxDepth = maxDepth;
      return this;
    }

    /**
     * Sets the leaf-count limit; {@link #UNLIMITED_LEAVES} lifts it.
     *
     * @throws IllegalArgumentException if {@code maxLeaves < 2}
     */
    public Builder maxLeaves(int maxLeaves) {
      atLeast("maxLeaves", maxLeaves, 2);
      this.maxLeaves = maxLeaves;
      return this;
    }

    /**
     * Sets the fewest training rows a leaf may hold.
     *
     * @throws IllegalArgumentException if {@code minLeaf < 1}
     */
    public Builder minLeaf(int minLeaf) {
      atLeast("minLeaf", minLeaf, 1);
      this.minLeaf = minLeaf;
      return this;
    }

    public Builder weights(ClassWeights weights) {
      this.weights = Objects.requireNonNull(weights, "weights");
      return this;
    }

    public TrainingOptions build() {
      return new TrainingOptions(this);
    }

    private static void atLeast(String option, int value, int min) {
      if (value < min) {
        throw new IllegalArgumentException(
            option + " must be at least " + min + ", but it is " + value);
      }
    }
  }
}
