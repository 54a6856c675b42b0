package dev.splitwright.bench;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CEmitter;
import dev.splitwright.data.Dataset;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * Writes {@code bench/results/c-instructions.md}: machine instructions per classification of the
 * emitted C classifiers, for every layout the C emitter supports, counted by callgrind (see {@link
 * CInstructionCount}) over the prediction benchmark's 65,536 fresh rows in both input orders.
 * Every cell is counted twice and must come out the same. Run by {@code bench/c-instructions.sh}.
 *
 * <p>Arguments: {@code --out <file.md>} (required), {@code --work <dir>} (default {@code
 * bench/target/c-instructions}), {@code --cc <command>} (default {@code gcc}).
 */
public final class CInstructions {
  /** Compiler flags measured; each is added to {@code -std=c99}. */
  static final List<String> FLAGS = List.of("-O2", "-Os");

  private CInstructions() {}

  /** A model of the table: its name, C base name, depth limit and training set. */
  record Model(String name, String base, BenchModel inputs, int depth) {}

  static final List<Model> MODELS = List.of(
      new Model("pump", "pump", BenchModel.PUMP, BenchModel.PUMP.depth()),
      new Model("synthetic, depth 14", "synthetic14", BenchModel.SYNTHETIC,
          BenchModel.SYNTHETIC.depth()),
      new Model("synthetic, depth 10", "synthetic10", BenchModel.SYNTHETIC, 10));

  /** One row of the table. */
  record Row(String model, String shape, String layout, String flags, String order,
      CInstructionCount.Count count) {}

  public static void main(String[] args) throws IOException {
    Map<String, String> options = new LinkedHashMap<>();
    options.put("--work", "bench/target/c-instructions");
    options.put("--cc", "gcc");
    for (int i = 0; i + 1 < args.length; i += 2) {
      options.put(args[i], args[i + 1]);
    }
    if (args.length % 2 != 0 || !options.containsKey("--out") || options.size() != 3) {
      System.err.println("usage: CInstructions --out <file.md> [--work <dir>] [--cc <command>]");
      System.exit(2);
    }
    String cc = options.get("--cc");
    Optional<String> missing = CInstructionCount.missingTool(cc);
    if (missing.isPresent()) {
      System.err.println("error: " + missing.get());
      System.exit(2);
    }
    CInstructionCount counter = new CInstructionCount(Path.of(options.get("--work")), cc);
    List<Row> rows = new ArrayList<>();
    Dataset synthetic = null;
    for (Model model : MODELS) {
      Dataset training;
      if (model.inputs() == BenchModel.SYNTHETIC) {
        synthetic = synthetic == null ? model.inputs().trainingSet() : synthetic;
        training = synthetic;
      } else {
        training = model.inputs().trainingSet();
      }
      DecisionTree tree = CartTrainer.train(training,
          TrainingOptions.builder().maxDepth(model.depth()).build());
      String shape = String.format(Locale.ROOT, "depth %d, %d leaves", tree.depth(),
          tree.leafCount());
      for (Layout layout : layouts(tree)) {
        for (String flags : FLAGS) {
          for (InputOrder order : InputOrder.values()) {
            float[][] inputs = model.inputs().inputs(training, order).rows();
            CEmitOptions emit = new CEmitOptions(model.base(), layout, InputKind.FLOAT, false,
                true);
            String cell = model.base() + "-" + layout.optionName() + flags.replace(' ', '_')
                + "-" + order.paramName();
            CInstructionCount.Count first = counter.count(cell, tree, emit, flags, inputs);
            CInstructionCount.Count second = counter.count(cell, tree, emit, flags, inputs);
            if (!first.equals(second)) {
              throw new IllegalStateException(cell + ": two runs counted " + first + " and "
                  + second);
            }
            System.out.printf(Locale.ROOT, "%s: %.1f instructions per classification%n", cell,
                first.perClassification());
            rows.add(new Row(model.name(), shape, layout.optionName(), flags, order.paramName(),
                first));
          }
        }
      }
    }
    String md = render(rows, firstLine(cc), firstLine("valgrind"));
    Path out = Path.of(options.get("--out"));
    Files.writeString(out, md, StandardCharsets.UTF_8);
    System.out.println("wrote " + out);
  }

  /**
   * The layouts the C emitter supports for {@code tree}: every {@link Layout} it accepts, except
   * one whose C text equals an earlier layout's (an emitter that does not know a new layout yet
   * would otherwise be measured twice under two names).
   */
  static List<Layout> layouts(DecisionTree tree) {
    List<Layout> supported = new ArrayList<>();
    List<String> texts = new ArrayList<>();
    for (Layout layout : Layout.values()) {
      String text;
      try {
        CEmitOptions options = new CEmitOptions("m", layout, InputKind.FLOAT, false, true);
        text = CEmitter.emit(tree, options, HeaderInfo.none()).sourceText();
      } catch (IllegalArgumentException notForC) {
        continue;
      }
      if (!texts.contains(text)) {
        texts.add(text);
        supported.add(layout);
      }
    }
    return supported;
  }

  static String render(List<Row> rows, String compiler, String valgrind) {
    StringBuilder md = new StringBuilder();
    md.append("# Splitwright C classifiers: instructions per classification\n\n")
        .append("- Counted by ").append(valgrind).append(" `--tool=callgrind"
            + " --toggle-collect=<base>_classify`: only instructions executed inside the classify"
            + " function (entry to return) count, so the driver's loop, its input reading and the"
            + " C library add nothing and nothing is subtracted. Callgrind simulates every"
            + " instruction, so counts do not depend on the machine's load; each cell was counted"
            + " twice, with the same result.\n")
        .append("- Compiler: ").append(compiler).append(", `-std=c99` and the flags below;"
            + " classifier (bare, float input) and driver built as separate objects, so the call"
            + " is never inlined.\n")
        .append("- Inputs: the prediction benchmark's ").append(String.format(Locale.ROOT,
            "%,d", BenchModel.INPUT_ROWS)).append(" distinct fresh rows per model, shuffled or"
            + " time-ordered (`InputOrder`); the driver checks the sum of the classes returned"
            + " against the model.\n")
        .append("- Reproduce: `bench/c-instructions.sh`\n\n")
        .append("| model | tree | layout | flags | input order | instructions per"
            + " classification (mean) | instructions in all |\n")
        .append("|---|---|---|---|---|---:|---:|\n");
    for (Row row : rows) {
      md.append(String.format(Locale.ROOT, "| %s | %s | `%s` | `%s` | %s | %.1f | %d |%n",
          row.model(), row.shape(), row.layout(), row.flags(), row.order(),
          row.count().perClassification(), row.count().instructions()));
    }
    return md.toString();
  }

  /** The first line a tool prints for {@code --version}, e.g. {@code valgrind-3.19.0}. */
  private static String firstLine(String tool) throws IOException {
    Process p = new ProcessBuilder(tool, "--version").redirectErrorStream(true).start();
    String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    try {
      p.waitFor();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
    return text.lines().findFirst().orElse(tool).trim();
  }
}
