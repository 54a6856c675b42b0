package dev.splitwright.job;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.LoadOptions;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.Verifier;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A run whose code disagrees with its model writes nothing: the previous outputs, including a
 * saved model, stay byte-identical and no temporary file is left. The disagreement is injected
 * through the job's test seam, which emits code from a tree with one leaf changed.
 */
class AtomicOutputTest {
  private static final Path PUMP = DemoFiles.pump();
  private static final Verifier VERIFIER = Verifier.create();

  @TempDir Path out;

  private CompileRequest request(int maxDepth) {
    return new CompileRequest(PUMP, Optional.empty(), Optional.empty(),
        LoadOptions.builder().target("state").build(), new double[] {0.6, 0.2, 0.2}, 1,
        TrainingOptions.builder().maxDepth(maxDepth).build(),
        EmitOptions.builder("com.example.pump", "PumpState").build(), out,
        Optional.of(out.resolve("pump.model.json")), "test");
  }

  @Test
  void failedVerificationLeavesThePreviousOutputsByteIdentical() throws Exception {
    CompileResult good = new CompileJob(VERIFIER).run(request(3));
    assertThat(good.verification().passed()).isTrue();
    // Source, report, tree picture and model file.
    assertThat(good.written()).hasSize(4);
    Map<String, String> before = snapshot(out);

    // A deeper tree would change every output, so a write of any of them would show.
    CompileResult bad = new CompileJob(VERIFIER, AtomicOutputTest::changeFirstLeaf).run(request(4));

    assertThat(bad.verification().passed()).isFalse();
    assertThat(bad.verification().mismatches()).isPositive();
    assertThat(bad.verification().verdict()).contains("disagree with the model");
    assertThat(bad.written()).isEmpty();
    assertThat(snapshot(out)).containsExactlyEntriesOf(before);
  }

  @Test
  void theSeamIsTheOnlyDifference() throws Exception {
    // Without the perturbation, the same request passes: the failure above is the seam's doing.
    CompileResult result = new CompileJob(VERIFIER, tree -> tree).run(request(4));

    assertThat(result.verification().passed()).as(result.verification().verdict()).isTrue();
  }

  /** The same tree with the first leaf in pre-order predicting the next class. */
  static DecisionTree changeFirstLeaf(DecisionTree tree) {
    return new DecisionTree(tree.schema(), changeFirstLeaf(tree.root(), new boolean[1]));
  }

  private static Node changeFirstLeaf(Node node, boolean[] done) {
    if (node instanceof Leaf leaf) {
      if (done[0]) {
        return leaf;
      }
      done[0] = true;
      return new Leaf((leaf.prediction() + 1) % leaf.counts().classCount(), leaf.counts());
    }
    if (node instanceof NumericSplit s) {
      Node left = changeFirstLeaf(s.left(), done);
      return new NumericSplit(s.feature(), s.threshold(), s.missingLeft(), left,
          changeFirstLeaf(s.right(), done), s.counts());
    }
    CategoricalSplit s = (CategoricalSplit) node;
    Node left = changeFirstLeaf(s.left(), done);
    return new CategoricalSplit(s.feature(), s.leftCodes(), s.missingLeft(), left,
        changeFirstLeaf(s.right(), done), s.counts());
  }

  /** Every file below {@code root} with its bytes as text; temporary files would show up too. */
  static Map<String, String> snapshot(Path root) throws IOException {
    Map<String, String> files = new TreeMap<>();
    try (Stream<Path> all = Files.walk(root)) {
      for (Path p : (Iterable<Path>) all::iterator) {
        if (Files.isRegularFile(p)) {
          files.put(root.relativize(p).toString(), Files.readString(p));
        }
      }
    }
    return files;
  }
}
