package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.eval.Metric;
import dev.splitwright.eval.SplitParts;
import dev.splitwright.train.OpenDataSets;
import dev.splitwright.verify.Verifier;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;

/**
 * The README's table of what ensembles buy: for each shared open data set and both demo scenarios,
 * at 2, 8, 32 and 128 KiB of class file, the best single tree against the best candidate of any
 * kind, each with its validation and test balanced accuracy, kind and size; emitted with {@code
 * --bare}, so sizes are the classifier's own (the label and feature tables of a 30-feature data
 * set alone pass 2 KiB). A measurement, not part of the normal build: run with {@code
 * -Dselect.measure=true}.
 */
class KindsMeasurement {
  private static final List<Integer> KIB = List.of(2, 8, 32, 128);

  @Test
  void measure() throws Exception {
    assumeTrue(Boolean.getBoolean("select.measure"), "run with -Dselect.measure=true");
    StringBuilder table = new StringBuilder("| data | budget | single tree: val / test, size | "
        + "any kind: val / test, kind, size | search s |\n|---|---|---|---|---|\n");
    Verifier verifier = Verifier.create();
    try {
      for (String name : List.of("breast", "pima", "votes", "credit", "pump", "gesture")) {
        Dataset data = load(name);
        SplitParts parts = TestData.split(data);
        BudgetSelection.Data rows = new BudgetSelection.Data(parts.train(), parts.validation(),
            List.of(parts.train(), parts.validation(), parts.test()), 1);
        for (int kib : KIB) {
          String[] cells = new String[2];
          double seconds = 0;
          int column = 0;
          for (List<ModelKind> kinds : List.of(List.of(ModelKind.TREE),
              List.of(ModelKind.values()))) {
            SearchSettings settings = SearchSettings.builder(kib * 1024).kinds(kinds).build();
            BudgetSelection.Outcome<LayoutChoice> outcome = BudgetSelection.java(settings,
                EmitOptions.builder("m", "M").bare(true).build(), verifier, SearchProgress.none())
                .run(rows, HeaderInfo.none(), m -> HeaderInfo.none());
            assertThat(outcome.verification().passed()).as(outcome.verification().verdict())
                .isTrue();
            double test = Evaluator.score(outcome.model(), parts.test())
                .get(Metric.BALANCED_ACCURACY);
            SelectionReport.Chosen c = outcome.report().chosen();
            String kind = c.trees() == 1 ? "tree d" + c.depth()
                : c.kind() + " " + c.trees() + "x d" + c.maxDepth();
            cells[column++] = String.format(Locale.ROOT, "%.3f / %.3f, %s%s B",
                c.score(), test, column == 2 ? kind + ", " : "", c.size());
            seconds = outcome.stats().seconds();
          }
          table.append(String.format(Locale.ROOT, "| %s | %d KiB | %s | %s | %.1f |%n", name, kib,
              cells[0], cells[1], seconds));
        }
      }
    } finally {
      verifier.compiler().close();
    }
    System.out.println(table);
  }

  private static Dataset load(String name) throws Exception {
    return switch (name) {
      case "pump" -> TestData.pump();
      case "gesture" -> CsvLoader.load(DemoFiles.of("gesture-band"),
          LoadOptions.builder().target("gesture").build()).dataset();
      default -> OpenDataSets.load(name);
    };
  }
}
