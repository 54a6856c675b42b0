package dev.splitwright.select;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The ensembles of one kind, member depth and leaf size, by tree count ascending: each is a prefix
 * of the next ({@link EnsembleGrower}). Trained only as far as the search asks, so that the trees
 * of ensembles already known to be over the budget are never grown.
 */
final class EnsembleChain implements CandidateChain {
  private final Dataset rows;
  private final SearchSettings settings;
  private final ModelKind kind;
  private final int maxDepth;
  private final int minLeaf;
  private final CandidatePool pool;
  private final List<Integer> sizes;
  private TreeEnsemble trained;
  private boolean stoppedEarly;

  EnsembleChain(Dataset rows, SearchSettings settings, ModelKind kind, int maxDepth, int minLeaf,
      CandidatePool pool) {
    this.rows = Objects.requireNonNull(rows, "rows");
    this.settings = Objects.requireNonNull(settings, "settings");
    this.kind = Objects.requireNonNull(kind, "kind");
    this.maxDepth = maxDepth;
    this.minLeaf = minLeaf;
    this.pool = Objects.requireNonNull(pool, "pool");
    this.sizes = settings.ensembleSizes();
  }

  @Override
  public ModelKind kind() {
    return kind;
  }

  @Override
  public int length() {
    if (!stoppedEarly) {
      return sizes.size();
    }
    int n = 0;
    while (n < sizes.size() && sizes.get(n) <= trained.treeCount()) {
      n++;
    }
    return n;
  }

  @Override
  public void prepare(int upTo) {
    int last = Math.min(upTo, sizes.size() - 1);
    if (stoppedEarly || (trained != null && trained.treeCount() >= sizes.get(last))) {
      return;
    }
    // Boosting may stop before the count asked for; training more would stop at the same tree.
    trained = EnsembleGrower.train(rows, settings, kind, sizes.get(last), maxDepth, minLeaf);
    stoppedEarly = trained.treeCount() < sizes.get(last);
  }

  @Override
  public Optional<DistinctTree> member(int i) {
    prepare(i);
    if (i >= length()) {
      return Optional.empty();
    }
    TreeEnsemble e = EnsembleGrower.prefix(trained, sizes.get(i));
    return Optional.of(pool.intern(
        CandidateRecipe.ensemble(kind, e.treeCount(), maxDepth, minLeaf), e));
  }

  @Override
  public double nodes(int i) {
    if (trained == null) {
      return Double.NaN;
    }
    int count = Math.min(sizes.get(i), trained.treeCount());
    double nodes = 0;
    for (DecisionTree tree : trained.trees().subList(0, count)) {
      nodes += 2.0 * tree.leafCount() - 1;
    }
    // Later trees are guessed to be as large as the trained ones on average.
    return nodes * sizes.get(i) / count;
  }
}
