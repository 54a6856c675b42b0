package dev.splitwright.bench;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeMap;

/**
 * One benchmark result read from JMH's JSON: method name, parameters and the primary and secondary
 * metrics with their raw per-fork values.
 *
 * @param method the benchmark method's simple name, e.g. {@code generatedBranches}
 * @param params JMH parameters, sorted by name
 * @param primary the timing
 * @param secondary profiler results by label, e.g. {@code heap.peak}
 */
record BenchResult(String benchmarkClass, String method, Map<String, String> params, Metric primary,
    Map<String, Metric> secondary, String jdk, String vm, int forks) {

  BenchResult {
    Objects.requireNonNull(benchmarkClass, "benchmarkClass");
    Objects.requireNonNull(method, "method");
    params = Map.copyOf(new TreeMap<>(params));
    Objects.requireNonNull(primary, "primary");
    secondary = Map.copyOf(new TreeMap<>(secondary));
    Objects.requireNonNull(jdk, "jdk");
    Objects.requireNonNull(vm, "vm");
  }

  /**
   * One metric: JMH's score, the half-width of its 99.9% confidence interval (NaN if JMH had too
   * few samples) and every raw value, forks in order.
   */
  record Metric(double score, double error, String unit, List<Double> raw) {
    Metric {
      Objects.requireNonNull(unit, "unit");
      raw = List.copyOf(raw);
    }

    double min() {
      return raw.stream().mapToDouble(Double::doubleValue).min().orElse(Double.NaN);
    }

    double max() {
      return raw.stream().mapToDouble(Double::doubleValue).max().orElse(Double.NaN);
    }

    /** The median of the raw values (the mean of the middle two for an even count). */
    double median() {
      if (raw.isEmpty()) {
        return score;
      }
      double[] sorted = raw.stream().mapToDouble(Double::doubleValue).sorted().toArray();
      int mid = sorted.length / 2;
      return sorted.length % 2 == 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
    }

    static Metric of(JsonNode node) {
      List<Double> raw = new ArrayList<>();
      for (JsonNode fork : node.path("rawData")) {
        for (JsonNode value : fork) {
          raw.add(value.asDouble());
        }
      }
      return new Metric(number(node.path("score")), number(node.path("scoreError")),
          node.path("scoreUnit").asText(), raw);
    }

    /** JMH writes NaN as the string "NaN". */
    private static double number(JsonNode node) {
      return node.isNumber() ? node.asDouble() : Double.NaN;
    }
  }

  /** Reads every result of one JMH JSON document (an array of results). */
  static List<BenchResult> allOf(JsonNode document) {
    List<BenchResult> out = new ArrayList<>();
    for (JsonNode result : document) {
      String name = result.path("benchmark").asText();
      int dot = name.lastIndexOf('.');
      String owner = name.substring(0, Math.max(dot, 0));
      String simpleOwner = owner.substring(owner.lastIndexOf('.') + 1);
      Map<String, String> params = new TreeMap<>();
      for (Map.Entry<String, JsonNode> e : result.path("params").properties()) {
        params.put(e.getKey(), e.getValue().asText());
      }
      Map<String, Metric> secondary = new TreeMap<>();
      for (Map.Entry<String, JsonNode> e : result.path("secondaryMetrics").properties()) {
        secondary.put(label(e.getKey()), Metric.of(e.getValue()));
      }
      out.add(new BenchResult(simpleOwner, name.substring(dot + 1), params,
          Metric.of(result.path("primaryMetric")), secondary,
          result.path("jdkVersion").asText(), result.path("vmName").asText() + " "
              + result.path("vmVersion").asText(), result.path("forks").asInt()));
    }
    return out;
  }

  /** Older JMH versions prefix profiler labels with a middle dot; drop it. */
  private static String label(String key) {
    return key.startsWith("\u00b7") ? key.substring(1) : key;
  }

  Optional<Metric> secondary(String label) {
    return Optional.ofNullable(secondary.get(label));
  }

  /** Tells whether this result is {@code method} with all of {@code wanted}'s parameters. */
  boolean matches(String methodName, String... wanted) {
    if (!method.equals(methodName)) {
      return false;
    }
    if (wanted.length % 2 != 0) {
      throw new IllegalArgumentException("params come in name, value pairs: "
          + Arrays.toString(wanted));
    }
    for (int i = 0; i < wanted.length; i += 2) {
      if (!wanted[i + 1].equals(params.get(wanted[i]))) {
        return false;
      }
    }
    return true;
  }
}
