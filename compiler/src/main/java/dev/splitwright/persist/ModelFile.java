package dev.splitwright.persist;

import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.splitwright.data.Feature;
import dev.splitwright.data.InputException;
import dev.splitwright.data.Schema;
import dev.splitwright.data.SourcePosition;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.report.ReportJson;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Reads and writes Splitwright's JSON model file. Nodes are a flat pre-order list that refer to
 * their children by index, so deep trees need no deep JSON nesting; thresholds are written as
 * {@link Float#toString} text and read back with {@link Float#parseFloat}, which is exact (a JSON
 * number would pass through a double and could round twice).
 */
public final class ModelFile {
  /** Identifies the format; bump {@link #VERSION} on any incompatible change. */
  public static final String FORMAT = "splitwright-model";

  public static final int VERSION = 1;

  private static final ObjectMapper MAPPER = new ObjectMapper()
      .enable(DeserializationFeature.FAIL_ON_NULL_FOR_PRIMITIVES)
      .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);

  private ModelFile() {}

  /** Serialises a tree and what it was trained on. */
  public static String toJson(DecisionTree tree, Map<String, Object> training) {
    List<ModelJson.NodeJson> nodes = new ArrayList<>();
    flatten(tree.root(), nodes);
    List<ModelJson.FeatureJson> features = tree.schema().features().stream()
        .map(f -> new ModelJson.FeatureJson(f.name(), f.isCategorical() ? "categorical" : "numeric",
            f.categories()))
        .toList();
    ModelJson json = new ModelJson(FORMAT, VERSION, tree.schema().target(),
        tree.schema().classes(), features, training, nodes);
    return ReportJson.render(json);
  }

  private static int flatten(Node node, List<ModelJson.NodeJson> out) {
    int index = out.size();
    out.add(null);
    List<Integer> counts = java.util.Arrays.stream(node.counts().toArray()).boxed().toList();
    if (node instanceof Leaf leaf) {
      out.set(index, new ModelJson.NodeJson(null, null, null, null, null, null, leaf.prediction(),
          counts));
      return index;
    }
    Split split = (Split) node;
    int left = flatten(split.left(), out);
    int right = flatten(split.right(), out);
    String threshold = null;
    List<Integer> codes = null;
    if (split instanceof NumericSplit numeric) {
      threshold = Float.toString(numeric.threshold());
    } else {
      codes = java.util.Arrays.stream(((CategoricalSplit) split).leftCodes().toArray()).boxed()
          .toList();
    }
    out.set(index, new ModelJson.NodeJson(split.feature(), threshold, codes,
        split.missingLeft() ? "left" : "right", left, right, null, counts));
    return index;
  }

  /** Writes the model file. */
  public static void write(Path file, DecisionTree tree, Map<String, Object> training)
      throws IOException {
    Files.writeString(file, toJson(tree, training), StandardCharsets.UTF_8);
  }

  /**
   * Reads a model file.
   *
   * @throws InputException if the file cannot be read, is not JSON of this format, or describes an
   *     invalid tree
   */
  public static DecisionTree read(Path file) throws InputException {
    String name = String.valueOf(file.getFileName());
    ModelJson json;
    try {
      json = MAPPER.readValue(Files.readString(file, StandardCharsets.UTF_8), ModelJson.class);
    } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
      var location = e.getLocation();
      long line = location == null ? 0 : location.getLineNr();
      int column = location == null ? 0 : location.getColumnNr();
      throw new InputException(SourcePosition.ofCell(name, Math.max(1, line), Math.max(1, column),
          ""), "not a valid Splitwright model file: " + e.getOriginalMessage().lines().findFirst()
              .orElse("malformed JSON").replaceFirst(" \\(set [A-Za-z_.]+ .*\\)$", ""),
          "pass a file written by --save-model");
    } catch (IOException e) {
      throw new InputException(SourcePosition.ofFile(name),
          "cannot read the model file (" + e.getMessage() + ")",
          "check the path and permissions");
    }
    try {
      return fromJson(json);
    } catch (IllegalArgumentException | IndexOutOfBoundsException | NullPointerException e) {
      throw new InputException(SourcePosition.ofFile(name), "invalid model: " + e.getMessage(),
          "pass a file written by --save-model");
    }
  }

  private static DecisionTree fromJson(ModelJson json) {
    if (!FORMAT.equals(json.format())) {
      throw new IllegalArgumentException(
          "format is '" + json.format() + "', expected '" + FORMAT + "'");
    }
    if (json.version() != VERSION) {
      throw new IllegalArgumentException("version " + json.version() + " is not supported; this "
          + "build reads version " + VERSION);
    }
    List<Feature> features = json.features().stream()
        .map(f -> switch (f.kind()) {
          case "numeric" -> Feature.numeric(f.name());
          case "categorical" -> Feature.categorical(f.name(), f.categories());
          default -> throw new IllegalArgumentException("unknown feature kind '" + f.kind() + "'");
        })
        .toList();
    Schema schema = new Schema(features, json.target(), json.classes());
    if (json.nodes().isEmpty()) {
      throw new IllegalArgumentException("the model has no nodes");
    }
    boolean[] used = new boolean[json.nodes().size()];
    Node root = build(json.nodes(), 0, used);
    for (int i = 0; i < used.length; i++) {
      if (!used[i]) {
        throw new IllegalArgumentException("node " + i + " is not reachable from the root");
      }
    }
    return new DecisionTree(schema, root);
  }

  private static Node build(List<ModelJson.NodeJson> nodes, int index, boolean[] used) {
    if (used[index]) {
      throw new IllegalArgumentException("node " + index + " is referred to twice");
    }
    used[index] = true;
    ModelJson.NodeJson n = nodes.get(index);
    ClassCounts counts = ClassCounts.of(n.counts().stream().mapToInt(Integer::intValue).toArray());
    if (n.predict() != null) {
      return new Leaf(n.predict(), counts);
    }
    if (n.feature() == null || n.left() == null || n.right() == null || n.missing() == null) {
      throw new IllegalArgumentException("node " + index + " is neither a leaf nor a split");
    }
    if (n.left() <= index || n.right() <= index) {
      throw new IllegalArgumentException("node " + index + " must list its children after it");
    }
    boolean missingLeft = switch (n.missing()) {
      case "left" -> true;
      case "right" -> false;
      default -> throw new IllegalArgumentException("node " + index + ": missing must be "
          + "'left' or 'right'");
    };
    Node left = build(nodes, n.left(), used);
    Node right = build(nodes, n.right(), used);
    if (n.threshold() != null) {
      return new NumericSplit(n.feature(), Float.parseFloat(n.threshold()), missingLeft, left,
          right, counts);
    }
    if (n.leftCodes() == null) {
      throw new IllegalArgumentException("node " + index + " has neither threshold nor leftCodes");
    }
    return new CategoricalSplit(n.feature(),
        CategoricalSplit.CodeSet.of(n.leftCodes().stream().mapToInt(Integer::intValue).toArray()),
        missingLeft, left, right, counts);
  }
}
