package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.DexedClasses;
import dev.splitwright.check.Dexer;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.data.Dataset;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.eval.SplitParts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.verify.Verifier;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class DexMeterTest {
  private static InMemoryCompiler compiler;
  private static List<DistinctTree> candidates;

  @BeforeAll
  static void setUp() throws Exception {
    compiler = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);
    Dataset train = TestData.split(TestData.pump()).train();
    candidates = CandidateGenerator.generate(train, SearchSettings.builder(1000).maxDepth(5)
        .minLeafs(List.of(1, 10)).build(), SearchProgress.none()).trees();
  }

  @AfterAll
  static void tearDown() {
    compiler.close();
  }

  /**
   * Batches are compiled and dexed under aliases of the same length: each DEX size must be what
   * the class dexes to alone under its own name, also for names outside ASCII (DEX strings carry
   * their UTF-16 length before the MUTF-8 bytes).
   */
  @ParameterizedTest(name = "package ''{0}'', class ''{1}''")
  @CsvSource(delimiter = '|', value = {
      "com.example.pump|PumpStateClassifier",
      "|PumpStateClassifier",
      "prüfstand.pumpe|Zustandsprüfer"})
  void batchDexSizesEqualEachClassDexedAloneUnderItsName(String packageName, String className) {
    EmitOptions options = EmitOptions.builder(packageName == null ? "" : packageName, className)
        .build();
    List<EmittedSource> sources = new ArrayList<>();
    for (int i = 0; i < candidates.size(); i += 9) {
      sources.add(JavaEmitter.emit((DecisionTree) candidates.get(i).model(), options,
          HeaderInfo.none()));
    }
    DexMeter dex = DexMeter.forMinApi(24);
    SizeMeter meter = new SizeMeter(compiler, Optional.of(dex));

    List<Sizes> sizes = meter.measure(sources);

    assertThat(dex.d8Runs()).isEqualTo(meter.javacRuns()).isLessThan(sources.size());
    Dexer alone = Dexer.forMinApi(24);
    for (int i = 0; i < sources.size(); i++) {
      EmittedSource source = sources.get(i);
      CompiledClasses classes = meter.compileAlone(source);
      int expected = alone.dex(classes).size(DexedClasses.descriptorOf(source.qualifiedName()));
      assertThat(sizes.get(i).dexBytes()).as("source %d", i).isEqualTo(expected)
          .isEqualTo(sizes.get(i).in(BudgetUnit.DEX));
    }
  }

  @Test
  void withoutADexMeterNoDexSizeIsMade() {
    EmittedSource source = JavaEmitter.emit((DecisionTree) candidates.get(0).model(),
        EmitOptions.builder("p", "C").build(), HeaderInfo.none());
    Sizes sizes = new SizeMeter(compiler).measureAlone(source);
    assertThat(sizes.dexBytes()).isZero();
    assertThatThrownBy(() -> sizes.in(BudgetUnit.DEX)).isInstanceOf(IllegalStateException.class);
  }

  @Test
  void smallestLayoutIsTheSmallerInDexBytesWhenTheBudgetCountsThem() throws Exception {
    // Both layouts of a mid-sized tree, measured in DEX: the search must keep the smaller DEX
    // file, whatever the class files say.
    DistinctTree tree = candidates.get(candidates.size() / 2);
    EmitOptions options = EmitOptions.builder("p", "C").layout(Layout.SMALLEST).build();
    List<EmittedSource> both = CandidateEmitter.of(options)
        .emit((DecisionTree) tree.model(), HeaderInfo.none());
    SizeMeter meter = new SizeMeter(compiler, Optional.of(DexMeter.forMinApi(24)));
    List<Sizes> sizes = meter.measure(both);
    assertThat(both).hasSize(2);
    int smaller = sizes.get(0).dexBytes() <= sizes.get(1).dexBytes() ? 0 : 1;

    SearchSettings settings = SearchSettings.builder(1 << 20).unit(BudgetUnit.DEX).maxDepth(5)
        .minLeafs(List.of(1, 10)).build();
    SplitParts pump = TestData.split(TestData.pump());
    BudgetSelection.Data data = new BudgetSelection.Data(pump.train(), pump.validation(),
        List.of(pump.train()), 1);
    Verifier verifier = Verifier.create();
    BudgetSelection.Outcome<LayoutChoice> outcome;
    try {
      outcome = BudgetSelection.java(settings, options, verifier, SearchProgress.none(),
          Optional.of(DexMeter.forMinApi(24))).run(data, HeaderInfo.none(),
              t -> HeaderInfo.none());
    } finally {
      verifier.compiler().close();
    }
    // The same grid on the same rows gives the same candidates in the same order.
    Candidate same = outcome.candidates().get(tree.index());
    assertThat(same.shape().leaves()).isEqualTo(Shape.of(tree.model()).leaves());
    assertThat(same.layout()).isEqualTo(both.get(smaller).layout());
    assertThat(same.sizes().dexBytes()).isEqualTo(sizes.get(smaller).dexBytes());
  }
}
