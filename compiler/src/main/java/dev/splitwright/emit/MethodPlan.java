package dev.splitwright.emit;

import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;

/**
 * Decides which subtrees become methods of their own so that no method's bytecode exceeds the cap.
 * Costs are upper bounds of the bytes javac writes for each construct (JVM Specification §6.5
 * instruction lengths), so the plan errs on the side of smaller methods; the verifier measures the
 * real lengths afterwards.
 */
final class MethodPlan {
  /** {@code aload/fload, index push (<=3), xaload, ldc_w (3), xcmp, if (3)}. */
  private static final int NUMERIC_SPLIT_BYTES = 12;
  /**
   * Value load ({@code <=5}), k push (3), mask ldc2_w/getstatic (3), iconst, invokestatic (3),
   * ifeq (3).
   */
  private static final int CATEGORICAL_SPLIT_BYTES = 20;
  /** {@code ldc_w (3), ireturn}. */
  private static final int LEAF_BYTES = 4;
  /** Bytes the entry method spends checking the input length before the tree. */
  static final int ENTRY_CHECK_BYTES = 32;

  private final Map<Node, String> methodNames = new IdentityHashMap<>();
  private final List<Node> methodRoots = new ArrayList<>();
  private final int callBytes;
  private final int cap;

  private MethodPlan(int callBytes, int cap) {
    this.callBytes = callBytes;
    this.cap = cap;
  }

  /**
   * Plans the methods for a tree whose entry method spends {@code entryBytes} before the tree and
   * whose helper calls cost {@code callBytes} each.
   */
  static MethodPlan of(Node root, int cap, int entryBytes, int callBytes) {
    MethodPlan plan = new MethodPlan(callBytes, cap);
    int[] preorder = {0};
    Map<Node, Integer> index = new IdentityHashMap<>();
    number(root, index, preorder);
    plan.fit(root, cap - entryBytes, index);
    plan.methodRoots.sort((a, b) -> Integer.compare(index.get(a), index.get(b)));
    for (Node node : plan.methodRoots) {
      plan.methodNames.put(node, "node" + index.get(node));
    }
    return plan;
  }

  private static void number(Node node, Map<Node, Integer> index, int[] next) {
    index.put(node, next[0]++);
    if (node instanceof Split split) {
      number(split.left(), index, next);
      number(split.right(), index, next);
    }
  }

  /** Returns the inline cost of {@code node} after outlining children so it fits {@code room}. */
  private int fit(Node node, int room, Map<Node, Integer> index) {
    if (node instanceof Leaf) {
      return LEAF_BYTES;
    }
    Split split = (Split) node;
    int own = split instanceof CategoricalSplit ? CATEGORICAL_SPLIT_BYTES : NUMERIC_SPLIT_BYTES;
    int left = fit(split.left(), cap, index);
    int right = fit(split.right(), cap, index);
    // Outline the larger child first: it frees the most room for one extra call.
    if (own + left + right > room) {
      if (left >= right) {
        left = outline(split.left());
      } else {
        right = outline(split.right());
      }
    }
    if (own + left + right > room) {
      if (left > callBytes) {
        left = outline(split.left());
      } else {
        right = outline(split.right());
      }
    }
    return own + left + right;
  }

  private int outline(Node child) {
    methodRoots.add(child);
    return callBytes;
  }

  /** Tells whether {@code node} is emitted as a call to a method of its own. */
  boolean isOutlined(Node node) {
    return methodNames.containsKey(node);
  }

  String methodName(Node node) {
    return methodNames.get(node);
  }

  /** The outlined subtrees, in pre-order of the tree. */
  List<Node> methodRoots() {
    return List.copyOf(methodRoots);
  }

  int cap() {
    return cap;
  }
}
