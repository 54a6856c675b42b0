package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import javax.tools.JavaCompiler;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class VerifierTest {
  private static final Verifier VERIFIER = Verifier.create();
  private static final ClassCounts COUNTS = ClassCounts.of(2, 2, 2);
  private static final Schema SCHEMA = new Schema(
      List.of(Feature.numeric("rms"), Feature.numeric("temp"),
          Feature.categorical("mode", List.of("auto", "manual", "service"))),
      "state", List.of("normal", "wear", "fault"));

  /** The same feature tested twice on one path, a categorical split and a NaN-left split. */
  private static DecisionTree tree(int deepLeafClass) {
    Node inner = new NumericSplit(0, 1.0f, false, new Leaf(deepLeafClass, COUNTS),
        new Leaf(0, COUNTS), COUNTS);
    Node cat = new CategoricalSplit(2, CategoricalSplit.CodeSet.of(0, 2), true,
        new Leaf(1, COUNTS), new Leaf(2, COUNTS), COUNTS);
    Node temp = new NumericSplit(1, -0.0f, true, cat, inner, COUNTS);
    return new DecisionTree(SCHEMA, new NumericSplit(0, 2.5f, false, temp,
        new Leaf(2, COUNTS), COUNTS));
  }

  private static EmittedSource emit(DecisionTree tree, EmitOptions options) {
    return JavaEmitter.emit(tree, options, HeaderInfo.none());
  }

  @Test
  void agreeingCodePassesWithEverySplitTakenBothWays() throws Exception {
    DecisionTree tree = tree(1);
    EmitOptions options = EmitOptions.builder("v", "Agree").build();

    VerificationResult result = VERIFIER.verify(tree, emit(tree, options), options, List.of(), 9);

    assertThat(result.passed()).as(result.verdict()).isTrue();
    assertThat(result.splits()).isEqualTo(4);
    assertThat(result.coveredSplits()).isEqualTo(4);
    assertThat(result.methods()).extracting(m -> m.name()).contains("classify", "inSet");
    assertThat(result.foreignReferences()).isEmpty();
  }

  @Test
  void codeFromAnotherTreeIsCaughtByTheBoundaryProbes() throws Exception {
    EmitOptions options = EmitOptions.builder("v", "Differs").build();
    // The code returns class 0 where the model says 1, only for rms <= 1 and temp > 0: no data
    // row is given, so only the path-directed probes can find it.
    EmittedSource wrong = emit(tree(0), options);

    VerificationResult result = VERIFIER.verify(tree(1), wrong, options, List.of(), 9);

    assertThat(result.passed()).isFalse();
    assertThat(result.mismatches()).isPositive();
    assertThat(result.firstMismatches()).isNotEmpty();
    assertThat(result.verdict()).contains("disagree");
  }

  /** A full tree of the given depth on feature 0 with thresholds 0, 1, 2, ... in order. */
  private static Node full(int depth, int[] next) {
    if (depth == 0) {
      return new Leaf(next[0]++ % 3, COUNTS);
    }
    Node left = full(depth - 1, next);
    float threshold = next[1]++;
    Node right = full(depth - 1, next);
    return new NumericSplit(0, threshold, false, left, right, COUNTS);
  }

  @Test
  void aMethodOverTheCapFailsVerification() throws Exception {
    DecisionTree tree = new DecisionTree(SCHEMA, full(6, new int[2]));
    EmitOptions emitted = EmitOptions.builder("v", "Capped").build();
    EmittedSource source = emit(tree, emitted);
    VerificationResult fits = VERIFIER.verify(tree, source, emitted, List.of(), 1);
    assertThat(fits.passed()).isTrue();
    // 63 comparisons in one method: far over 256 bytes (JVMS §6.5: about ten bytes each).
    assertThat(fits.maxMethodBytes()).isGreaterThan(256);

    EmitOptions strict = emitted.toBuilder().maxMethodBytes(256).build();
    VerificationResult result = VERIFIER.verify(tree, source, strict, List.of(), 1);

    assertThat(result.mismatches()).isZero();
    assertThat(result.passed()).isFalse();
    assertThat(result.verdict()).contains("over the cap of 256");
  }

  @Test
  void theEmitterSplitsMethodsToStayUnderASmallCap() throws Exception {
    DecisionTree tree = new DecisionTree(SCHEMA, full(9, new int[2]));
    EmitOptions options = EmitOptions.builder("v", "Split").maxMethodBytes(300).build();

    VerificationResult result = VERIFIER.verify(tree, emit(tree, options), options, List.of(), 1);

    assertThat(result.passed()).as(result.verdict()).isTrue();
    assertThat(result.maxMethodBytes()).isLessThanOrEqualTo(300);
    assertThat(result.methods().size()).isGreaterThan(5);
    assertThat(result.branchCoverage()).isEqualTo(1.0);
  }

  @Test
  void bareClassHoldsOnlyTheClassifierAndIsSmaller() throws Exception {
    DecisionTree tree = tree(1);
    EmitOptions full = EmitOptions.builder("v", "Full").build();
    EmitOptions bare = EmitOptions.builder("v", "Bare").bare(true).build();

    VerificationResult fullResult = VERIFIER.verify(tree, emit(tree, full), full, List.of(), 2);
    VerificationResult bareResult = VERIFIER.verify(tree, emit(tree, bare), bare, List.of(), 2);

    assertThat(bareResult.passed()).as(bareResult.verdict()).isTrue();
    assertThat(bareResult.methods()).extracting(m -> m.name())
        .containsExactlyInAnyOrder("<init>", "classify", "inSet");
    assertThat(bareResult.classFileBytes()).isLessThan(fullResult.classFileBytes());
  }

  @Test
  void classFileSizeIsWhatJavacWrites() throws Exception {
    DecisionTree tree = tree(1);
    EmitOptions options = EmitOptions.builder("v", "Sized").build();
    EmittedSource source = emit(tree, options);
    VerificationResult result = VERIFIER.verify(tree, source, options, List.of(), 1);
    // Checked against the JDK's own javac run here on the same source with its default debug
    // setting, -g:source,lines (javac documentation). The -g:none figure is checked by
    // BudgetCommandTest against the written file.
    assertThat(result.classFileBytes()).isEqualTo(javacBytes(source, List.of()));
  }

  @TempDir Path dir;

  /** The size of the class file the system javac writes for {@code source}. */
  private long javacBytes(EmittedSource source, List<String> extra) throws Exception {
    String simple = source.qualifiedName().substring(source.qualifiedName().lastIndexOf('.') + 1);
    Path out = Files.createTempDirectory(dir, "javac");
    Path file = out.resolve(simple + ".java");
    Files.writeString(file, source.source(), StandardCharsets.UTF_8);
    List<String> args = new ArrayList<>(List.of("--release", "17", "-d", out.toString()));
    args.addAll(extra);
    args.add(file.toString());
    JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
    assertThat(javac.run(null, null, null, args.toArray(String[]::new))).isZero();
    return Files.size(out.resolve(source.qualifiedName().replace('.', '/') + ".class"));
  }

  @Test
  void theStaticInitializerIsNotHeldToTheCapButEveryOtherMethodIs() throws Exception {
    // 60 features: a 60-element array initializer, about 7 bytes each (JVMS §6.5), runs once.
    List<Feature> features = new ArrayList<>();
    for (int f = 0; f < 60; f++) {
      features.add(Feature.numeric("feature" + f));
    }
    Schema wide = new Schema(features, "state", List.of("normal", "wear", "fault"));
    DecisionTree tree = new DecisionTree(wide, full(5, new int[2]));
    EmitOptions options = EmitOptions.builder("v", "Init").maxMethodBytes(256).build();

    VerificationResult result = VERIFIER.verify(tree, emit(tree, options), options, List.of(), 1);

    assertThat(result.methods()).filteredOn(m -> m.name().equals("<clinit>"))
        .singleElement().satisfies(m -> assertThat(m.codeLength()).isGreaterThan(256));
    assertThat(result.maxMethodBytes()).isLessThanOrEqualTo(256);
    assertThat(result.passed()).as(result.verdict()).isTrue();
  }
}
