package dev.splitwright.select;

import dev.splitwright.model.DecisionTree;
import java.util.List;
import java.util.Optional;

/** One cost-complexity pruning path, smallest subtree first; its trees are built already. */
record TreeChain(List<DistinctTree> members) implements CandidateChain {

  TreeChain {
    members = List.copyOf(members);
  }

  @Override
  public ModelKind kind() {
    return ModelKind.TREE;
  }

  @Override
  public int length() {
    return members.size();
  }

  @Override
  public void prepare(int upTo) {
    // Built already.
  }

  @Override
  public Optional<DistinctTree> member(int i) {
    return i < members.size() ? Optional.of(members.get(i)) : Optional.empty();
  }

  @Override
  public double nodes(int i) {
    DecisionTree tree = (DecisionTree) members.get(i).model();
    return 2.0 * tree.leafCount() - 1;
  }
}
