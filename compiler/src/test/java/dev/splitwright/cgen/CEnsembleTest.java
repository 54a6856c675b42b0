package dev.splitwright.cgen;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.emit.RandomEnsembles;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.TreeEnsemble;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Ensembles emitted as C in every layout: the trees as {@code static} functions or one table,
 * {@code classify} adding the votes in float. Built with gcc and {@code -ffp-contract=off}
 * ({@link Gcc#STRICT}) on x86-64, where FLT_EVAL_METHOD is 0 (SSE arithmetic, System V AMD64
 * ABI), they must give {@link TreeEnsemble}'s classes and shares bit for bit: IEEE 754 binary32
 * addition and division are correctly rounded.
 */
class CEnsembleTest {
  private static final int ENSEMBLES = Integer.getInteger("cgen.randomEnsembles", 150);
  private static final int PER_BUILD = 25;
  private static final int RANDOM_PROBES = 100;

  @TempDir
  Path dir;

  @Test
  void randomEnsemblesGiveTheModelsClassesAndShares() throws IOException {
    assumeTrue(Gcc.available(), "gcc is needed to build emitted C");
    SplittableRandom random = new SplittableRandom(20_261_203L);
    int checked = 0;
    int[] kinds = new int[2];
    for (int start = 0; start < ENSEMBLES; start += PER_BUILD) {
      List<CBatch.Case> cases = new ArrayList<>();
      for (int i = start; i < Math.min(ENSEMBLES, start + PER_BUILD); i++) {
        CBatch.Case c = newCase("e" + i, random.split());
        kinds[((TreeEnsemble) c.model()).kind().ordinal()]++;
        cases.add(c);
      }
      checked += CBatch.run(dir, cases, start == 0);
    }
    assertThat(checked).isEqualTo(ENSEMBLES);
    assertThat(kinds[0]).isPositive();
    assertThat(kinds[1]).isPositive();
  }

  private static CBatch.Case newCase(String base, SplittableRandom random) {
    TreeEnsemble ensemble = RandomEnsembles.ensemble(random);
    CEmitOptions options = new CEmitOptions(base,
        List.of(Layout.BRANCHES, Layout.TABLE, Layout.FLAT).get(random.nextInt(3)),
        random.nextInt(3) == 0 ? InputKind.INT : InputKind.FLOAT,
        random.nextInt(3) > 0, random.nextInt(4) == 0);
    if (options.inputKind() == InputKind.FLOAT && random.nextInt(4) == 0) {
      options = options.withCompareBits(true);
    }
    return CBatch.withProbes(base, ensemble, options, random.nextLong(), RANDOM_PROBES);
  }

  /** Two trees on one feature whose weights tie for some inputs; worked by hand below. */
  private static TreeEnsemble tieCase() {
    dev.splitwright.data.Schema schema = new dev.splitwright.data.Schema(
        List.of(dev.splitwright.data.Feature.numeric("v")), "y", List.of("a", "b"));
    DecisionTree first = new DecisionTree(schema, new NumericSplit(0, 0.5f, false,
        new Leaf(0, ClassCounts.of(2, 0)), new Leaf(1, ClassCounts.of(0, 2)),
        ClassCounts.of(2, 2)));
    DecisionTree second = new DecisionTree(schema, new Leaf(1, ClassCounts.of(1, 3)));
    return TreeEnsemble.boosted(List.of(first, second), new float[] {0.1f, 0.1f});
  }

  @Test
  void theTableLayoutPacksEveryTreeIntoOneTable() {
    SplittableRandom random = new SplittableRandom(7);
    TreeEnsemble ensemble = null;
    while (ensemble == null || ensemble.treeCount() < 3) {
      ensemble = RandomEnsembles.ensemble(random);
    }
    String c = CEmitter.emit(ensemble, new CEmitOptions("packed", Layout.TABLE, InputKind.FLOAT,
        false, true), HeaderInfo.none()).sourceText();

    // One node array and one walk, called once per tree with that tree's start index.
    assertThat(c.split("static const [a-z0-9_]+ packed_tree\\[", -1)).hasSize(2);
    assertThat(c.split("packed_walk\\(x, \\d+u\\)", -1)).hasSize(ensemble.treeCount() + 1);
    assertThat(c).doesNotContain("packed_tree0(");
  }

  @Test
  void votesThatTieGoToTheLowestClassInC() throws IOException {
    assumeTrue(Gcc.available(), "gcc is needed to build emitted C");
    TreeEnsemble ensemble = tieCase();
    // Worked by hand: v = 0 gives votes a 0.1, b 0.1: a tie, so class 0 (a); v = 1 gives b 0.2.
    assertThat(ensemble.predict(new float[] {0f})).isZero();
    assertThat(ensemble.predict(new float[] {1f})).isEqualTo(1);
    CEmitOptions options = CEmitOptions.of("tie").withProbabilities(true);
    List<float[]> inputs = List.of(new float[] {0f}, new float[] {1f});
    COracle.Report report = COracle.compare(dir, ensemble, options,
        CEmitter.emit(ensemble, options, HeaderInfo.none()),
        HarnessData.packFloats(inputs, 1), inputs);
    assertThat(report.mismatches()).as(report.describe()).isZero();
  }

  @Test
  void aWeightOneUlpOffInALaterTreeIsCaught() throws IOException {
    assumeTrue(Gcc.available(), "gcc is needed to build emitted C");
    TreeEnsemble ensemble = tieCase();
    CEmitOptions options = CEmitOptions.of("ulp").withProbabilities(true);
    CSource right = CEmitter.emit(ensemble, options, HeaderInfo.none());
    // Tree 1's weight 0.1f one ulp up: 0x1.99999ap-4f is 0.1f (IEEE 754 binary32, worked by hand
    // from 0.1 = 0x1.999999...p-4 rounded to 24 bits), 0x1.99999cp-4f its successor.
    String text = right.sourceText();
    String tree1 = "score[ulp_tree1(x)] += 0x1.99999ap-4f;";
    assertThat(text).contains(tree1);
    CSource wrong = new CSource(right.headerName(), right.headerText(), right.sourceName(),
        text.replace(tree1, "score[ulp_tree1(x)] += 0x1.99999cp-4f;"));
    List<float[]> inputs = List.of(new float[] {0f}, new float[] {1f});
    COracle.Report report = COracle.compare(dir, ensemble, options, wrong,
        HarnessData.packFloats(inputs, 1), inputs);
    // v = 0: the tie breaks the other way (b); v = 1: the shares' bits change.
    assertThat(report.mismatches()).isPositive();
  }

  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE", "FLAT"})
  void aThresholdOneUlpOffInALaterTreeIsCaught(Layout layout) throws IOException {
    assumeTrue(Gcc.available(), "gcc is needed to build emitted C");
    Schema schema = new Schema(List.of(Feature.numeric("v")), "y", List.of("a", "b"));
    DecisionTree first = new DecisionTree(schema, new Leaf(0, ClassCounts.of(2, 0)));
    TreeEnsemble ensemble = TreeEnsemble.boosted(List.of(first, splitAt(schema, 0.5f)),
        new float[] {0.1f, 0.3f});
    TreeEnsemble moved = TreeEnsemble.boosted(List.of(first,
        splitAt(schema, Math.nextUp(0.5f))), new float[] {0.1f, 0.3f});
    CEmitOptions options = new CEmitOptions("later", layout, InputKind.FLOAT, false, false);
    // Worked by hand: at v = nextUp(0.5f) tree 1 goes right (class b, 0.3 against a's 0.1) with
    // the threshold 0.5f but left with nextUp(0.5f) (IEEE 754 nextUp), and class a wins.
    List<float[]> inputs = List.of(new float[] {0.5f}, new float[] {Math.nextUp(0.5f)});
    COracle.Report exact = COracle.compare(dir, ensemble, options,
        CEmitter.emit(ensemble, options, HeaderInfo.none()),
        HarnessData.packFloats(inputs, 1), inputs);
    COracle.Report off = COracle.compare(dir, ensemble, options,
        CEmitter.emit(moved, options, HeaderInfo.none()),
        HarnessData.packFloats(inputs, 1), inputs);
    assertThat(exact.mismatches()).as(exact.describe()).isZero();
    assertThat(off.mismatches()).isEqualTo(1);
  }

  private static DecisionTree splitAt(Schema schema, float threshold) {
    return new DecisionTree(schema, new NumericSplit(0, threshold, false,
        new Leaf(0, ClassCounts.of(2, 0)), new Leaf(1, ClassCounts.of(0, 2)),
        ClassCounts.of(2, 2)));
  }

  @Test
  void theFileStopsWhenFloatArithmeticIsWider() throws IOException {
    assumeTrue(Gcc.available(), "gcc is needed to build emitted C");
    CEmitOptions options = CEmitOptions.of("wide");
    CSource source = CEmitter.emit(tieCase(), options, HeaderInfo.none());
    Gcc.write(dir, source.headerName(), source.headerText(), source.sourceName(),
        source.sourceText());
    assertThat(Gcc.gcc(dir, Gcc.STRICT, List.of(source.sourceName()), "plain.o").exit())
        .isZero();
    // An x87 build (gcc -m32 -mfpmath=387) has FLT_EVAL_METHOD 2 (C99 5.2.4.2.2), but this host
    // has no 32-bit C library headers; <float.h> of gcc defines FLT_EVAL_METHOD from the
    // predefined __FLT_EVAL_METHOD__, so redefining that simulates the x87 build.
    List<String> wide = new ArrayList<>(List.of("-std=c99", "-U__FLT_EVAL_METHOD__",
        "-D__FLT_EVAL_METHOD__=2"));
    Gcc.Result result = Gcc.gcc(dir, wide, List.of(source.sourceName()), "wide.o");
    assertThat(result.exit()).isNotZero();
    assertThat(result.output()).contains(
        "wide.c adds float votes: it needs FLT_EVAL_METHOD == 0");
  }
}
