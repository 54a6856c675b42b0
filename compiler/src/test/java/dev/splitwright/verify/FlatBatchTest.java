package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Method;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;
import org.junit.jupiter.api.Test;

/**
 * The {@code flat} layout's many-row entry {@code classifyAll}: the verifier compares it with the
 * model in every lane and catches a wrong one; it branches on rows and loops, never on a split; it
 * refuses what {@code classify} refuses. Trees come from UCI data sets (Pima Indians Diabetes,
 * with missing cells, so groups with a NaN take the other walk; Congressional Voting Records,
 * categorical).
 */
class FlatBatchTest {
  private static final Verifier VERIFIER = Verifier.create();

  private static Dataset load(String csv, String target) throws Exception {
    return CsvLoader.load(Path.of("src/test/resources/datasets", csv),
        LoadOptions.builder().target(target).build()).dataset();
  }

  private static Dataset pima() throws Exception {
    return load("pima-indians-diabetes-2.csv", "diabetes");
  }

  private static DecisionTree tree(Dataset data, int depth) {
    return CartTrainer.train(data, TrainingOptions.builder().maxDepth(depth).build());
  }

  private static EmitOptions.Builder flat(InputKind kind) {
    return EmitOptions.builder("check", "Flat").layout(Layout.FLAT).inputKind(kind);
  }

  private static EmittedSource emit(DecisionTree tree, EmitOptions options) {
    return JavaEmitter.emit(tree, options, HeaderInfo.none());
  }

  /**
   * Verifies a Pima tree's flat class whose text from the first {@code from} on is changed by
   * {@code to}, after checking that the unchanged class passes.
   */
  private static VerificationResult verifyTampered(String from, Function<String, String> to)
      throws Exception {
    Dataset data = pima();
    DecisionTree tree = tree(data, 7);
    EmitOptions options = flat(InputKind.FLOAT).build();
    EmittedSource source = emit(tree, options);
    assertThat(VERIFIER.verify(tree, source, options, List.of(data), 1).passed()).isTrue();
    String text = source.source();
    int at = text.indexOf(from);
    assertThat(at).as(from).isNotNegative();
    String changed = text.substring(0, at) + to.apply(text.substring(at));
    return VERIFIER.verify(tree, new EmittedSource(source.qualifiedName(), source.layout(),
        changed), options, List.of(data), 1);
  }

  @Test
  void verifierCatchesOneWrongLane() throws Exception {
    // The fourth row of each group reads the third row's leaf.
    VerificationResult v = verifyTampered("out[row + 3] = LEAF[i3",
        rest -> rest.replaceFirst("LEAF\\[i3", "LEAF[i2"));
    assertThat(v.mismatches()).isPositive();
    assertThat(v.verdict()).contains(JavaEmitter.BATCH_METHOD);
  }

  @Test
  void verifierCatchesAGroupThatSkipsTheWalkForMissingValues() throws Exception {
    // Without the test of the values on the paths, a NaN is decided by the sign of threshold
    // minus NaN.
    VerificationResult v = verifyTampered("if (odd < 0)",
        rest -> rest.replaceFirst("odd < 0", "odd < 0 && row < 0"));
    assertThat(v.mismatches()).as(v.verdict()).isPositive();
    assertThat(v.verdict()).contains(JavaEmitter.BATCH_METHOD);
  }

  @Test
  void branchesOnItsRowsAndLoopsWhateverTheDepth() throws Exception {
    Dataset numeric = pima();
    Dataset categorical = load("house-votes-84.csv", "Class");
    for (InputKind kind : InputKind.values()) {
      for (int depth : new int[] {3, 9}) {
        for (Dataset data : List.of(numeric, categorical)) {
          EmittedSource source = emit(tree(data, depth), flat(kind).build());
          byte[] bytes = VERIFIER.compiler().compileOne(source.qualifiedName(), source.source())
              .bytes(source.qualifiedName());
          long tests = MethodOpcodes.of(bytes, JavaEmitter.BATCH_METHOD).stream()
              .filter(MethodOpcodes.Instruction::conditionalBranch).count();
          // The length of out, the group loop, the lengths of the group's rows, the step loop
          // and the loop of the rows after the last group; float and double rows without
          // categorical splits also test the group for a missing or infinite value. None per
          // split (JVMS §6.5 if<cond> and if_icmp<cond>).
          boolean finiteWalk = kind != InputKind.INT && data == numeric;
          assertThat(tests).as(kind.optionName() + " depth " + depth)
              .isEqualTo(finiteWalk ? 6 : 5);
        }
      }
    }
  }

  @Test
  void staysWithinItsByteBoundAndIsLeftOutUnderASmallerCap() throws Exception {
    // UCI Breast Cancer Wisconsin (Diagnostic): 30 features, the widest set here; an odd depth
    // and probabilities give the longest method.
    Dataset data = load("breast-cancer-wisconsin-diagnostic.csv", "diagnosis");
    DecisionTree tree = tree(data, 7);
    assertThat(tree.depth() % 2).isOne();
    for (InputKind kind : InputKind.values()) {
      EmitOptions options = flat(kind).probabilities(true).build();
      EmittedSource source = emit(tree, options);
      byte[] bytes = VERIFIER.compiler().compileOne(source.qualifiedName(), source.source())
          .bytes(source.qualifiedName());
      int size = MethodOpcodes.of(bytes, JavaEmitter.BATCH_METHOD).stream()
          .mapToInt(i -> i.offset() + 1).max().orElseThrow();
      assertThat(size).as(kind.optionName()).isLessThanOrEqualTo(JavaEmitter.BATCH_MAX_BYTES);
      assertThat(VERIFIER.verify(tree, source, options, List.of(data), 1).passed()).isTrue();
    }
    assertThat(emit(tree, flat(InputKind.FLOAT).maxMethodBytes(JavaEmitter.BATCH_MAX_BYTES - 1)
        .build()).source()).doesNotContain(JavaEmitter.BATCH_METHOD);
  }

  @Test
  void aWideInputIsTestedForMissingValuesInALoopAndStillAgrees() throws Exception {
    // Past 32 features the test for missing values loops instead of reading each one by name.
    // UCI Breast Cancer Wisconsin twice side by side: 60 features.
    Dataset narrow = load("breast-cancer-wisconsin-diagnostic.csv", "diagnosis");
    StringBuilder csv = new StringBuilder();
    List<String> names = narrow.schema().featureNames();
    for (int copy = 0; copy < 2; copy++) {
      for (String name : names) {
        csv.append(name).append('_').append(copy).append(',');
      }
    }
    csv.append("diagnosis\n");
    for (int r = 0; r < narrow.rows(); r++) {
      float[] row = narrow.row(r);
      for (int copy = 0; copy < 2; copy++) {
        for (float v : row) {
          // Every 7th value of the second copy missing, so groups with a NaN come up.
          csv.append(copy == 1 && r % 7 == 0 ? "" : Float.toString(v)).append(',');
        }
      }
      csv.append(narrow.schema().classes().get(narrow.labels()[r])).append('\n');
    }
    Path file = java.nio.file.Files.createTempFile("wide", ".csv");
    try {
      java.nio.file.Files.writeString(file, csv);
      Dataset data = CsvLoader.load(file, LoadOptions.builder().target("diagnosis").build())
          .dataset();
      DecisionTree tree = tree(data, 6);
      EmitOptions options = flat(InputKind.FLOAT).build();
      EmittedSource source = emit(tree, options);
      assertThat(source.source()).contains("for (int f = 0; f < x.length; f++)");
      VerificationResult v = VERIFIER.verify(tree, source, options, List.of(data), 1);
      assertThat(v.mismatches()).as(v.verdict()).isZero();
    } finally {
      java.nio.file.Files.delete(file);
    }
  }

  @Test
  void aMissingValueOnOrOffThePathGivesWhatTheModelGives() throws Throwable {
    // The walk tests only the values it reads: a NaN off a row's path must leave its leaf as it
    // is, one on the path must send the group through classify. Every complete Pima row, as it
    // is and with each feature in turn made NaN: nine inputs a row against groups of eight, so
    // each copy comes in every lane position over the rows.
    Dataset data = pima();
    DecisionTree tree = tree(data, 6);
    EmittedSource source = emit(tree, flat(InputKind.FLOAT).build());
    Method all = VERIFIER.compiler().compileOne(source.qualifiedName(), source.source())
        .load(source.qualifiedName())
        .getMethod(JavaEmitter.BATCH_METHOD, float[][].class, int[].class);
    int features = data.schema().featureCount();
    List<float[]> rows = new ArrayList<>();
    for (int r = 0; r < data.rows(); r++) {
      float[] row = data.row(r);
      boolean complete = true;
      for (float v : row) {
        complete &= !Float.isNaN(v);
      }
      if (!complete) {
        continue;
      }
      rows.add(row);
      for (int f = 0; f < features; f++) {
        float[] copy = row.clone();
        copy[f] = Float.NaN;
        rows.add(copy);
      }
    }
    float[][] inputs = rows.toArray(new float[0][]);
    int[] out = new int[inputs.length];
    invoke(all, inputs, out);
    int changed = 0;
    for (int i = 0; i < inputs.length; i++) {
      assertThat(out[i]).as("row %d", i).isEqualTo(tree.predict(inputs[i]));
      int complete = i - i % (features + 1);
      changed += out[i] == tree.predict(inputs[complete]) ? 0 : 1;
    }
    // Some NaN must land on a path and change the class, else classify's walk went untested.
    assertThat(changed).isPositive();
  }

  @Test
  void refusesAShortOutArrayAndARowOfTheWrongLength() throws Throwable {
    Dataset data = pima();
    EmittedSource source = emit(tree(data, 5), flat(InputKind.FLOAT).build());
    CompiledClasses classes = VERIFIER.compiler().compileOne(source.qualifiedName(),
        source.source());
    Method all = classes.load(source.qualifiedName())
        .getMethod(JavaEmitter.BATCH_METHOD, float[][].class, int[].class);
    float[][] rows = new float[9][];
    for (int r = 0; r < rows.length; r++) {
      rows[r] = data.row(r);
    }
    assertThatThrownBy(() -> invoke(all, rows, new int[8]))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("out has 8 entries for 9 rows");
    // In a group and among the rows after the last group.
    for (int bad : new int[] {2, 8}) {
      float[][] withShort = rows.clone();
      withShort[bad] = Arrays.copyOf(rows[bad], data.schema().featureCount() - 1);
      assertThatThrownBy(() -> invoke(all, withShort, new int[9]))
          .isInstanceOf(IllegalArgumentException.class)
          .hasMessageContaining("expected " + data.schema().featureCount() + " features");
    }
    int[] out = new int[12];
    Arrays.fill(out, -1);
    invoke(all, rows, out);
    // A longer out keeps what lies past the rows.
    assertThat(out[9]).isEqualTo(-1);
  }

  @Test
  void onlyArrayInputSingleTreesWithTheRoomOfAFullClassHaveIt() throws Exception {
    Dataset data = pima();
    DecisionTree tree = tree(data, 4);
    assertThat(emit(tree, flat(InputKind.FLOAT).build()).source())
        .contains(JavaEmitter.BATCH_METHOD);
    assertThat(emit(tree, flat(InputKind.FLOAT).namedArgs(true).build()).source())
        .doesNotContain(JavaEmitter.BATCH_METHOD);
    assertThat(emit(tree, flat(InputKind.FLOAT).bare(true).build()).source())
        .doesNotContain(JavaEmitter.BATCH_METHOD);
    assertThat(JavaEmitter.emit(TreeEnsemble.forest(List.of(tree, tree(data, 3))),
        flat(InputKind.FLOAT).build(), HeaderInfo.none()).source())
        .doesNotContain(JavaEmitter.BATCH_METHOD);
    for (Layout other : List.of(Layout.BRANCHES, Layout.TABLE)) {
      assertThat(emit(tree, EmitOptions.builder("check", "Flat").layout(other).build()).source())
          .doesNotContain(JavaEmitter.BATCH_METHOD);
    }
  }

  private static void invoke(Method method, Object... args) throws Throwable {
    try {
      method.invoke(null, args);
    } catch (InvocationTargetException e) {
      throw e.getCause();
    }
  }
}
