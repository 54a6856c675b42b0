package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.eval.SplitParts;
import dev.splitwright.model.Classifier;
import dev.splitwright.verify.Verifier;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The search measures chain by chain and leaves out members larger than one already over the
 * budget. Checked against measuring every candidate: the same choice, the same frontier within
 * the budget, and every member left out over the budget; and the premise itself, that compiled
 * sizes never shrink along a chain, on an open data set and on the demo data.
 */
class ChainMeasurerTest {
  private static final EmitOptions EMIT = EmitOptions.builder("demo.chain", "Chained").build();
  private static final List<ModelKind> ALL_KINDS =
      List.of(ModelKind.TREE, ModelKind.FOREST, ModelKind.BOOSTED);
  private static Verifier verifier;

  @BeforeAll
  static void setUp() {
    verifier = Verifier.create();
  }

  @AfterAll
  static void tearDown() {
    verifier.compiler().close();
  }

  private static SplitParts parts(String data) throws InputException {
    // Wisconsin diagnostic breast cancer data (UCI; provenance in the data sets' README), and
    // our own pump demo.
    Dataset rows = data.equals("cancer") ? TestData.load(TestData.cancer()) : TestData.pump();
    return TestData.split(rows);
  }

  private static CandidateSearch.Result search(SplitParts parts, SearchSettings settings)
      throws InputException {
    BudgetSelection.Data data = new BudgetSelection.Data(parts.train(), parts.validation(),
        List.of(parts.train(), parts.validation()), 1);
    return new CandidateSearch(settings, SearchProgress.none()).run(data, HeaderInfo.none(),
        new JavaSearchMeter(settings.unit(), EMIT, verifier, Optional.empty()));
  }

  @ParameterizedTest
  @CsvSource({"pump, 1800", "pump, 2048", "pump, 6000", "cancer, 3500", "cancer, 8192"})
  void makesTheChoiceMeasuringEverythingMakes(String name, int budget) throws InputException {
    SplitParts parts = parts(name);
    SearchSettings.Builder settings = SearchSettings.builder(budget).maxDepth(6).kinds(ALL_KINDS);
    CandidateSearch.Result lazy = search(parts, settings.build());
    CandidateSearch.Result all = search(parts, settings.measureAll(true).build());

    assertThat(all.skipped()).isZero();
    assertThat(lazy.skipped()).isPositive();
    assertThat(lazy.candidates().size()).isLessThan(all.candidates().size());
    Map<Classifier, Candidate> everything = new HashMap<>();
    all.candidates().forEach(c -> everything.put(c.model(), c));
    List<Classifier> measured = new ArrayList<>();
    for (Candidate c : lazy.candidates()) {
      Candidate same = everything.get(c.model());
      assertThat(same).as("measured lazily, so measured by all").isNotNull();
      assertThat(c.sizes()).isEqualTo(same.sizes());
      assertThat(c.score()).isEqualTo(same.score());
      measured.add(c.model());
    }
    for (Candidate c : all.candidates()) {
      if (!measured.contains(c.model())) {
        assertThat(c.size(BudgetUnit.CLASS)).as("left out, so over the budget")
            .isGreaterThan(budget);
      }
    }
    // Indices follow the order of building, which differs; the candidates themselves agree.
    assertThat(lazy.ranked()).extracting(Candidate::model)
        .containsExactlyElementsOf(all.ranked().stream().map(Candidate::model).toList());
    assertThat(withinBudget(lazy.frontier(), budget))
        .containsExactlyElementsOf(withinBudget(all.frontier(), budget));
  }

  private static List<Classifier> withinBudget(List<Candidate> frontier, int budget) {
    return frontier.stream().filter(c -> c.size(BudgetUnit.CLASS) <= budget)
        .map(Candidate::model).toList();
  }

  @ParameterizedTest
  @CsvSource({"cancer", "pump"})
  void compiledSizeNeverShrinksAlongAChain(String name) throws InputException {
    SearchSettings settings = SearchSettings.builder(1 << 20).maxDepth(8).kinds(ALL_KINDS)
        .build();
    CandidateGenerator.Chains chains =
        CandidateGenerator.chains(parts(name).train(), settings, SearchProgress.none());
    List<List<DistinctTree>> members = new ArrayList<>();
    for (CandidateChain chain : chains.chains()) {
      chain.prepare(chain.length() - 1);
      List<DistinctTree> these = new ArrayList<>();
      for (int i = 0; i < chain.length(); i++) {
        chain.member(i).ifPresent(these::add);
      }
      members.add(these);
    }
    List<DistinctTree> distinct = chains.pool().all();
    List<SearchMeter.Measured> sizes =
        new JavaSearchMeter(BudgetUnit.CLASS, EMIT, verifier, Optional.empty())
            .measure(distinct.stream().map(DistinctTree::model).toList(), HeaderInfo.none());

    int links = 0;
    for (List<DistinctTree> chain : members) {
      for (int i = 1; i < chain.size(); i++) {
        int smaller = sizes.get(chain.get(i - 1).index()).sizes().classFileBytes();
        int larger = sizes.get(chain.get(i).index()).sizes().classFileBytes();
        assertThat(larger).as("%s after %s", chain.get(i).recipe().describe(),
            chain.get(i - 1).recipe().describe()).isGreaterThanOrEqualTo(smaller);
        links++;
      }
    }
    assertThat(links).isGreaterThan(100);
  }
}
