package dev.splitwright.select;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import java.util.List;

/** Hand-built trees and candidates for the selection tests. */
final class Trees {
  static final Schema SCHEMA = new Schema(List.of(Feature.numeric("x")), "y", List.of("A", "B"));

  private Trees() {}

  /** A chain of {@code leaves - 1} splits on x, thresholds 1, 2, ...; leaves alternate A, B. */
  static DecisionTree chain(int leaves) {
    Node node = new Leaf(0, ClassCounts.of(1, 0));
    for (int i = leaves - 1; i >= 1; i--) {
      Leaf left = new Leaf(i % 2, ClassCounts.of(1 - i % 2, i % 2));
      int[] l = left.counts().toArray();
      int[] r = node.counts().toArray();
      node = new NumericSplit(0, i, false, left, node, ClassCounts.of(l[0] + r[0], l[1] + r[1]));
    }
    return new DecisionTree(SCHEMA, node);
  }

  /** A candidate of {@code size} bytes in every unit, with {@code leaves} leaves. */
  static Candidate candidate(int index, int size, double score, int leaves) {
    return new Candidate(index, new CandidateRecipe(1, 1, 0, Double.POSITIVE_INFINITY),
        chain(leaves),
        score, new Sizes(size, size, size, 0), Layout.BRANCHES);
  }
}
