package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.SourceFile;
import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.emit.RandomTrees;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The {@code flat} layout agrees with its model exactly as the other layouts must: on open data
 * sets (rows, boundary and random probes) and on random trees of every shape up to the layout's
 * depth limit, for float, double and int input; and its walk has no branch but the loop's.
 */
class FlatLayoutTest {
  private static final int TREES = Integer.getInteger("splitwright.flatTrees", 1000);
  private static final int TREES_PER_BATCH = 25;
  private static final long SEED = 0xF1A7_2026L;
  private static final Verifier VERIFIER = Verifier.create();

  private record Case(DecisionTree tree, EmitOptions options, EmittedSource source, long seed) {}

  static Stream<Arguments> dataSets() {
    return Stream.of(
        // UCI Breast Cancer Wisconsin (Diagnostic), 569 rows, no missing values.
        Arguments.of("breast-cancer-wisconsin-diagnostic.csv", "diagnosis", 6),
        // UCI Pima Indians Diabetes (mlbench PimaIndiansDiabetes2): empty cells are missing.
        Arguments.of("pima-indians-diabetes-2.csv", "diabetes", 10),
        // UCI Congressional Voting Records: categorical y/n with missing votes.
        Arguments.of("house-votes-84.csv", "Class", 6));
  }

  @ParameterizedTest
  @MethodSource("dataSets")
  void agreesWithTheModelOnOpenDataInEveryInputType(String csv, String target, int depth)
      throws Exception {
    Dataset data = CsvLoader.load(Path.of("src/test/resources/datasets", csv),
        LoadOptions.builder().target(target).build()).dataset();
    DecisionTree tree = CartTrainer.train(data, TrainingOptions.builder().maxDepth(depth).build());
    for (InputKind kind : InputKind.values()) {
      for (boolean probabilities : new boolean[] {false, true}) {
        EmitOptions options = EmitOptions.builder("check", "Flat")
            .layout(Layout.FLAT).inputKind(kind).probabilities(probabilities).build();
        EmittedSource source = JavaEmitter.emit(tree, options, HeaderInfo.none());
        VerificationResult v = VERIFIER.verify(tree, source, options, List.of(data), 1);
        assertThat(v.mismatches()).as(kind + ": " + v.verdict()).isZero();
        assertThat(v.passed()).as(v.verdict()).isTrue();
        if (kind != InputKind.INT) {
          // Int inputs cannot reach the left side of a split between two neighbouring ints.
          assertThat(v.branchCoverage()).isEqualTo(1.0);
        }
        assertThat(v.inputsChecked()).isGreaterThan(data.rows());
      }
    }
  }

  @Test
  void walkBranchesOnlyOnItsStepCountAndDecisionsNever() throws Exception {
    // Pima has missing cells, house votes categorical codes: both extra paths of the walk.
    for (String[] set : new String[][] {{"pima-indians-diabetes-2.csv", "diabetes"},
        {"house-votes-84.csv", "Class"}}) {
      Dataset data = CsvLoader.load(Path.of("src/test/resources/datasets", set[0]),
          LoadOptions.builder().target(set[1]).build()).dataset();
      DecisionTree deep = tree(data, 8);
      DecisionTree five = tree(data, 5);
      DecisionTree two = tree(data, 2);
      // Padded to one depth, even and odd (the slots at most double); and left ragged, which
      // reads each tree's depth and takes an odd first level by arithmetic.
      List<TreeEnsemble> forests = List.of(TreeEnsemble.forest(List.of(deep, five)),
          TreeEnsemble.forest(List.of(five, tree(data, 3))),
          TreeEnsemble.forest(List.of(deep, two, two)));
      for (InputKind kind : InputKind.values()) {
        // House votes are all categorical; Pima all numeric.
        boolean categorical = set[0].startsWith("house");
        assertWalkBranchesOnItsStepCount(deep, kind, categorical);
        for (int f = 0; f < forests.size(); f++) {
          String source = assertWalkBranchesOnItsStepCount(forests.get(f), kind, categorical);
          assertThat(source.contains("int d = DEPTH[t];")).as("forest %d ragged", f)
              .isEqualTo(f == 2);
        }
      }
    }
  }

  private static DecisionTree tree(Dataset data, int depth) {
    return CartTrainer.train(data, TrainingOptions.builder().maxDepth(depth).build());
  }

  /** Asserts the branch shape of the walk and the test that picks it; returns the source. */
  private static String assertWalkBranchesOnItsStepCount(Classifier model, InputKind kind,
      boolean categorical) throws Exception {
    EmitOptions options = EmitOptions.builder("check", "Flat")
        .layout(Layout.FLAT).inputKind(kind).build();
    EmittedSource source = JavaEmitter.emit(model, options, HeaderInfo.none());
    byte[] bytes = VERIFIER.compiler().compileOne(source.qualifiedName(), source.source())
        .bytes(source.qualifiedName());
    // The decision at a slot is arithmetic alone: no conditional branch (JVMS §6.5 if<cond>,
    // if_icmp<cond>, ifnull), no switch (MethodOpcodes refuses those).
    assertThat(MethodOpcodes.of(bytes, "right"))
        .as(kind.optionName()).noneMatch(MethodOpcodes.Instruction::conditionalBranch);
    if (kind == InputKind.INT || categorical) {
      // Int keys and categorical codes take one walk for every row.
      assertLoopOnly(MethodOpcodes.of(bytes, "leaf"), kind);
      return source.source();
    }
    // Float and double: a finite row takes the walk that decides by subtraction, a row with a
    // NaN or an infinity the one by order keys. That choice is the one branch on the row.
    assertThat(MethodOpcodes.of(bytes, "over"))
        .as(kind.optionName()).noneMatch(MethodOpcodes.Instruction::conditionalBranch);
    assertLoopOnly(MethodOpcodes.of(bytes, "walk"), kind);
    assertLoopOnly(MethodOpcodes.of(bytes, "walkFinite"), kind);
    // Pima's 8 features are read one by one, without a loop: no branch at all.
    assertThat(MethodOpcodes.of(bytes, "special"))
        .as(kind.optionName()).noneMatch(MethodOpcodes.Instruction::conditionalBranch);
    if (model instanceof TreeEnsemble) {
      // The row is tested once for all trees, in scores: that test and each loop's exit.
      assertThat(MethodOpcodes.of(bytes, "scores").stream()
          .filter(MethodOpcodes.Instruction::conditionalBranch)).as(kind.optionName()).hasSize(3);
      return source.source();
    }
    List<MethodOpcodes.Instruction> dispatch = MethodOpcodes.of(bytes, "leaf");
    assertThat(dispatch.stream().filter(MethodOpcodes.Instruction::conditionalBranch))
        .as(kind.optionName()).hasSize(1);
    assertThat(dispatch).noneMatch(MethodOpcodes.Instruction::isGoto);
    return source.source();
  }

  private static void assertLoopOnly(List<MethodOpcodes.Instruction> code, InputKind kind) {
    List<MethodOpcodes.Instruction> tests =
        code.stream().filter(MethodOpcodes.Instruction::conditionalBranch).toList();
    List<MethodOpcodes.Instruction> gotos =
        code.stream().filter(MethodOpcodes.Instruction::isGoto).toList();
    // One conditional branch, the loop's exit, and one goto, the back edge to it (javac's
    // shape of a for loop), so the walk branches on nothing but its step count.
    assertThat(tests).as(kind.optionName()).hasSize(1);
    assertThat(gotos).hasSize(1);
    // The back edge lands on the loads of the loop test: the counter and its bound.
    assertThat(gotos.get(0).target()).isBetween(tests.get(0).offset() - 4,
        tests.get(0).offset() - 2);
    int afterGoto = code.get(code.indexOf(gotos.get(0)) + 1).offset();
    assertThat(tests.get(0).target()).isEqualTo(afterGoto);
  }

  @Test
  void randomTreesAgreeWithTheirModel() throws Exception {
    InMemoryCompiler compiler = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);
    Verifier verifier = new Verifier(compiler).withRandomProbes(100);
    SplittableRandom random = new SplittableRandom(SEED);
    List<String> failures = new ArrayList<>();
    int[] kinds = new int[InputKind.values().length];
    int deepest = 0;
    int checked = 0;
    for (int first = 0; first < TREES; first += TREES_PER_BATCH) {
      List<Case> batch = new ArrayList<>();
      for (int i = first; i < Math.min(TREES, first + TREES_PER_BATCH); i++) {
        RandomTrees.Shape drawn = RandomTrees.shape(random);
        // The layout stops at depth 16 (2^16 leaf slots).
        RandomTrees.Shape shape = new RandomTrees.Shape(Math.min(16, drawn.maxDepth()),
            drawn.maxNodes(), drawn.features(), drawn.classes());
        DecisionTree tree = RandomTrees.tree(random, shape);
        deepest = Math.max(deepest, tree.depth());
        InputKind kind = InputKind.values()[random.nextInt(3)];
        kinds[kind.ordinal()]++;
        boolean fewFeatures = tree.schema().featureCount() <= EmitOptions.MAX_NAMED_ARGS;
        EmitOptions options = EmitOptions.builder("prop", "Flat" + i)
            .layout(Layout.FLAT).inputKind(kind)
            .namedArgs(fewFeatures && random.nextInt(5) == 0)
            .probabilities(random.nextInt(4) == 0)
            .bare(random.nextInt(4) == 0)
            .build();
        batch.add(new Case(tree, options, JavaEmitter.emit(tree, options, HeaderInfo.none()), i));
      }
      CompiledClasses compiled = compiler.compile(batch.stream()
          .map(c -> new SourceFile(c.source().qualifiedName(), c.source().source()))
          .toList());
      for (Case c : batch) {
        VerificationResult result = verifier.check(c.tree(), compiled, c.source(), c.options(),
            List.of(), c.seed());
        checked++;
        if (!result.passed()) {
          failures.add(String.format(Locale.ROOT, "%s (%s, depth %d): %s",
              c.source().qualifiedName(), c.options().inputKind().optionName(), c.tree().depth(),
              result.verdict()));
        }
      }
    }
    assertThat(failures).isEmpty();
    assertThat(checked).isEqualTo(TREES);
    if (TREES >= 1000) {
      // Every input type and the deepest trees the layout takes were really drawn.
      assertThat(java.util.Arrays.stream(kinds).min().orElse(0)).isGreaterThan(200);
      assertThat(deepest).isEqualTo(16);
    }
  }
}
