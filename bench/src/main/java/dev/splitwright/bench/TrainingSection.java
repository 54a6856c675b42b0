package dev.splitwright.bench;

import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.TreeSet;
import java.util.stream.Collectors;

/** The training-cost table, its ratios and target checks, in Markdown. */
final class TrainingSection {
  private static final double MS_PER_S = 1000;
  /** Issue 17's targets for the large set (issue 6's were 10 s and 2 GiB). */
  private static final double LARGE_SECONDS_TARGET = 2.5;
  private static final double LARGE_HEAP_MIB_TARGET = 400;

  private final List<BenchResult> results;

  TrainingSection(List<BenchResult> all) {
    this.results = all.stream()
        .filter(r -> r.benchmarkClass().equals("TrainingBenchmark")).toList();
  }

  boolean isEmpty() {
    return results.isEmpty();
  }

  String render() {
    StringBuilder md = new StringBuilder();
    md.append("## Training cost (median of cold runs, each in a fresh JVM with -Xmx2g)\n\n");
    md.append("| learner | rows × features | depth | runs | median wall time (s) | each run (s)"
        + " | median peak heap (MiB) | median allocated (MiB) |\n");
    md.append("|---|---|---:|---:|---:|---|---:|---:|\n");
    TreeSet<Integer> depths = results.stream().filter(r -> r.params().containsKey("depth"))
        .map(r -> Integer.parseInt(r.params().get("depth")))
        .collect(Collectors.toCollection(TreeSet::new));
    String small = BenchModel.SYNTHETIC_ROWS + " × " + BenchModel.SYNTHETIC_FEATURES;
    for (int depth : depths) {
      row(md, "Splitwright CART", small, Integer.toString(depth), find("splitwright", depth));
      row(md, "Weka REPTree `-L " + depth + "`", small, Integer.toString(depth),
          find("wekaRepTree", depth));
    }
    if (anyJ48().isPresent()) {
      row(md, "Weka J48 (defaults)", small, "none", anyJ48());
    }
    row(md, "Splitwright CART", TrainingBenchmark.Synthetic1M.ROWS + " × "
        + TrainingBenchmark.Synthetic1M.FEATURES,
        Integer.toString(TrainingBenchmark.Synthetic1M.DEPTH),
        find("splitwrightLarge", -1));

    md.append("\n### Training ratios and targets\n\n| comparison | measured | target |\n"
        + "|---|---|---|\n");
    for (int depth : depths) {
      double cart = median(find("splitwright", depth));
      double rep = median(find("wekaRepTree", depth)) / cart;
      md.append(String.format(Locale.ROOT, "| Weka REPTree / Splitwright, depth %d | %s | ≥ 10×:"
          + " %s |%n", depth, Cells.ratio(rep), Cells.verdict(rep, 10, true)));
      double j48 = median(anyJ48()) / cart;
      if (!Double.isNaN(j48)) {
        md.append(String.format(Locale.ROOT, "| Weka J48 (no depth limit) / Splitwright, depth %d"
            + " | %s | (none) |%n", depth, Cells.ratio(j48)));
      }
    }
    Optional<BenchResult> large = find("splitwrightLarge", -1);
    double seconds = median(large) / MS_PER_S;
    double heap = large.flatMap(r -> r.secondary("heap.peak")).map(m -> m.median())
        .orElse(Double.NaN);
    md.append(String.format(Locale.ROOT, "| 1,000,000 × 20 at depth 10, wall time | %s s |"
        + " ≤ 2.5 s: %s |%n", Cells.number(seconds),
        Cells.verdict(seconds, LARGE_SECONDS_TARGET, false)));
    md.append(String.format(Locale.ROOT, "| 1,000,000 × 20 at depth 10, peak heap | %s MiB |"
        + " ≤ 400 MiB: %s |%n", Cells.number(heap),
        Cells.verdict(heap, LARGE_HEAP_MIB_TARGET, false)));
    return md.toString();
  }

  private void row(StringBuilder md, String learner, String data, String depth,
      Optional<BenchResult> result) {
    md.append("| ").append(learner).append(" | ").append(data).append(" | ").append(depth);
    if (result.isEmpty()) {
      md.append(" | 0 | ").append(Cells.NONE).append(" | | | |\n");
      return;
    }
    BenchResult r = result.get();
    String runs = r.primary().raw().stream().map(ms -> Cells.number(ms / MS_PER_S))
        .collect(Collectors.joining(", "));
    md.append(" | ").append(r.primary().raw().size())
        .append(" | ").append(Cells.number(r.primary().median() / MS_PER_S))
        .append(" | ").append(runs)
        .append(" | ").append(r.secondary("heap.peak").map(m -> Cells.number(m.median()))
            .orElse(Cells.NONE))
        .append(" | ").append(r.secondary("gc.alloc.rate.norm")
            .map(m -> Cells.number(m.median() / (1024 * 1024))).orElse(Cells.NONE))
        .append(" |\n");
  }

  /** J48 ignores the depth parameter: the first result of it at any depth. */
  private Optional<BenchResult> anyJ48() {
    return results.stream().filter(r -> r.method().equals("wekaJ48")).findFirst();
  }

  /** Median wall time in milliseconds, or NaN. */
  private static double median(Optional<BenchResult> result) {
    return result.map(r -> r.primary().median()).orElse(Double.NaN);
  }

  /** The result of {@code method} at {@code depth}, or of a method without a depth if -1. */
  private Optional<BenchResult> find(String method, int depth) {
    return results.stream()
        .filter(r -> depth < 0 ? r.method().equals(method)
            : r.matches(method, "depth", Integer.toString(depth)))
        .findFirst();
  }
}
