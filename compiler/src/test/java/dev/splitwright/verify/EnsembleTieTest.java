package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.TreeEnsemble;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/** Tied votes go to the lowest class index, in the model and in the emitted Java. */
class EnsembleTieTest {

  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE", "FLAT"})
  void tiedVotesGoToTheLowestClassIndex(Layout layout) throws Exception {
    Schema schema = new Schema(List.of(Feature.numeric("v")), "y", List.of("a", "b", "c"));
    // Tree 0 votes c for v <= 0.5, else b; tree 1 always votes b; tree 2 votes a for v <= 0.5,
    // else c.
    DecisionTree first = new DecisionTree(schema, new NumericSplit(0, 0.5f, false,
        new Leaf(2, ClassCounts.of(0, 0, 2)), new Leaf(1, ClassCounts.of(0, 2, 0)),
        ClassCounts.of(0, 2, 2)));
    DecisionTree second = new DecisionTree(schema, new Leaf(1, ClassCounts.of(0, 3, 1)));
    DecisionTree third = new DecisionTree(schema, new NumericSplit(0, 0.5f, false,
        new Leaf(0, ClassCounts.of(2, 0, 0)), new Leaf(2, ClassCounts.of(0, 0, 2)),
        ClassCounts.of(2, 0, 2)));
    TreeEnsemble forest = TreeEnsemble.forest(List.of(first, second, third));
    // Worked by hand: v = 0 gives votes (a, b, c) = (1, 1, 1), a three-way tie: class 0 (a);
    // v = 1 gives (0, 2, 1): class 1 (b). Shares at v = 0: 1 / 3 each, one float division, the
    // float nearest 1/3 (IEEE 754 round to nearest).
    assertThat(forest.predict(new float[] {0f})).isZero();
    assertThat(forest.predict(new float[] {1f})).isEqualTo(1);
    EmitOptions options = EmitOptions.builder("tie", "Tie" + layout.name())
        .layout(layout).probabilities(true).build();
    EmittedSource source = JavaEmitter.emit(forest, options, HeaderInfo.none());
    Verifier verifier = Verifier.create();
    CompiledClasses classes = verifier.compiler()
        .compileOne(source.qualifiedName(), source.source());
    EmittedClassifier emitted = EmittedClassifier.of(classes.load(source.qualifiedName()),
        options, schema);

    assertThat(emitted.classify(new float[] {0f})).isZero();
    assertThat(emitted.classify(new float[] {1f})).isEqualTo(1);
    assertThat(emitted.probabilities(new float[] {0f}))
        .containsExactly(1f / 3f, 1f / 3f, 1f / 3f);
    assertThat(verifier.check(forest, classes, source, options, List.of(), 1).passed()).isTrue();
  }
}
