package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

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
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Method;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/** {@code --probabilities}: leaf class frequencies, checked against the model bit for bit. */
class ProbabilitiesTest {
  private static final Verifier VERIFIER = Verifier.create().withRandomProbes(100);
  private static final Schema SCHEMA = new Schema(List.of(Feature.numeric("x")), "y",
      List.of("a", "b", "c"));

  /** x <= 1 reaches counts (1, 3, 0); x > 1 (and NaN) reaches (2, 2, 3), class b by weight. */
  private static DecisionTree tree(int rightB) {
    return new DecisionTree(SCHEMA, new NumericSplit(0, 1f, false,
        new Leaf(1, ClassCounts.of(1, 3, 0)), new Leaf(1, ClassCounts.of(2, rightB, 3)),
        ClassCounts.of(3, 5, 3)));
  }

  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE"})
  void frequenciesAreTheLeafCountsOverTheirTotal(Layout layout) throws Exception {
    EmitOptions options = EmitOptions.builder("prob", "Freq").layout(layout)
        .probabilities(true).build();
    EmittedSource source = JavaEmitter.emit(tree(2), options, HeaderInfo.none());
    CompiledClasses compiled = VERIFIER.compiler().compileOne(source.qualifiedName(),
        source.source());
    Method probabilities = compiled.load(source.qualifiedName())
        .getMethod("classProbabilities", float[].class, float[].class);

    float[] out = {9f, 9f, 9f};
    probabilities.invoke(null, new float[] {0.5f}, out);
    // Worked by hand: 1/4 and 3/4 are exact in binary; 0 for the absent class.
    assertThat(out).containsExactly(0.25f, 0.75f, 0f);
    probabilities.invoke(null, new float[] {Float.NaN}, out);
    // 2/7 and 3/7 rounded to float, as the model computes them (double division, then float).
    assertThat(out).containsExactly((float) (2 / 7.0), (float) (2 / 7.0), (float) (3 / 7.0));

    assertThatThrownBy(() -> probabilities.invoke(null, new float[] {0.5f}, new float[2]))
        .isInstanceOf(InvocationTargetException.class)
        .cause().isInstanceOf(IllegalArgumentException.class)
        .hasMessage("expected room for 3 classes but got 2");

    VerificationResult result = VERIFIER.check(tree(2), compiled, source, options, List.of(), 1);
    assertThat(result.passed()).as(result.verdict()).isTrue();
  }

  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE"})
  void verificationCatchesFrequenciesOfAnotherTree(Layout layout) throws Exception {
    EmitOptions options = EmitOptions.builder("prob", "Other").layout(layout)
        .probabilities(true).build();
    // Same splits and classes, one count different: only classProbabilities can tell.
    EmittedSource other = JavaEmitter.emit(tree(4), options, HeaderInfo.none());

    VerificationResult result = VERIFIER.verify(tree(2), other, options, List.of(), 1);

    assertThat(result.passed()).isFalse();
    assertThat(result.firstMismatches()).isNotEmpty()
        .allMatch(m -> m.startsWith("classProbabilities "));
  }
}
