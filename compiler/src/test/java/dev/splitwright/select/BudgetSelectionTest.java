package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import dev.splitwright.check.ClassFileInfo;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.eval.Fold;
import dev.splitwright.eval.Metric;
import dev.splitwright.eval.SplitParts;
import dev.splitwright.eval.StratifiedSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.report.ReportJson;
import dev.splitwright.train.BoostingOptions;
import dev.splitwright.train.BoostingTrainer;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.ClassWeights;
import dev.splitwright.train.ForestOptions;
import dev.splitwright.train.ForestTrainer;
import dev.splitwright.train.PruningPath;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.Verifier;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

class BudgetSelectionTest {
  private static final EmitOptions EMIT = EmitOptions.builder("demo.budget", "Pump").build();
  private static Verifier verifier;
  private static SplitParts pump;
  private static BudgetSelection.Data data;

  @BeforeAll
  static void setUp() throws InputException {
    verifier = Verifier.create();
    pump = TestData.split(TestData.pump());
    data = new BudgetSelection.Data(pump.train(), pump.validation(),
        List.of(pump.train(), pump.validation(), pump.test()), 1);
  }

  @AfterAll
  static void tearDown() {
    verifier.compiler().close();
  }

  private static BudgetSelection<LayoutChoice> selection(SearchSettings settings) {
    return BudgetSelection.java(settings, EMIT, verifier, SearchProgress.none());
  }

  private static CandidateSearch.Result search(SearchSettings settings) throws InputException {
    return new CandidateSearch(settings, SearchProgress.none()).run(data, HeaderInfo.none(),
        new JavaSearchMeter(settings.unit(), EMIT, verifier, Optional.empty()));
  }

  private static BudgetSelection.Outcome<LayoutChoice> run(SearchSettings settings)
      throws InputException {
    return selection(settings).run(data, HeaderInfo.none(), tree -> HeaderInfo.none());
  }

  @Test
  void frontierHasNoDominatedCandidateAndHoldsTheChoice() throws InputException {
    SearchSettings settings = SearchSettings.builder(1700).maxDepth(6).build();
    CandidateSearch.Result search = search(settings);

    for (Candidate p : search.frontier()) {
      for (Candidate q : search.candidates()) {
        boolean dominates = q.size(settings.unit()) <= p.size(settings.unit())
            && q.score() >= p.score()
            && (q.size(settings.unit()) < p.size(settings.unit()) || q.score() > p.score());
        assertThat(dominates).as("%s dominates %s", q.recipe(), p.recipe()).isFalse();
      }
    }
    Candidate chosen = search.ranked().get(0);
    assertThat(search.frontier()).contains(chosen);
    assertThat(chosen.size(settings.unit())).isLessThanOrEqualTo(1700);
    for (Candidate c : search.candidates()) {
      // Scores are the candidate's own validation score.
      assertThat(c.score()).isEqualTo(
          Evaluator.score(c.model(), pump.validation()).get(Metric.BALANCED_ACCURACY));
      if (c.size(settings.unit()) <= 1700) {
        assertThat(c.score()).isLessThanOrEqualTo(chosen.score());
      }
    }
  }

  @Test
  void emitsTheChosenCandidateAsMeasured() throws InputException {
    BudgetSelection.Outcome<LayoutChoice> outcome = run(SearchSettings.builder(2048).build());

    assertThat(outcome.verification().passed()).isTrue();
    SelectionReport.Chosen chosen = outcome.report().chosen();
    assertThat(chosen.size()).isLessThanOrEqualTo(2048)
        .isEqualTo(outcome.verification().classFileBytes());
    assertThat(chosen.leaves()).isEqualTo(((DecisionTree) outcome.model()).leafCount());
    assertThat(outcome.report().frontier()).filteredOn(SelectionReport.Point::chosen)
        .singleElement()
        .satisfies(p -> assertThat(p.size()).isEqualTo(chosen.size()));
    assertThat(outcome.report().fallbacks()).isEmpty();
    assertThat(outcome.stats().distinctTrees()).isEqualTo(outcome.report().distinctTrees());
    // A few rounds of one batch each (two halves on two cores), then one for the emitted file:
    // far fewer runs than candidates.
    assertThat(outcome.stats().compilerRuns()).isBetween(2, 2 * 4 + 1)
        .isLessThan(outcome.stats().distinctTrees() / 2);
  }

  @Test
  void sameInputsGiveByteIdenticalReportAndChart() throws InputException {
    SearchSettings settings = SearchSettings.builder(1800).maxDepth(5).build();
    BudgetSelection.Outcome<LayoutChoice> first = run(settings);
    BudgetSelection.Outcome<LayoutChoice> second = run(settings);

    assertThat(ReportJson.render(second.report())).isEqualTo(ReportJson.render(first.report()));
    assertThat(second.candidates()).isEqualTo(first.candidates());
    assertThat(second.frontier()).isEqualTo(first.frontier());
    assertThat(second.emitted().source()).isEqualTo(first.emitted().source());
  }

  @Test
  void countsBytecodeAndSourceUnits() throws Exception {
    for (BudgetUnit unit : List.of(BudgetUnit.BYTECODE, BudgetUnit.SOURCE)) {
      int budget = unit == BudgetUnit.BYTECODE ? 300 : 6000;
      BudgetSelection.Outcome<LayoutChoice> outcome =
          run(SearchSettings.builder(budget).unit(unit).maxDepth(6).build());

      EmittedSource source = outcome.emitted().source();
      CompiledClasses classes = verifier.compiler()
          .compileOne(source.qualifiedName(), source.source());
      int measured = unit == BudgetUnit.BYTECODE
          ? ClassFileInfo.parse(classes.bytes(source.qualifiedName())).totalCodeLength()
          : source.source().getBytes(StandardCharsets.UTF_8).length;
      assertThat(measured).as("%s", unit).isLessThanOrEqualTo(budget)
          .isEqualTo(outcome.report().chosen().size());
      assertThat(outcome.report().budgetUnit()).isEqualTo(unit.optionName());
    }
  }

  @Test
  void crossValidationScoresEachSettingRefittedPerFold() throws InputException {
    SearchSettings settings = SearchSettings.builder(1700).maxDepth(4).minLeafs(List.of(1, 10))
        .folds(4).seed(3).build();
    CandidateSearch.Result search = search(settings);

    // Recomputed directly: for each fold, grow with the recipe's limits on the fold's training
    // rows, prune at the geometric mean of its alpha interval, score the held-out rows; average.
    Dataset pool = pump.train().concat(pump.validation());
    List<Fold> folds = StratifiedSplit.kFold(pool, 4, 3);
    for (Candidate c : search.candidates()) {
      double sum = 0;
      for (Fold fold : folds) {
        Dataset train = fold.train();
        DecisionTree grown = CartTrainer.train(train, TrainingOptions.builder()
            .maxDepth(c.recipe().maxDepth()).minLeaf(c.recipe().minLeaf()).build());
        DecisionTree pruned = PruningPath.prune(grown, ClassWeights.none().resolve(train),
            c.recipe().representativeAlpha());
        sum += Evaluator.score(pruned, fold.validation()).balancedAccuracy();
      }
      assertThat(c.score()).as("%s", c.recipe()).isCloseTo(sum / 4, within(1e-12));
    }
  }

  @Test
  void ensemblesAreCrossValidatedByRetrainingTheirRecipeOnEachFold() throws InputException {
    SearchSettings settings = SearchSettings.builder(6000).maxDepth(2).minLeafs(List.of(5))
        .folds(3).seed(4).kinds(List.of(ModelKind.FOREST, ModelKind.BOOSTED))
        .ensembleSizes(List.of(2, 4)).build();
    CandidateSearch.Result search = search(settings);

    // Recomputed directly with the trainers: each recipe trained on the fold's training rows with
    // the search's seed, scored on the held-out rows, averaged over the folds.
    Dataset pool = pump.train().concat(pump.validation());
    List<Fold> folds = StratifiedSplit.kFold(pool, 3, 4);
    assertThat(search.candidates()).isNotEmpty()
        .allMatch(c -> c.recipe().kind() != ModelKind.TREE);
    for (Candidate c : search.candidates()) {
      double sum = 0;
      for (Fold fold : folds) {
        TrainingOptions tree = TrainingOptions.builder().maxDepth(c.recipe().maxDepth())
            .minLeaf(5).build();
        TreeEnsemble e = c.recipe().kind() == ModelKind.FOREST
            ? ForestTrainer.train(fold.train(), ForestOptions.of(c.recipe().trees(), 4, tree))
            : BoostingTrainer.train(fold.train(),
                new BoostingOptions(c.recipe().trees(), 4, tree));
        sum += Evaluator.score(e, fold.validation()).balancedAccuracy();
      }
      assertThat(c.score()).as("%s", c.recipe()).isCloseTo(sum / 3, within(1e-12));
      assertThat(c.shape().trees()).isEqualTo(c.recipe().trees());
    }
  }

  @Test
  void theChoiceAmongAllKindsIsNeverBelowTheBestTreeOnValidation() throws InputException {
    SearchSettings trees = SearchSettings.builder(8192).maxDepth(4).build();
    SearchSettings all = SearchSettings.builder(8192).maxDepth(4)
        .kinds(List.of(ModelKind.values())).build();
    BudgetSelection.Outcome<LayoutChoice> tree = run(trees);
    BudgetSelection.Outcome<LayoutChoice> any = run(all);

    assertThat(any.verification().passed()).isTrue();
    assertThat(any.report().chosen().size()).isLessThanOrEqualTo(8192);
    assertThat(any.report().chosen().score()).isGreaterThanOrEqualTo(
        tree.report().chosen().score());
    assertThat(any.candidates()).extracting(c -> c.recipe().kind()).contains(ModelKind.FOREST,
        ModelKind.BOOSTED, ModelKind.TREE);
    assertThat(any.report().kinds()).containsExactly("tree", "forest", "boosted");
  }

  @Test
  void refitOnTrainAndValidationStaysWithinTheBudget() throws InputException {
    SearchSettings probe = SearchSettings.builder(4096).maxDepth(6).build();
    List<Integer> budgets = new ArrayList<>();
    for (Candidate c : search(probe).frontier()) {
      budgets.add(c.size(BudgetUnit.CLASS));
    }
    int fallbacks = 0;
    Dataset all = pump.train().concat(pump.validation());
    for (int budget : budgets.subList(Math.max(0, budgets.size() - 4), budgets.size())) {
      SearchSettings settings =
          SearchSettings.builder(budget).maxDepth(6).refitAll(true).build();
      BudgetSelection.Outcome<LayoutChoice> outcome = run(settings);
      SelectionReport.Chosen chosen = outcome.report().chosen();

      assertThat(outcome.report().refitOn()).isEqualTo("train+validation");
      assertThat(chosen.size()).as("budget %d", budget).isLessThanOrEqualTo(budget);
      // The emitted tree is on the pruning path of the chosen limits grown on all those rows.
      DecisionTree grown = CartTrainer.train(all, TrainingOptions.builder()
          .maxDepth(chosen.maxDepth()).minLeaf(chosen.minLeaf()).build());
      assertThat(PruningPath.of(grown, ClassWeights.none()))
          .extracting(dev.splitwright.train.PrunedTree::tree)
          .contains((DecisionTree) outcome.model());
      for (String line : outcome.report().fallbacks()) {
        assertThat(line).contains("after refitting on train+validation, over the budget");
      }
      fallbacks += outcome.report().fallbacks().size();
    }
    // The frontier's sizes are exact budgets, so a refit that grows must fall back at least once.
    assertThat(fallbacks).isPositive();
  }

  @Test
  void tooSmallBudgetNamesTheLeastThatFits() {
    List<SearchStats> finished = new ArrayList<>();
    SearchProgress recorder = new SearchProgress() {
      @Override
      public void update(String stage, int done, int total) {}

      @Override
      public void finished(SearchStats stats) {
        finished.add(stats);
      }
    };
    BudgetSelection<LayoutChoice> selection = BudgetSelection.java(
        SearchSettings.builder(1000).maxDepth(3).build(), EMIT, verifier, recorder);
    assertThatThrownBy(() -> selection.run(data, HeaderInfo.none(), tree -> HeaderInfo.none()))
        .isInstanceOf(InputException.class)
        .hasMessageMatching("option --budget: 1000 bytes is too small: the smallest classifier "
            + "for this data \\(1 leaf\\) has a class file size of \\d+ bytes; (add --bare \\(no "
            + "label and feature tables\\), which makes this classifier \\d+ bytes; or )?give "
            + "--budget \\d+ or more(, or \\d+ or more with --bare \\(no label and feature "
            + "tables\\))?");
    // A progress bar must be cleared before the error is printed.
    assertThat(finished).hasSize(1);
  }

  @Test
  void needsValidationRowsWithoutFolds() {
    BudgetSelection.Data noValidation = new BudgetSelection.Data(pump.train(),
        pump.validation().subset(new int[0]), List.of(pump.train()), 1);
    assertThatThrownBy(() -> selection(SearchSettings.builder(4096).build())
        .run(noValidation, HeaderInfo.none(), tree -> HeaderInfo.none()))
        .isInstanceOf(InputException.class)
        .hasMessage("option --budget: the split leaves no validation rows to choose a candidate "
            + "by; give --split a validation fraction, e.g. 0.6,0.2,0.2, or use --folds");
  }

  @Test
  void reportsProgressOfEveryStage() throws InputException {
    List<String> events = new ArrayList<>();
    SearchProgress recorder = new SearchProgress() {
      @Override
      public void update(String stage, int done, int total) {
        assertThat(done).isBetween(0, total);
        if (done == total) {
          events.add(stage + " " + total);
        }
      }

      @Override
      public void finished(SearchStats stats) {
        events.add("finished " + stats.distinctTrees());
      }
    };
    BudgetSelection.Outcome<LayoutChoice> outcome = BudgetSelection.java(
        SearchSettings.builder(2048).maxDepth(4).build(), EMIT, verifier, recorder)
        .run(data, HeaderInfo.none(), tree -> HeaderInfo.none());

    // Measuring goes in rounds, each ending with all it took on measured.
    int distinct = outcome.stats().distinctTrees();
    assertThat(events).startsWith("growing 20").endsWith("measuring " + distinct,
        "finished " + distinct);
    assertThat(events.subList(1, events.size() - 1)).allMatch(e -> e.startsWith("measuring "));
  }
}
