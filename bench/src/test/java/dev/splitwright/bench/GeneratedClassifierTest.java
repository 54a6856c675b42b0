package dev.splitwright.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.data.Dataset;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.train.CartTrainer;
import java.lang.invoke.MethodHandle;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The benchmark is only meaningful if the loaded classes are the trained tree: checked on the pump
 * model's fresh readings, the same inputs the benchmark uses.
 */
class GeneratedClassifierTest {
  private static DecisionTree tree;
  private static LabelledRows inputs;

  @BeforeAll
  static void trainPumpModel() {
    Dataset training = BenchModel.PUMP.trainingSet();
    tree = CartTrainer.train(training, BenchModel.PUMP.trainingOptions());
    inputs = BenchModel.PUMP.inputs(training, InputOrder.SHUFFLED);
  }

  @Test
  void pumpModelHasTheBenchmarkedDepth() {
    assertThat(tree.depth()).isEqualTo(BenchModel.PUMP.depth());
    assertThat(inputs.size()).isEqualTo(BenchModel.INPUT_ROWS);
  }

  @Test
  void branchesClassReturnsWhatTheModelReturnsOnEveryInput() throws Throwable {
    MethodHandle classify = GeneratedClassifier.emitAndLoad(tree, Layout.BRANCHES);
    for (float[] x : inputs.rows()) {
      assertThat((int) classify.invokeExact(x)).isEqualTo(tree.predict(x));
    }
  }

  @Test
  void flatClassReturnsWhatTheModelReturnsOnEveryInput() throws Throwable {
    MethodHandle classify = GeneratedClassifier.emitAndLoad(tree, Layout.FLAT);
    for (float[] x : inputs.rows()) {
      assertThat((int) classify.invokeExact(x)).isEqualTo(tree.predict(x));
    }
  }

  @Test
  void flatClassifyAllReturnsWhatTheModelReturnsOnEveryInput() throws Throwable {
    MethodHandle classifyAll = GeneratedClassifier.emitAndLoadBatch(tree);
    float[][] rows = inputs.rows();
    int[] out = new int[rows.length];
    classifyAll.invokeExact(rows, out);
    for (int i = 0; i < rows.length; i++) {
      assertThat(out[i]).as("row %d", i).isEqualTo(tree.predict(rows[i]));
    }
  }

  @Test
  void forestClassesReturnWhatTheForestReturnsOnEveryInputInEveryLayout() throws Throwable {
    TreeEnsemble forest = EnsembleBenchmark.forest(BenchModel.PUMP.trainingSet());
    assertThat(forest.treeCount()).isEqualTo(EnsembleBenchmark.TREES);
    for (Layout layout : new Layout[] {Layout.BRANCHES, Layout.TABLE, Layout.FLAT}) {
      MethodHandle classify = GeneratedClassifier.emitAndLoad(forest, layout);
      for (float[] x : inputs.rows()) {
        assertThat((int) classify.invokeExact(x)).as(layout.optionName())
            .isEqualTo(forest.predict(x));
      }
    }
  }

  @Test
  void tableClassReturnsWhatTheModelReturnsOnEveryInput() throws Throwable {
    MethodHandle classify = GeneratedClassifier.emitAndLoad(tree, Layout.TABLE);
    for (float[] x : inputs.rows()) {
      assertThat((int) classify.invokeExact(x)).isEqualTo(tree.predict(x));
    }
  }

  @Test
  void smallestIsAChoiceBetweenLayoutsAndCannotBeLoaded() {
    assertThatThrownBy(() -> GeneratedClassifier.emitAndLoad(tree, Layout.SMALLEST))
        .isInstanceOf(IllegalArgumentException.class);
  }

  @Test
  void trivialClassifierReturnsTheSignBitOfTheFirstValue() throws Throwable {
    MethodHandle trivial = GeneratedClassifier.trivial();
    // IEEE 754: the sign bit is the top bit, set for -0.0 and clear for +0.0.
    assertThat((int) trivial.invokeExact(new float[] {-0.0f})).isEqualTo(1);
    assertThat((int) trivial.invokeExact(new float[] {0.0f})).isEqualTo(0);
    assertThat((int) trivial.invokeExact(new float[] {-3.5f, 1f})).isEqualTo(1);
  }

  @Test
  void constantHandleRefusesASecondClassifierInTheSameJvm() {
    MethodHandle first = GeneratedClassifier.trivial();
    ConstantHandles.offer(ConstantHandles.Slot.TRIVIAL, first);
    ConstantHandles.check(ConstantHandles.Slot.TRIVIAL, first);

    MethodHandle second = GeneratedClassifier.trivial();
    ConstantHandles.offer(ConstantHandles.Slot.TRIVIAL, second);
    assertThatThrownBy(() -> ConstantHandles.check(ConstantHandles.Slot.TRIVIAL, second))
        .isInstanceOf(IllegalStateException.class)
        .hasMessageContaining("run with forks (-f 1 or more), not -f 0");
  }
}
