package dev.splitwright.backend;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.VerificationResult;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The C checker catches a threshold one ulp off, and passes the file emitted from the model. */
class CCheckerTest {

  @Test
  void aThresholdMovedByOneUlpFailsTheCheck() throws Exception {
    // UCI Breast Cancer Wisconsin (Diagnostic): numeric features only.
    Dataset data = CsvLoader.load(
        Path.of("src/test/resources/datasets/breast-cancer-wisconsin-diagnostic.csv"),
        LoadOptions.builder().target("diagnosis").build()).dataset();
    DecisionTree tree = CartTrainer.train(data, TrainingOptions.builder().maxDepth(4).build());
    CLanguage c = (CLanguage) Languages.c(EmitOptions.builder("", "Ulp").build(),
        CPipelineTest.HOST);

    VerificationResult exact = c.verify(tree, c.emit(tree, HeaderInfo.none()), List.of(data), 1);
    DecisionTree moved = new DecisionTree(tree.schema(), nudgeFirst(tree.root(), new boolean[1]));
    CLanguage.CEmission wrong = c.emit(moved, HeaderInfo.none());
    VerificationResult off = c.verify(tree, wrong, List.of(data), 1);

    assertThat(exact.mismatches()).as(exact.verdict()).isZero();
    // The boundary probes include the threshold and its float neighbours (IEEE 754 nextUp and
    // nextDown), so one ulp is enough to disagree on at least one of them.
    assertThat(wrong.source().sourceText())
        .isNotEqualTo(c.emit(tree, HeaderInfo.none()).source().sourceText());
    assertThat(off.passed()).isFalse();
    assertThat(off.mismatches()).isPositive();
    assertThat(off.firstMismatches()).isNotEmpty().hasSizeLessThanOrEqualTo(5);
  }

  /** The first numeric split in pre-order with its threshold one ulp up. */
  private static Node nudgeFirst(Node node, boolean[] done) {
    if (node instanceof Leaf) {
      return node;
    }
    if (node instanceof NumericSplit s) {
      float threshold = s.threshold();
      if (!done[0]) {
        done[0] = true;
        threshold = Math.nextUp(threshold);
      }
      return new NumericSplit(s.feature(), threshold, s.missingLeft(), nudgeFirst(s.left(), done),
          nudgeFirst(s.right(), done), s.counts());
    }
    CategoricalSplit s = (CategoricalSplit) node;
    return new CategoricalSplit(s.feature(), s.leftCodes(), s.missingLeft(),
        nudgeFirst(s.left(), done), nudgeFirst(s.right(), done), s.counts());
  }
}
