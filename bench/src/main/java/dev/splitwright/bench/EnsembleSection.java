package dev.splitwright.bench;

import java.util.List;
import java.util.Optional;

/** The forest's prediction-cost table and its ratios to {@code branches}, in Markdown. */
final class EnsembleSection {
  /** Benchmark method and the label of its row, in table order. */
  private static final String[][] FORMS = {
    {"forestBranches", "`branches`"},
    {"forestTable", "`table`"},
    {"forestFlat", "`flat`"},
  };

  private final List<BenchResult> results;

  EnsembleSection(List<BenchResult> all) {
    this.results = all.stream()
        .filter(r -> r.benchmarkClass().equals("EnsembleBenchmark")).toList();
  }

  boolean isEmpty() {
    return results.isEmpty();
  }

  String render() {
    StringBuilder md = new StringBuilder();
    md.append("## Forest prediction cost (ns per prediction: mean of the measured iterations,"
        + " and their range)\n\n");
    md.append("A voting forest of ").append(EnsembleBenchmark.TREES)
        .append(" trees (seed ").append(EnsembleBenchmark.SEED).append(", depth at most ")
        .append(BenchModel.PUMP.depth()).append(") on the pump demo, on the pump rows above.\n\n");
    md.append("| generated class");
    for (InputOrder order : InputOrder.values()) {
      md.append(" | pump forest, ").append(order.paramName());
    }
    md.append(" | / `branches`, ").append(InputOrder.SHUFFLED.paramName())
        .append(" | / `branches`, ").append(InputOrder.TIME_ORDERED.paramName()).append(" |\n|---");
    md.append("|---:".repeat(2 * InputOrder.values().length)).append("|\n");
    for (String[] form : FORMS) {
      md.append("| ").append(form[1]);
      for (InputOrder order : InputOrder.values()) {
        md.append(" | ").append(find(form[0], order)
            .map(r -> Cells.withRange(r.primary().score(), r.primary().min(),
                r.primary().max()))
            .orElse(Cells.NONE));
      }
      for (InputOrder order : InputOrder.values()) {
        md.append(" | ").append(Cells.ratio(ratio(form[0], order)));
      }
      md.append(" |\n");
    }
    return md.toString();
  }

  /** Time of {@code method} divided by the branches forest's, or NaN if either is missing. */
  double ratio(String method, InputOrder order) {
    Optional<BenchResult> other = find(method, order);
    Optional<BenchResult> base = find("forestBranches", order);
    if (other.isEmpty() || base.isEmpty()) {
      return Double.NaN;
    }
    return other.get().primary().score() / base.get().primary().score();
  }

  private Optional<BenchResult> find(String method, InputOrder order) {
    return results.stream().filter(r -> r.matches(method, "order", order.paramName())).findFirst();
  }
}
