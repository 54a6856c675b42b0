package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.check.CompilationException;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** Which subtrees become methods of their own, so that every method fits the bytecode cap. */
class MethodPlanTest {
  private static final Verifier VERIFIER = Verifier.create().withRandomProbes(200);
  private static final ClassCounts COUNTS = ClassCounts.of(1, 1);

  /** 32 numeric features, the most {@code --named-args} takes. */
  private static Schema schema(int features) {
    List<Feature> list = new ArrayList<>();
    for (int f = 0; f < features; f++) {
      list.add(Feature.numeric("f" + f));
    }
    return new Schema(list, "y", List.of("a", "b"));
  }

  /** A full tree of {@code depth} levels of splits, thresholds 0.5, 1.5 ... in pre-order. */
  private static Node full(int depth, int[] next) {
    if (depth == 0) {
      return new Leaf(next[0] % 2, COUNTS);
    }
    int at = next[0]++;
    Node left = full(depth - 1, next);
    Node right = full(depth - 1, next);
    return new NumericSplit(at % 32, at + 0.5f, false, left, right, COUNTS);
  }

  /**
   * The case of issue 11: a root whose left subtree has 7 splits and right subtree 15, with 32
   * named double arguments and a 256-byte cap. The right child was outlined twice ({@code node16}
   * emitted twice, javac: "already defined").
   */
  @Test
  void outlinesTheRightChildOnceWhenTheLeftChildIsSmall() throws CompilationException {
    int[] next = {1};
    Node left = full(3, next);
    Node right = full(4, next);
    DecisionTree tree = new DecisionTree(schema(32),
        new NumericSplit(0, 0.25f, false, left, right, COUNTS));
    EmitOptions options = EmitOptions.builder("plan", "Lopsided").namedArgs(true)
        .inputKind(InputKind.DOUBLE).maxMethodBytes(256).build();

    EmittedSource source = JavaEmitter.emit(tree, options, HeaderInfo.none());
    VerificationResult result = VERIFIER.verify(tree, source, options, List.of(), 1);

    assertThat(result.passed()).as(result.verdict()).isTrue();
    assertThat(result.maxMethodBytes()).isLessThanOrEqualTo(256);
  }

  /**
   * Every outlined subtree is planned once, only splits are outlined, and every method's cost
   * under the plan's own bounds fits its room.
   */
  @Test
  void plansEveryMethodOnceAndWithinTheCap() {
    SplittableRandom random = new SplittableRandom(2024);
    for (int i = 0; i < 3000; i++) {
      DecisionTree tree = RandomTrees.tree(random, schema(1 + random.nextInt(32)),
          random.nextInt(14), 1 + random.nextInt(600));
      int cap = 256 + random.nextInt(257);
      // Up to the largest call cost for which two calls and a categorical split fit the room.
      int callBytes = 4 + random.nextInt((cap - MethodPlan.ENTRY_CHECK_BYTES - 20) / 2 - 3);
      MethodPlan plan = MethodPlan.of(tree.root(), cap, MethodPlan.ENTRY_CHECK_BYTES, callBytes);

      List<Node> roots = plan.methodRoots();
      Map<Node, Boolean> seen = new IdentityHashMap<>();
      for (Node node : roots) {
        assertThat(seen.put(node, true)).as("outlined twice, tree %d", i).isNull();
        assertThat(node).isInstanceOf(Split.class);
        assertThat(bound(node, plan, callBytes, true)).isLessThanOrEqualTo(cap);
      }
      assertThat(bound(tree.root(), plan, callBytes, true))
          .isLessThanOrEqualTo(cap - MethodPlan.ENTRY_CHECK_BYTES);
    }
  }

  /** A split whose two calls alone overflow the room is refused, naming the option. */
  @Test
  void refusesACapThatCannotHoldASplitAndTwoCalls() {
    int[] next = {0};
    Node root = full(5, next);

    assertThatThrownBy(() -> MethodPlan.of(root, 256, MethodPlan.ENTRY_CHECK_BYTES, 110))
        .isInstanceOfSatisfying(EmitLimitException.class,
            e -> assertThat(e.option()).isEqualTo("max-method-bytes"));
    // Worked by hand: each child of the root costs 244 bytes inline; 12 + 2 * 106 = 224 = 256 - 32
    // fits exactly, 12 + 2 * 110 does not.
    assertThat(MethodPlan.of(root, 256, MethodPlan.ENTRY_CHECK_BYTES, 106).methodRoots())
        .hasSize(2);
  }

  /** The bytes the plan's own cost model gives the method starting at {@code node}. */
  private static int bound(Node node, MethodPlan plan, int callBytes, boolean methodRoot) {
    if (!methodRoot && plan.isOutlined(node)) {
      return callBytes;
    }
    if (node instanceof Split split) {
      return 12 + bound(split.left(), plan, callBytes, false)
          + bound(split.right(), plan, callBytes, false);
    }
    return 4;
  }
}
