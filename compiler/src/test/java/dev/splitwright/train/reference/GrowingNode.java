package dev.splitwright.train.reference;

/** A node while the tree grows: its rows' segment in {@link SortedColumns} and raw class counts. */
final class GrowingNode {
  final int id;
  final int depth;
  final int lo;
  final int hi;
  final int[] counts;
  /** Best split, or {@code null} when the node must stay a leaf. */
  SplitChoice choice;
  GrowingNode left;
  GrowingNode right;

  GrowingNode(int id, int depth, int lo, int hi, int[] counts) {
    this.id = id;
    this.depth = depth;
    this.lo = lo;
    this.hi = hi;
    this.counts = counts;
  }

  int rows() {
    return hi - lo;
  }

  boolean pure() {
    int nonZero = 0;
    for (int c : counts) {
      nonZero += c > 0 ? 1 : 0;
    }
    return nonZero <= 1;
  }

  boolean expanded() {
    return left != null;
  }
}
