package dev.splitwright.emit;

import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.Split;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Locale;
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
  /**
   * Most nested {@code if}s in one method: deeper subtrees get methods of their own, so that the
   * indentation leaves room for the code on each line (at most 100 columns).
   */
  static final int MAX_NESTING = 9;
  /** Bytes the entry method spends checking the input length before the tree. */
  static final int ENTRY_CHECK_BYTES = 32;

  private final Map<Node, String> methodNames = new IdentityHashMap<>();
  private final List<Node> methodRoots = new ArrayList<>();
  private final Map<Node, Boolean> outlined = new IdentityHashMap<>();
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
    return of(root, cap, entryBytes, callBytes, "node");
  }

  /**
   * Like {@link #of(Node, int, int, int)}, naming the outlined methods {@code <prefix><pre-order
   * index>}, so the trees of an ensemble get methods of distinct names.
   */
  static MethodPlan of(Node root, int cap, int entryBytes, int callBytes, String prefix) {
    MethodPlan plan = new MethodPlan(callBytes, cap);
    int[] preorder = {0};
    Map<Node, Integer> index = new IdentityHashMap<>();
    number(root, index, preorder);
    plan.fit(root, cap - entryBytes);
    plan.methodRoots.sort((a, b) -> Integer.compare(index.get(a), index.get(b)));
    for (Node node : plan.methodRoots) {
      plan.methodNames.put(node, prefix + index.get(node));
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

  /** A subtree's inline bytecode bytes and its nesting of {@code if}s once children are fitted. */
  private record Fit(int bytes, int nesting) {}

  /**
   * Returns the inline cost of {@code node} after outlining children so it fits {@code room} and
   * {@link #MAX_NESTING}. Children are fitted to the cap first, so an outlined child fits a method
   * of its own.
   */
  private Fit fit(Node node, int room) {
    if (node instanceof Leaf) {
      return new Fit(LEAF_BYTES, 0);
    }
    Split split = (Split) node;
    int own = split instanceof CategoricalSplit ? CATEGORICAL_SPLIT_BYTES : NUMERIC_SPLIT_BYTES;
    Fit leftFit = fit(split.left(), cap);
    Fit rightFit = fit(split.right(), cap);
    int left = leftFit.bytes();
    int right = rightFit.bytes();
    int leftNesting = leftFit.nesting();
    int rightNesting = rightFit.nesting();
    // Too deep for the lines: outline the deeper child (a split, as a leaf nests nothing).
    while (1 + Math.max(leftNesting, rightNesting) > MAX_NESTING) {
      if (leftNesting >= rightNesting) {
        left = outline(split.left());
        leftNesting = 0;
      } else {
        right = outline(split.right());
        rightNesting = 0;
      }
    }
    // Outline the larger child first: it frees the most room. Only a child that costs more than
    // the call replacing it is outlined, so none is outlined twice (an outlined one costs exactly
    // a call) and a leaf never is.
    while (own + left + right > room) {
      if (Math.max(left, right) <= callBytes) {
        throw new EmitLimitException("max-method-bytes", String.format(Locale.ROOT,
            "a split and its two children need up to %d bytes of bytecode even with the "
                + "children in methods of their own, but a method may have only %d",
            own + left + right, room),
            "give a larger --max-method-bytes, or pass the features as an array");
      }
      if (left >= right) {
        left = outline(split.left());
        leftNesting = 0;
      } else {
        right = outline(split.right());
        rightNesting = 0;
      }
    }
    return new Fit(own + left + right, 1 + Math.max(leftNesting, rightNesting));
  }

  private int outline(Node child) {
    // A subtree object that occurs twice (trees built by hand may share one) gets one method.
    if (outlined.put(child, Boolean.TRUE) == null) {
      methodRoots.add(child);
    }
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
