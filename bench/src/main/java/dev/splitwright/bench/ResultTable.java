package dev.splitwright.bench;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeSet;

/**
 * Turns JMH's JSON results into the Markdown table the README shows: machine and date, prediction
 * cost per form with the ratios to the generated class, a forest's cost per layout, training cost
 * with medians and peak heap, and each of the targets marked met or missed by how much.
 *
 * <pre>
 * ResultTable --profile quick --out bench/results/quick.md [--load-start "1.0 0.9 0.8"]
 *     [--settings "text"] [--models models.md] results.json...
 * </pre>
 */
public final class ResultTable {
  private ResultTable() {}

  public static void main(String[] args) throws IOException {
    Map<String, String> options = new LinkedHashMap<>();
    List<Path> inputs = new ArrayList<>();
    for (int i = 0; i < args.length; i++) {
      if (args[i].startsWith("--") && i + 1 < args.length) {
        options.put(args[i].substring(2), args[++i]);
      } else {
        inputs.add(Path.of(args[i]));
      }
    }
    if (!options.containsKey("out") || inputs.isEmpty()) {
      System.err.println("usage: ResultTable --out <file.md> [--profile name] [--load-start text]"
          + " [--settings text] [--models file.md] <jmh-result.json>...");
      System.exit(2);
    }
    ObjectMapper json = new ObjectMapper();
    List<BenchResult> results = new ArrayList<>();
    for (Path input : inputs) {
      if (Files.size(input) > 0) {
        results.addAll(BenchResult.allOf(json.readTree(input.toFile())));
      }
    }
    String models = options.containsKey("models")
        && Files.isRegularFile(Path.of(options.get("models")))
        ? Files.readString(Path.of(options.get("models")), StandardCharsets.UTF_8) : "";
    String date = ZonedDateTime.now(ZoneOffset.UTC)
        .format(DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'", Locale.ROOT));
    String md = render(results, options.getOrDefault("profile", "quick"), date, MachineInfo.read(),
        options.getOrDefault("load-start", "unknown"), options.getOrDefault("settings", ""),
        models);
    Files.writeString(Path.of(options.get("out")), md, StandardCharsets.UTF_8);
  }

  static String render(List<BenchResult> results, String profile, String date,
      MachineInfo machine, String loadStart, String settings, String models) {
    StringBuilder md = new StringBuilder();
    md.append("# Splitwright benchmarks: ").append(profile).append(" profile\n\n");
    TreeSet<String> vms = new TreeSet<>();
    results.forEach(r -> vms.add(r.vm()));
    md.append("- Date: ").append(date).append("\n");
    md.append("- Machine: ").append(machine.describe()).append("; shared with other builds, so"
        + " figures are noisy. Load average (1, 5, 15 min) at start: ").append(loadStart)
        .append("; at end: ").append(machine.loadAverage()).append("\n");
    md.append("- JDK: ").append(vms.isEmpty() ? "unknown" : String.join("; ", vms))
        .append("; JMH 1.37; Weka 3.8.6\n");
    if (!settings.isEmpty()) {
      md.append("- Settings: ").append(settings).append("\n");
    }
    md.append("\n");
    PredictionSection prediction = new PredictionSection(results);
    if (!prediction.isEmpty()) {
      md.append(prediction.render()).append("\n");
    }
    EnsembleSection ensemble = new EnsembleSection(results);
    if (!ensemble.isEmpty()) {
      md.append(ensemble.render()).append("\n");
    }
    TrainingSection training = new TrainingSection(results);
    if (!training.isEmpty()) {
      md.append(training.render()).append("\n");
    }
    md.append(models);
    return md.toString().stripTrailing() + "\n";
  }
}
