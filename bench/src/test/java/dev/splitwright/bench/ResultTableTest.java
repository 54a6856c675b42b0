package dev.splitwright.bench;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;

/** Ratios and verdicts below are worked by hand from the numbers in the JSON. */
class ResultTableTest {
  private static final String PREFIX = "dev.splitwright.bench.";
  private static final MachineInfo MACHINE = new MachineInfo("Test CPU", 2, 4096, "0.1 0.2 0.3");

  private static String prediction(String method, String model, String order, double ns) {
    return prediction(method, model, order, ns, ns, ns);
  }

  /** One fork whose three iterations took {@code low}, {@code mean} and {@code high}. */
  private static String prediction(String method, String model, String order, double mean,
      double low, double high) {
    return String.format(Locale.ROOT, """
        {"benchmark": "%sPredictionBenchmark.%s", "forks": 1, "jdkVersion": "17.0.15",
         "vmName": "OpenJDK 64-Bit Server VM", "vmVersion": "17.0.15+6",
         "params": {"model": "%s", "order": "%s"},
         "primaryMetric": {"score": %s, "scoreError": "NaN", "scoreUnit": "ns/op",
                           "rawData": [[%s, %s, %s]]},
         "secondaryMetrics": {}}
        """, PREFIX, method, model, order, mean, low, mean, high);
  }

  private static String forest(String method, String order, double ns) {
    return String.format(Locale.ROOT, """
        {"benchmark": "%sEnsembleBenchmark.%s", "forks": 1, "jdkVersion": "17.0.15",
         "vmName": "OpenJDK 64-Bit Server VM", "vmVersion": "17.0.15+6",
         "params": {"order": "%s"},
         "primaryMetric": {"score": %s, "scoreError": "NaN", "scoreUnit": "ns/op",
                           "rawData": [[%s, %s, %s]]},
         "secondaryMetrics": {}}
        """, PREFIX, method, order, ns, ns, ns, ns);
  }

  private static String training(String method, String params, String rawMs, String heapMib) {
    return String.format(Locale.ROOT, """
        {"benchmark": "%sTrainingBenchmark.%s", "forks": 3, "jdkVersion": "17.0.15",
         "vmName": "OpenJDK 64-Bit Server VM", "vmVersion": "17.0.15+6",
         "params": {%s},
         "primaryMetric": {"score": 0, "scoreError": "NaN", "scoreUnit": "ms/op",
                           "rawData": %s},
         "secondaryMetrics": {"heap.peak": {"score": 0, "scoreError": "NaN", "scoreUnit": "MiB",
                                            "rawData": %s}}}
        """, PREFIX, method, params, rawMs, heapMib);
  }

  private static List<BenchResult> results() throws Exception {
    String json = "[" + String.join(",",
        prediction("generatedBranches", "pump", "shuffled", 40, 36, 44),
        prediction("wekaJ48", "pump", "shuffled", 600),
        prediction("wekaRepTree", "pump", "shuffled", 100),
        prediction("inMemoryModel", "pump", "shuffled", 80),
        prediction("generatedBranches", "pump", "timeOrdered", 8),
        prediction("wekaJ48", "pump", "timeOrdered", 400),
        prediction("wekaRepTree", "pump", "timeOrdered", 60),
        training("splitwright", "\"depth\": \"14\"", "[[2000], [1000], [3000]]",
            "[[90], [100], [95]]"),
        training("wekaRepTree", "\"depth\": \"14\"", "[[30000]]", "[[700]]"),
        training("splitwrightLarge", "", "[[12000], [9000], [11000], [10000]]",
            "[[500], [524], [510], [600]]"),
        prediction("generatedBranchesBlock", "pump", "shuffled", 30),
        prediction("generatedFlatBlock", "pump", "shuffled", 21),
        forest("forestBranches", "shuffled", 80),
        forest("forestFlat", "shuffled", 120),
        forest("forestBranches", "timeOrdered", 50)) + "]";
    return BenchResult.allOf(new ObjectMapper().readTree(json));
  }

  private static String render() throws Exception {
    return ResultTable.render(results(), "quick", "2026-12-02 01:00 UTC", MACHINE, "1.0 1.0 1.0",
        "test settings", "## The trees compared\n");
  }

  @Test
  void mediansTakeTheMiddleValueOrTheMeanOfTheMiddleTwo() throws Exception {
    List<BenchResult> results = results();
    assertThat(results.get(7).primary().median()).isEqualTo(2000);
    assertThat(results.get(9).primary().median()).isEqualTo(10500);
    assertThat(results.get(9).secondary("heap.peak").orElseThrow().median()).isEqualTo(517);
  }

  @Test
  void headerNamesMachineJdkDateAndLoad() throws Exception {
    assertThat(render())
        .startsWith("# Splitwright benchmarks: quick profile\n\n- Date: 2026-12-02 01:00 UTC\n")
        .contains("- Machine: Test CPU, 2 logical cores, 4096 MiB RAM;")
        .contains("at start: 1.0 1.0 1.0; at end: 0.1 0.2 0.3")
        .contains("- JDK: OpenJDK 64-Bit Server VM 17.0.15+6; JMH 1.37; Weka 3.8.6")
        .contains("- Settings: test settings")
        .endsWith("## The trees compared\n");
  }

  @Test
  void predictionRatiosDivideByTheBranchesTime() throws Exception {
    // 600 / 40 = 15; 100 / 40 = 2.5; 80 / 40 = 2; 400 / 8 = 50; 60 / 8 = 7.5.
    assertThat(render())
        .contains("| Weka J48 / branches | 15.0× | 50.0× | — | — |")
        .contains("| Weka REPTree / branches | 2.50× | 7.50× | — | — |")
        .contains("| in-memory model / branches | 2.00× | — | — | — |")
        .contains("| generated class, `table` layout | — | — | — | — |")
        .contains("| generated class, `branches` layout | 40.0 (36.0–44.0) | 8.00 | — | — |");
  }

  @Test
  void blockRatiosDivideByTheBranchesLoopNotTheOneRowCall() throws Exception {
    // 21 / 30 = 0.7: over 0.6 by 0.1 / 0.6 = 17%, within 0.8.
    assertThat(render())
        .contains("| `flat` `classifyAll` / `branches` loop, blocks | 0.70× | — | — | — |")
        .contains("| blocks: `classifyAll` ≤ 0.6× the `branches` loop, shuffled"
            + " | 0.70× **missed by 17%** | — not measured |")
        .contains("| blocks: `classifyAll` ≤ 0.8× the `branches` loop, shuffled"
            + " | 0.70× met | — not measured |");
  }

  @Test
  void forestRowsDivideByTheBranchesForestInTheSameOrder() throws Exception {
    // 120 / 80 = 1.5; nothing measured for table, nor for flat in time order.
    assertThat(render())
        .contains("## Forest prediction cost")
        .contains("| `branches` | 80.0 | 50.0 | 1.00× | 1.00× |")
        .contains("| `table` | — | — | — | — |")
        .contains("| `flat` | 120 | — | 1.50× | — |");
    // The one-tree table does not take the forest's rows.
    assertThat(render()).contains("| generated class, `flat` layout | — | — | — | — |");
  }

  @Test
  void targetsAreCheckedAgainstTheFasterWekaTree() throws Exception {
    // Time-ordered: min(50, 7.5) = 7.5 against 10, short by 2.5 / 10 = 25%.
    assertThat(render())
        .contains("| branches ≥ 10× faster than the faster Weka tree, time-ordered"
            + " | 7.50× **missed by 25%** | — not measured |")
        .contains("| branches ≥ 2× faster than the faster Weka tree, shuffled"
            + " | 2.50× met | — not measured |");
  }

  @Test
  void trainingRowsShowMedianEachRunAndPeakHeap() throws Exception {
    // Large: runs 12, 9, 11, 10 s have median (10 + 11) / 2 = 10.5 s, over 2.5 s by 320%.
    assertThat(render())
        .contains("| Splitwright CART | 200000 × 16 | 14 | 3 | 2.00 | 2.00, 1.00, 3.00 | 95.0 "
            + "| — |")
        .contains("| Weka REPTree / Splitwright, depth 14 | 15.0× | ≥ 10×: met |")
        .contains("| 1,000,000 × 20 at depth 10, wall time | 10.5 s | ≤ 2.5 s: "
            + "**missed by 320%** |")
        .contains("| 1,000,000 × 20 at depth 10, peak heap | 517 MiB | ≤ 400 MiB: "
            + "**missed by 29%** |");
  }
}
