package dev.splitwright.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assumptions.assumeThat;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.data.Dataset;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CInstructionCountTest {
  private static final String CC = "gcc";

  @TempDir Path work;

  @Test
  void countsArePositiveRepeatableAndGrowWithDepth() {
    assumeThat(CInstructionCount.missingTool(CC)).as("valgrind and gcc are needed").isEmpty();
    Dataset training = SyntheticTable.generate(4_000, 8, 11);
    float[][] rows = InputOrder.SHUFFLED.arrange(freshRows(), 2_000, 3).rows();
    DecisionTree stump = CartTrainer.train(training,
        TrainingOptions.builder().maxDepth(1).build());
    DecisionTree deep = CartTrainer.train(training,
        TrainingOptions.builder().maxDepth(8).build());
    assertThat(deep.depth()).isEqualTo(8);
    CInstructionCount counter = new CInstructionCount(work, CC);
    for (Layout layout : CInstructions.layouts(deep)) {
      CEmitOptions options = new CEmitOptions("t", layout, InputKind.FLOAT, false, true);
      CInstructionCount.Count first = counter.count("deep", deep, options, "-O2", rows);
      CInstructionCount.Count again = counter.count("deep", deep, options, "-O2", rows);
      CInstructionCount.Count shallow = counter.count("stump", stump, options, "-O2", rows);
      assertThat(first.rows()).isEqualTo(2_000);
      assertThat(shallow.instructions()).as(layout + ": a stump runs some instructions")
          .isPositive();
      // Callgrind simulates the program, so its count is exact (valgrind manual, chapter 6).
      assertThat(again).as(layout + ": same binary, same input").isEqualTo(first);
      // A walk of up to 8 comparisons costs more than one of a single comparison (worked by
      // hand: every comparison is at least one instruction).
      assertThat(first.instructions()).as(layout.optionName())
          .isGreaterThan(shallow.instructions());
    }
  }

  @Test
  void findsBothCLayouts() {
    Dataset training = SyntheticTable.generate(500, 8, 11);
    DecisionTree tree = CartTrainer.train(training,
        TrainingOptions.builder().maxDepth(3).build());
    assertThat(CInstructions.layouts(tree)).contains(Layout.BRANCHES, Layout.TABLE)
        .doesNotContain(Layout.SMALLEST);
  }

  @Test
  void readsTheEventTotalOfACallgrindFile() {
    // Lines as the callgrind format specification shows them (valgrind manual, "Callgrind Format
    // Specification"): the first event of summary: is Ir.
    List<String> file = List.of("version: 1", "creator: callgrind-3.19.0", "events: Ir",
        "fn=(1) t_classify", "3 5", "summary: 123456", "totals: 123456");
    assertThat(CInstructionCount.totalInstructions(file)).isEqualTo(123_456L);
  }

  private static LabelledRows freshRows() {
    Dataset d = SyntheticTable.generate(2_000, 8, 12);
    float[][] rows = new float[d.rows()][];
    for (int r = 0; r < rows.length; r++) {
      rows[r] = d.row(r);
    }
    return new LabelledRows(rows, d.labels());
  }
}
