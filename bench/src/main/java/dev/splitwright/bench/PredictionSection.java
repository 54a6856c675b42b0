package dev.splitwright.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** The prediction-cost table, its ratios and target checks, in Markdown. */
final class PredictionSection {
  /** Benchmark method and the label of its row, in table order. */
  private static final String[][] FORMS = {
    {"baseline", "baseline: fetch the input row"},
    {"handleBaseline", "baseline: one-line hand-written class via the same handle"},
    {"generatedBranches", "generated class, `branches` layout"},
    {"generatedTable", "generated class, `table` layout"},
    {"generatedFlat", "generated class, `flat` layout"},
    {"generatedBranchesBlock", "`branches`, blocks of " + PredictionBenchmark.BLOCK
        + " rows: a loop of `classify`"},
    {"generatedFlatBlock", "`flat`, blocks of " + PredictionBenchmark.BLOCK
        + " rows: `classifyAll`"},
    {"inMemoryModel", "Splitwright in-memory model (`DecisionTree.predict`)"},
    {"wekaJ48", "Weka J48 `classifyInstance` (defaults, no depth limit)"},
    {"wekaRepTree", "Weka REPTree `classifyInstance` (`-L` = depth)"},
  };

  private final List<BenchResult> results;
  private final List<String[]> columns = new ArrayList<>();

  PredictionSection(List<BenchResult> all) {
    this.results = all.stream()
        .filter(r -> r.benchmarkClass().equals("PredictionBenchmark")).toList();
    for (BenchModel model : BenchModel.values()) {
      for (InputOrder order : InputOrder.values()) {
        columns.add(new String[] {model.paramName(), order.paramName()});
      }
    }
  }

  boolean isEmpty() {
    return results.isEmpty();
  }

  String render() {
    StringBuilder md = new StringBuilder();
    md.append("## Prediction cost (ns per prediction: mean of the measured iterations, and"
        + " their range)\n\n");
    md.append(header("form"));
    for (String[] form : FORMS) {
      md.append("| ").append(form[1]);
      for (String[] column : columns) {
        md.append(" | ").append(find(form[0], column)
            .map(r -> Cells.withRange(r.primary().score(), r.primary().min(),
                r.primary().max()))
            .orElse(Cells.NONE));
      }
      md.append(" |\n");
    }
    md.append("\n").append(BenchModel.INPUT_ROWS).append(" distinct fresh input rows per cell;"
        + " \"timeOrdered\" sweeps between consecutive readings in ")
        .append(InputOrder.STEPS_PER_READING).append(" steps. Depth: pump ")
        .append(BenchModel.PUMP.depth()).append(", synthetic ").append(BenchModel.SYNTHETIC.depth())
        .append(", synthetic10 ").append(BenchModel.SYNTHETIC_10.depth())
        .append(". — = not measured (for `table` or `flat`: the emitter of this build lacks that"
            + " layout).")
        .append("\n\n");

    md.append("### Ratios (other form's time / generated `branches` time; higher = generated"
        + " faster)\n\n");
    md.append(header("ratio"));
    ratioRow(md, "Weka J48 / branches", "wekaJ48");
    ratioRow(md, "Weka REPTree / branches", "wekaRepTree");
    ratioRow(md, "in-memory model / branches", "inMemoryModel");
    ratioRow(md, "`table` / branches", "generatedTable");
    ratioRow(md, "`flat` / branches", "generatedFlat");
    ratioRow(md, "`flat` `classifyAll` / `branches` loop, blocks", "generatedFlatBlock",
        "generatedBranchesBlock");
    md.append("\n### Prediction targets\n\n");
    md.append("| target");
    for (BenchModel model : BenchModel.values()) {
      md.append(" | ").append(model.paramName());
    }
    md.append(" |\n|---").append("|---".repeat(BenchModel.values().length)).append("|\n");
    target(md, "branches ≥ 10× faster than the faster Weka tree, time-ordered", "timeOrdered",
        "weka", 10, true);
    target(md, "branches ≥ 2× faster than the faster Weka tree, shuffled", "shuffled", "weka", 2,
        true);
    target(md, "branches ≥ 1.5× faster than the in-memory model, shuffled", "shuffled",
        "inMemoryModel", 1.5, true);
    target(md, "`table` ≤ 2× the branches time, shuffled", "shuffled", "generatedTable", 2, false);
    target(md, "`flat` ≤ 0.6× the branches time, shuffled (the depth-14 target)", "shuffled",
        "generatedFlat", 0.6, false);
    target(md, "`flat` ≤ 0.8× the branches time, shuffled (the pump target)", "shuffled",
        "generatedFlat", 0.8, false);
    target(md, "`flat` ≤ 1.5× the branches time, time-ordered", "timeOrdered", "generatedFlat",
        1.5, false);
    target(md, "blocks: `classifyAll` ≤ 0.6× the `branches` loop, shuffled", "shuffled",
        "generatedFlatBlock", "generatedBranchesBlock", 0.6);
    target(md, "blocks: `classifyAll` ≤ 0.8× the `branches` loop, shuffled", "shuffled",
        "generatedFlatBlock", "generatedBranchesBlock", 0.8);
    target(md, "blocks: `classifyAll` ≤ 1.5× the `branches` loop, time-ordered", "timeOrdered",
        "generatedFlatBlock", "generatedBranchesBlock", 1.5);
    return md.toString();
  }

  private String header(String first) {
    StringBuilder md = new StringBuilder("| ").append(first);
    for (String[] column : columns) {
      md.append(" | ").append(column[0]).append(", ").append(column[1]);
    }
    md.append(" |\n|---");
    md.append("|---:".repeat(columns.size()));
    return md.append("|\n").toString();
  }

  private void ratioRow(StringBuilder md, String label, String method) {
    ratioRow(md, label, method, "generatedBranches");
  }

  private void ratioRow(StringBuilder md, String label, String method, String against) {
    md.append("| ").append(label);
    for (String[] column : columns) {
      md.append(" | ").append(Cells.ratio(ratio(method, against, column[0], column[1])));
    }
    md.append(" |\n");
  }

  /** A target on {@code method}'s time over {@code against}'s, at most {@code goal}. */
  private void target(StringBuilder md, String label, String order, String method,
      String against, double goal) {
    md.append("| ").append(label);
    for (BenchModel model : BenchModel.values()) {
      double value = ratio(method, against, model.paramName(), order);
      md.append(" | ").append(Cells.ratio(value)).append(" ")
          .append(Cells.verdict(value, goal, false));
    }
    md.append(" |\n");
  }

  private void target(StringBuilder md, String label, String order, String method, double goal,
      boolean atLeast) {
    md.append("| ").append(label);
    for (BenchModel model : BenchModel.values()) {
      double value = method.equals("weka")
          ? Math.min(ratio("wekaJ48", model.paramName(), order),
              ratio("wekaRepTree", model.paramName(), order))
          : ratio(method, model.paramName(), order);
      md.append(" | ").append(Cells.ratio(value)).append(" ")
          .append(Cells.verdict(value, goal, atLeast));
    }
    md.append(" |\n");
  }

  /** Time of {@code method} divided by the branches time, or NaN if either is missing. */
  double ratio(String method, String model, String order) {
    return ratio(method, "generatedBranches", model, order);
  }

  /** Time of {@code method} divided by {@code against}'s, or NaN if either is missing. */
  double ratio(String method, String against, String model, String order) {
    String[] column = {model, order};
    Optional<BenchResult> other = find(method, column);
    Optional<BenchResult> base = find(against, column);
    if (other.isEmpty() || base.isEmpty()) {
      return Double.NaN;
    }
    return other.get().primary().score() / base.get().primary().score();
  }

  private Optional<BenchResult> find(String method, String[] column) {
    return results.stream()
        .filter(r -> r.matches(method, "model", column[0], "order", column[1]))
        .findFirst();
  }
}
