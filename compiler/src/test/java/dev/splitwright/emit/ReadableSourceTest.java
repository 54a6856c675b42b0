package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * Issue 12, item 3: a generated file a reviewer can read. Each sentence of the item has a check
 * here; the hostile names are {@link HostileNamesTest#NAMES}, the 100-column limit is the
 * project's own Checkstyle rule (.mvn/checkstyle.xml).
 */
class ReadableSourceTest {
  private static final Verifier VERIFIER = Verifier.create().withRandomProbes(200);
  private static final HeaderInfo HEADER = new HeaderInfo("pump-vibration.csv", "ab".repeat(32),
      "--target state --split 0.6,0.2,0.2 --seed 7 --max-depth 8 --min-leaf 1 --impurity gini "
          + "--layout branches --input float --max-method-bytes 8000 --budget 2KiB",
      List.of("train (1800 rows): accuracy 0.9117, balanced accuracy 0.8740, macro-F1 0.8828"));

  @Test
  void noLineIsLongerThanOneHundredColumnsUnderAnyOptions() {
    // A chain 30 splits deep (deeper than any method may nest) over hostile and very long names.
    List<String> names = new ArrayList<>(HostileNamesTest.NAMES.subList(0, 24));
    names.add("Z".repeat(300));
    names.add("a".repeat(60) + " " + "b".repeat(60));
    names.add("\\".repeat(150));
    names.add("\u6e29".repeat(40));
    names.add("long " + "name ".repeat(200));
    DecisionTree tree = chain(names, 30);
    int checked = 0;
    for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
      for (InputKind input : InputKind.values()) {
        for (int flags = 0; flags < 8; flags++) {
          EmitOptions options = EmitOptions.builder("com.example.pump", "PumpStateClassifier")
              .layout(layout).inputKind(input).namedArgs((flags & 1) != 0)
              .probabilities((flags & 2) != 0).bare((flags & 4) != 0).build();
          HeaderInfo header = new HeaderInfo(names.get(names.size() - 1) + ".csv", "ab12",
              "--target " + names.get(names.size() - 3) + " " + HEADER.command(),
              List.of(names.get(0), names.get(1)));
          String source = JavaEmitter.emit(tree, options, header).source();
          for (String line : source.split("\n", -1)) {
            assertThat(line.length()).as("%s: %s", options, line)
                .isLessThanOrEqualTo(SourceLines.MAX_COLUMNS);
          }
          checked++;
        }
      }
    }
    assertThat(checked).isEqualTo(48);
  }

  @Test
  void deepChainOverHostileNamesCompilesAndVerifiesWithNamedArguments() throws Exception {
    DecisionTree tree = chain(HostileNamesTest.NAMES.subList(0, 20), 30);
    for (InputKind input : InputKind.values()) {
      EmitOptions options = EmitOptions.builder("deep", "Chain").inputKind(input)
          .namedArgs(true).build();
      EmittedSource source = JavaEmitter.emit(tree, options, HeaderInfo.none());
      CompiledClasses compiled = VERIFIER.compiler().compileOne(source.qualifiedName(),
          source.source());
      VerificationResult result = VERIFIER.check(tree, compiled, source, options, List.of(), 3);
      assertThat(result.passed()).as(result.verdict()).isTrue();
      // 30 splits deep, at most MethodPlan.MAX_NESTING per method: helper methods were made.
      assertThat(source.source()).contains("private static int node");
    }
  }

  @Test
  void leavesReturnTheNamedClassConstantWithTheSameBytecodeAsTheNumber() throws Exception {
    DecisionTree tree = GoldenTrees.pump();
    String named = JavaEmitter.emit(tree, EmitOptions.builder("p", "C").build(), HEADER)
        .source();
    assertThat(named).contains("return CLASS_NORMAL;").contains("return CLASS_WORN;")
        .doesNotContainPattern("return \\d+;");
    // The same file with the numbers written in: the class files must be equal byte for byte,
    // because a static final int with a constant initializer is a constant variable that javac
    // inlines (JLS §4.12.4, §13.1).
    String numbers = named.replace("return CLASS_NORMAL;", "return 0;")
        .replace("return CLASS_WORN;", "return 1;");
    byte[] withNames = VERIFIER.compiler().compileOne("p.C", named).bytes("p.C");
    byte[] withNumbers = VERIFIER.compiler().compileOne("p.C", numbers).bytes("p.C");
    assertThat(withNames).isEqualTo(withNumbers);

    String bare = JavaEmitter.emit(tree, EmitOptions.builder("p", "C").bare(true).build(),
        HEADER).source();
    assertThat(bare).contains("return 0;").doesNotContain("CLASS_").doesNotContain("FEATURE_");
  }

  @Test
  void oneFeatureIndexConstantPerFeatureUnlessBare() throws Exception {
    String source = JavaEmitter.emit(GoldenTrees.pump(), EmitOptions.builder("p", "C").build(),
        HEADER).source();
    assertThat(source).contains("public static final int FEATURE_RMS_VELOCITY = 0;")
        .contains("public static final int FEATURE_MODE = 1;");
    Class<?> type = VERIFIER.compiler().compileOne("p.C", source).load("p.C");
    assertThat(type.getField("FEATURE_MODE").getInt(null)).isEqualTo(1);
  }

  @Test
  void comparisonsCarryTheFeatureNameAndSetsTheirCategoryNames() {
    String source = JavaEmitter.emit(GoldenTrees.pump(), EmitOptions.builder("p", "C").build(),
        HEADER).source();
    assertThat(source).contains("if (x[0] <= 2.5f) { // rms velocity\n")
        .contains("if (!(x[0] > 7.25f)) { // rms velocity\n")
        .contains("// mode in {auto, service}, or missing\n");
  }

  @Test
  void hostileCategoryNamesStayInsideTheirComment() throws Exception {
    // Each hostile name a category of the set: the comment must hold them as text, not code.
    List<String> categories = HostileNamesTest.NAMES.subList(0, 20);
    Schema schema = new Schema(List.of(Feature.categorical("end */ \\u000a", categories)),
        "y", List.of("a", "b"));
    DecisionTree tree = new DecisionTree(schema, new CategoricalSplit(0,
        CategoricalSplit.CodeSet.of(0, 1, 5, 6, 9, 10, 11), false,
        new Leaf(0, ClassCounts.of(3, 0)), new Leaf(1, ClassCounts.of(0, 3)),
        ClassCounts.of(3, 3)));
    for (InputKind input : InputKind.values()) {
      EmitOptions options = EmitOptions.builder("p", "C").inputKind(input).build();
      EmittedSource source = JavaEmitter.emit(tree, options, HeaderInfo.none());
      // The comment may take several lines; joined, it lists six names and counts the seventh.
      String joined = source.source().replaceAll("\n *// ", " ");
      assertThat(joined).contains(" end *\\/ \\\\u000a in {lone ")
          .contains(", and 1 more}\n");
      CompiledClasses compiled = VERIFIER.compiler().compileOne("p.C", source.source());
      VerificationResult result = VERIFIER.check(tree, compiled, source, options, List.of(), 3);
      assertThat(result.passed()).as(result.verdict()).isTrue();
    }
  }

  @Test
  void classCommentExplainsBothComparisonFormsOnlyWhereTheyAppear() {
    String sentence = "{@code x <= t} sends it to the else branch, {@code !(x > t)} to the if";
    for (InputKind input : InputKind.values()) {
      for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
        String source = JavaEmitter.emit(GoldenTrees.pump(), EmitOptions.builder("p", "C")
            .layout(layout).inputKind(input).build(), HEADER).source();
        boolean expected = layout == Layout.BRANCHES && input != InputKind.INT;
        assertThat(source.replace("\n * ", " ").contains(sentence)).as("%s %s", layout, input)
            .isEqualTo(expected);
      }
    }
  }

  @Test
  void theOptionsLineStandsOnce() {
    String source = JavaEmitter.emit(GoldenTrees.pump(), EmitOptions.builder("p", "C").build(),
        HEADER).source();
    Matcher m = Pattern.compile("Options: ").matcher(source);
    int count = 0;
    while (m.find()) {
      count++;
    }
    assertThat(count).isEqualTo(1);
  }

  @Test
  void paramOfTheArrayMentionsCategoryCodesOnlyWithCategoricalFeatures() {
    String withCategories = JavaEmitter.emit(GoldenTrees.pump(),
        EmitOptions.builder("p", "C").build(), HEADER).source();
    assertThat(withCategories.replace("\n     *    ", ""))
        .contains("categorical features take their code");
    Schema numeric = new Schema(List.of(Feature.numeric("a"), Feature.numeric("b")), "y",
        List.of("n", "w"));
    DecisionTree tree = new DecisionTree(numeric, new NumericSplit(1, 0.5f, false,
        new Leaf(0, ClassCounts.of(2, 0)), new Leaf(1, ClassCounts.of(0, 2)),
        ClassCounts.of(2, 2)));
    for (InputKind input : InputKind.values()) {
      String source = JavaEmitter.emit(tree, EmitOptions.builder("p", "C").inputKind(input)
          .build(), HEADER).source();
      assertThat(source).doesNotContain("categorical").doesNotContain("category");
    }
  }

  /**
   * A chain of {@code depth} splits, each with a leaf on one side, cycling through features
   * named {@code names}: every third feature categorical with the names as its categories.
   */
  private static DecisionTree chain(List<String> names, int depth) {
    List<Feature> features = new ArrayList<>();
    for (int f = 0; f < names.size(); f++) {
      features.add(f % 3 == 1 ? Feature.categorical(names.get(f), names.subList(0, 8))
          : Feature.numeric(names.get(f)));
    }
    Schema schema = new Schema(features, "target", names);
    Node node = new Leaf(0, counts(names.size(), 0));
    for (int d = 0; d < depth; d++) {
      int f = d % names.size();
      Leaf leaf = new Leaf((d + 1) % names.size(), counts(names.size(), (d + 1) % names.size()));
      boolean missingLeft = d % 2 == 0;
      node = features.get(f).isCategorical()
          ? new CategoricalSplit(f, CategoricalSplit.CodeSet.of(0, 3, 7), missingLeft, leaf,
              node, counts(names.size(), 0))
          : new NumericSplit(f, -1.17549435E-38f * (d + 1), missingLeft, node, leaf,
              counts(names.size(), 0));
    }
    return new DecisionTree(schema, node);
  }

  /** One row of class {@code c} among {@code classes}. */
  private static ClassCounts counts(int classes, int c) {
    int[] counts = new int[classes];
    counts[c] = 1;
    return ClassCounts.of(counts);
  }
}
