package dev.splitwright.job;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.LoadOptions;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.function.UnaryOperator;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The proof can fail: an ensemble emitted with one number one ulp off (IEEE 754 binary32: {@link
 * Math#nextUp}) in a tree other than the first is caught by the verification, and nothing is
 * written. Data: UCI "Pima Indians Diabetes" (mlbench PimaIndiansDiabetes2), see the data sets
 * README.
 */
class EnsembleVerificationTest {
  private static final Verifier VERIFIER = Verifier.create();
  private static final Path PIMA =
      Path.of("src/test/resources/datasets/pima-indians-diabetes-2.csv");

  @TempDir Path temp;

  private CompileRequest request(TreeEnsemble.Kind kind, Layout layout) {
    return new CompileRequest(PIMA, Optional.empty(), Optional.empty(),
        LoadOptions.builder().target("diabetes").build(), new double[] {0.6, 0.2, 0.2}, 1,
        TrainingOptions.builder().maxDepth(3).build(),
        EmitOptions.builder("check", "Vote").layout(layout).probabilities(true).build(), temp,
        Optional.empty(), "test", OptionalInt.empty(),
        Optional.of(new EnsembleRequest(kind, 6, 0)));
  }

  private void assertCaught(CompileRequest request, UnaryOperator<TreeEnsemble> alter)
      throws Exception {
    CompileResult right = new CompileJob(VERIFIER).run(request);
    assertThat(right.verification().passed()).as(right.verification().verdict()).isTrue();
    assertThat(right.verification().branchCoverage()).isEqualTo(1.0);
    Path out = temp.resolve("wrong");
    CompileRequest elsewhere = new CompileRequest(request.data(), request.testData(),
        request.model(), request.load(), request.fractions(), request.seed(),
        request.training(), request.emit(), out, request.saveModel(), request.optionsText(),
        request.dexMinApi(), request.ensemble());

    CompileResult wrong = CompileJob.alteringEnsembles(VERIFIER, Optional.empty(), alter)
        .run(elsewhere);

    VerificationResult v = wrong.verification();
    assertThat(v.mismatches()).isPositive();
    assertThat(v.passed()).isFalse();
    assertThat(wrong.written()).isEmpty();
    try (Stream<Path> files = Files.exists(out) ? Files.walk(out) : Stream.empty()) {
      assertThat(files.filter(Files::isRegularFile)).isEmpty();
    }
  }

  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE", "FLAT"})
  void aThresholdOneUlpOffInTree1IsCaught(Layout layout) throws Exception {
    assertCaught(request(TreeEnsemble.Kind.FOREST, layout), ensemble -> {
      List<DecisionTree> trees = new ArrayList<>(ensemble.trees());
      DecisionTree tree = trees.get(1);
      NumericSplit root = (NumericSplit) tree.root();
      trees.set(1, new DecisionTree(tree.schema(), new NumericSplit(root.feature(),
          Math.nextUp(root.threshold()), root.missingLeft(), root.left(), root.right(),
          root.counts())));
      return TreeEnsemble.forest(trees);
    });
  }

  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE", "FLAT"})
  void aWeightOneUlpOffInTree2IsCaught(Layout layout) throws Exception {
    assertCaught(request(TreeEnsemble.Kind.BOOSTED, layout), ensemble -> {
      float[] weights = new float[ensemble.treeCount()];
      for (int t = 0; t < weights.length; t++) {
        weights[t] = ensemble.weight(t);
      }
      weights[2] = Math.nextUp(weights[2]);
      return TreeEnsemble.boosted(ensemble.trees(), weights);
    });
  }
}
