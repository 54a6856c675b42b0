package dev.splitwright.select;

import dev.splitwright.eval.Metric;
import dev.splitwright.train.TrainingOptions;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.TreeSet;

/**
 * What the budget search looks for and where: the budget and what it counts, the score to
 * maximise, the grid of depth limits (1 to {@code maxDepth}) and leaf sizes, single validation
 * split or k-fold cross-validation, and which rows the chosen settings are refitted on. Build with
 * {@link #builder(int)}.
 *
 * @param budget the most bytes the emitted classifier may weigh, counted in {@code unit}
 * @param minLeafs the leaf sizes swept, ascending and distinct
 * @param folds 0 to score on the validation part, otherwise the k of stratified k-fold
 *     cross-validation on train and validation together
 * @param refitAll refit the chosen settings on train and validation together, not train alone
 * @param training impurity, leaf cap and class weights of every candidate; its depth and leaf size
 *     are replaced by the grid's
 * @param seed seed of the cross-validation folds and of the ensembles' bootstrap samples
 * @param kinds the kinds of classifier searched, in {@link ModelKind} order
 * @param ensembleSizes the tree counts of ensemble candidates, ascending
 * @param measureAll measure every candidate, also those holding one already over the budget
 *     (for a whole frontier; see {@link ChainMeasurer})
 */
public record SearchSettings(int budget, BudgetUnit unit, Metric metric, int maxDepth,
    List<Integer> minLeafs, int folds, boolean refitAll, TrainingOptions training, long seed,
    List<ModelKind> kinds, List<Integer> ensembleSizes, boolean measureAll) {

  /**
   * Tree counts of ensemble candidates by default: doubling from 2 to 64, where published
   * results show forests and boosting gaining most of what they gain (common practice).
   */
  public static final List<Integer> DEFAULT_ENSEMBLE_SIZES = List.of(2, 4, 8, 16, 32, 64);

  /**
   * Depth limits of ensemble members: shallow trees are what ensembles are for, and each depth
   * adds a training run per kind, so past 4 only every other depth is tried.
   */
  static final List<Integer> ENSEMBLE_DEPTHS = List.of(1, 2, 3, 4, 6, 8, 10, 12, 14, 16);

  /**
   * Leaf sizes swept by default: from no limit (1) to leaves of 20 rows, roughly doubling; larger
   * minimum leaves mostly repeat what the pruning path already offers (common practice, not a
   * published rule).
   */
  public static final List<Integer> DEFAULT_MIN_LEAFS = List.of(1, 2, 5, 10, 20);

  /** Depth limits above this make trees no budget of interest holds (2^16 leaves). */
  public static final int MAX_DEPTH = 16;

  public SearchSettings {
    if (budget <= 0) {
      throw new IllegalArgumentException("budget must be positive, but it is " + budget);
    }
    Objects.requireNonNull(unit, "unit");
    Objects.requireNonNull(metric, "metric");
    if (maxDepth < 1 || maxDepth > MAX_DEPTH) {
      throw new IllegalArgumentException(
          "maxDepth must be between 1 and " + MAX_DEPTH + ", but it is " + maxDepth);
    }
    TreeSet<Integer> sorted = new TreeSet<>(minLeafs);
    if (sorted.isEmpty() || sorted.first() < 1) {
      throw new IllegalArgumentException("minLeafs must be positive and not empty: " + minLeafs);
    }
    minLeafs = List.copyOf(sorted);
    if (folds == 1 || folds < 0) {
      throw new IllegalArgumentException("folds must be 0 or at least 2, but it is " + folds);
    }
    Objects.requireNonNull(training, "training");
    TreeSet<ModelKind> kindSet = new TreeSet<>(kinds);
    if (kindSet.isEmpty()) {
      throw new IllegalArgumentException("at least one kind must be searched");
    }
    kinds = List.copyOf(kindSet);
    TreeSet<Integer> sizes = new TreeSet<>(ensembleSizes);
    if (sizes.isEmpty() || sizes.first() < 2) {
      throw new IllegalArgumentException("ensemble sizes must be at least 2: " + ensembleSizes);
    }
    ensembleSizes = List.copyOf(sizes);
  }

  /** The depth limits of ensemble members: {@link #ENSEMBLE_DEPTHS} up to {@code maxDepth}. */
  public List<Integer> ensembleDepths() {
    List<Integer> depths = new ArrayList<>();
    for (int d : ENSEMBLE_DEPTHS) {
      if (d <= maxDepth) {
        depths.add(d);
      }
    }
    if (!depths.contains(maxDepth)) {
      depths.add(maxDepth);
    }
    return List.copyOf(depths);
  }

  /** Starts settings for {@code budget} class-file bytes with the defaults. */
  public static Builder builder(int budget) {
    return new Builder(budget);
  }

  /** The default leaf sizes from {@code least} up, with {@code least} itself first. */
  public static List<Integer> minLeafsFrom(int least) {
    TreeSet<Integer> sizes = new TreeSet<>();
    sizes.add(least);
    DEFAULT_MIN_LEAFS.stream().filter(n -> n >= least).forEach(sizes::add);
    return List.copyOf(sizes);
  }

  /** Collects settings; {@link #build} validates them. */
  public static final class Builder {
    private final int budget;
    private BudgetUnit unit = BudgetUnit.CLASS;
    private Metric metric = Metric.BALANCED_ACCURACY;
    private int maxDepth = 8;
    private List<Integer> minLeafs = DEFAULT_MIN_LEAFS;
    private int folds;
    private boolean refitAll;
    private TrainingOptions training = TrainingOptions.defaults();
    private long seed = 1;
    private List<ModelKind> kinds = List.of(ModelKind.TREE);
    private List<Integer> ensembleSizes = DEFAULT_ENSEMBLE_SIZES;
    private boolean measureAll;

    private Builder(int budget) {
      this.budget = budget;
    }

    public Builder unit(BudgetUnit value) {
      this.unit = value;
      return this;
    }

    public Builder metric(Metric value) {
      this.metric = value;
      return this;
    }

    public Builder maxDepth(int value) {
      this.maxDepth = value;
      return this;
    }

    public Builder minLeafs(List<Integer> value) {
      this.minLeafs = List.copyOf(value);
      return this;
    }

    public Builder folds(int value) {
      this.folds = value;
      return this;
    }

    public Builder refitAll(boolean value) {
      this.refitAll = value;
      return this;
    }

    public Builder training(TrainingOptions value) {
      this.training = value;
      return this;
    }

    public Builder seed(long value) {
      this.seed = value;
      return this;
    }

    /** The kinds searched; single trees unless set. */
    public Builder kinds(List<ModelKind> value) {
      this.kinds = List.copyOf(value);
      return this;
    }

    public Builder ensembleSizes(List<Integer> value) {
      this.ensembleSizes = List.copyOf(value);
      return this;
    }

    public Builder measureAll(boolean value) {
      this.measureAll = value;
      return this;
    }

    public SearchSettings build() {
      return new SearchSettings(budget, unit, metric, maxDepth, minLeafs, folds, refitAll,
          training, seed, kinds, ensembleSizes, measureAll);
    }
  }
}
