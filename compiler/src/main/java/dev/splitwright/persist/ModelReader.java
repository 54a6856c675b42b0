package dev.splitwright.persist;

import com.fasterxml.jackson.core.type.TypeReference;
import com.fasterxml.jackson.databind.JsonNode;
import dev.splitwright.data.DataFile;
import dev.splitwright.data.Feature;
import dev.splitwright.data.InputException;
import dev.splitwright.data.Schema;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.text.DecimalText;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Turns a parsed model file into a tree (version 2) or an ensemble (version 3), checking every
 * field first: a file is either a model this build could have written or it is refused with the
 * place of the first fault. Nothing recurses
 * over the file's nodes (children are built before parents, by index), and the tree's depth is
 * checked against {@link DecisionTree#MAX_DEPTH} before anything that does.
 */
final class ModelReader {
  /** At most as many distinct labels or categories as the CSV loader accepts. */
  static final int MAX_VALUES = 65_535;

  private static final List<String> TOP = List.of("format", "version", "trainedOn", "target",
      "classes", "features", "training", "nodes");
  private static final List<String> ENSEMBLE_TOP = List.of("format", "version", "kind",
      "trainedOn", "target", "classes", "features", "training", "trees");
  private static final List<String> FOREST_TREE = List.of("nodes");
  private static final List<String> BOOSTED_TREE = List.of("weight", "nodes");
  private static final List<String> DATA_FILE = List.of("name", "sha256");
  private static final List<String> FEATURE = List.of("name", "kind", "categories");
  private static final List<String> NODE = List.of("feature", "threshold", "leftCodes",
      "missing", "left", "right", "predict", "counts");
  private static final List<String> SPLIT_ONLY = List.of("feature", "threshold", "leftCodes",
      "missing", "left", "right");

  /** A JSON number (RFC 8259 §6); Float.parseFloat alone would also take "NaN", "0x1p3", "1f". */
  private static final Pattern DECIMAL =
      Pattern.compile("-?(0|[1-9][0-9]*)(\\.[0-9]+)?([eE][+-]?[0-9]+)?");

  private final int maxDepth;

  ModelReader(int maxDepth) {
    this.maxDepth = maxDepth;
  }

  SavedClassifier read(JsonNode root) throws BadModelException {
    if (!root.isObject()) {
      throw new BadModelException("", "an object", describe(root));
    }
    String format = text(root, "", "format");
    if (!format.equals(ModelFile.FORMAT)) {
      throw new BadModelException("/format", "'" + ModelFile.FORMAT + "'",
          InputException.quote(format));
    }
    int version = integer(root, "", "version", Integer.MIN_VALUE, Integer.MAX_VALUE);
    if (version == 1) {
      throw new BadModelException("/version", "version " + ModelFile.VERSION
          + " (version 1 files do not record the data the model was trained on)", "version 1",
          "train it again with compile --save-model, which records its training data");
    }
    if (version != ModelFile.VERSION && version != ModelFile.ENSEMBLE_VERSION) {
      throw new BadModelException("/version", "version " + ModelFile.VERSION + " or "
          + ModelFile.ENSEMBLE_VERSION + " (the ones this build reads)", "version " + version);
    }
    boolean ensemble = version == ModelFile.ENSEMBLE_VERSION;
    requireObject(root, "", ensemble ? ENSEMBLE_TOP : TOP);
    String kind = ensemble ? text(root, "", "kind", "forest", "boosted") : "tree";
    DataFile trainedOn = dataFile(root, "trainedOn");
    String target = text(root, "", "target");
    List<String> classes = distinctTexts(root, "", "classes", 1);
    List<Feature> features = features(root);
    JsonNode training = root.get("training");
    if (training != null && !training.isObject()) {
      throw new BadModelException("/training", "an object", describe(training));
    }
    Schema schema = new Schema(features, target, classes);
    Map<String, Object> options = training == null ? Map.of()
        : ModelFile.MAPPER.convertValue(training, new TypeReference<LinkedHashMap<String, Object>>()
            {});
    if (!ensemble) {
      return new SavedModel(new DecisionTree(schema, nodes(root, "", schema)), trainedOn, options);
    }
    return new SavedEnsemble(trees(root, kind.equals("boosted"), schema), trainedOn, options);
  }

  /** Reads the {@code trees} of a version 3 file: each its nodes, and its weight if boosted. */
  private TreeEnsemble trees(JsonNode root, boolean boosted, Schema schema)
      throws BadModelException {
    JsonNode array = array(root, "", "trees");
    if (array.isEmpty() || array.size() > TreeEnsemble.MAX_TREES) {
      throw new BadModelException("/trees", "1 to " + TreeEnsemble.MAX_TREES + " trees",
          array.size() + " trees");
    }
    List<DecisionTree> trees = new ArrayList<>();
    float[] weights = new float[array.size()];
    float total = 0f;
    for (int t = 0; t < array.size(); t++) {
      String at = "/trees/" + t;
      JsonNode tree = array.get(t);
      requireObject(tree, at, boosted ? BOOSTED_TREE : FOREST_TREE);
      if (boosted) {
        weights[t] = weight(tree, at);
        total += weights[t];
        if (Float.isInfinite(total)) {
          throw new BadModelException(at + "/weight", "a weight that keeps the float32 sum of "
              + "the weights finite", InputException.quote(tree.get("weight").textValue()));
        }
      }
      trees.add(new DecisionTree(schema, nodes(tree, at, schema)));
    }
    return boosted ? TreeEnsemble.boosted(trees, weights) : TreeEnsemble.forest(trees);
  }

  private static float weight(JsonNode tree, String at) throws BadModelException {
    String text = text(tree, at, "weight");
    String expected = "a positive decimal number such as 0.75 or 1.5E-3";
    if (!DECIMAL.matcher(text).matches()) {
      throw new BadModelException(at + "/weight", expected, InputException.quote(text));
    }
    float value = Float.parseFloat(text);
    if (!(value > 0f)) {
      throw new BadModelException(at + "/weight", "a weight above 0 (the smallest float32 is "
          + "1.4E-45)", InputException.quote(text));
    }
    if (Float.isInfinite(value)) {
      throw new BadModelException(at + "/weight", "a number within 32-bit float range",
          InputException.quote(text));
    }
    return value;
  }

  private static DataFile dataFile(JsonNode root, String name) throws BadModelException {
    String at = "/" + name;
    JsonNode file = member(root, "", name, "an object with the members "
        + String.join(", ", DATA_FILE));
    requireObject(file, at, DATA_FILE);
    String fileName = text(file, at, "name");
    String sha256 = text(file, at, "sha256");
    if (!DataFile.isSha256(sha256)) {
      throw new BadModelException(at + "/sha256", "64 lowercase hex digits (a SHA-256)",
          InputException.quote(sha256));
    }
    return new DataFile(fileName, sha256);
  }

  private List<Feature> features(JsonNode root) throws BadModelException {
    JsonNode array = array(root, "", "features");
    List<Feature> features = new ArrayList<>();
    Set<String> names = new HashSet<>();
    for (int i = 0; i < array.size(); i++) {
      String at = "/features/" + i;
      JsonNode f = array.get(i);
      requireObject(f, at, FEATURE);
      String name = text(f, at, "name");
      if (!names.add(name)) {
        throw new BadModelException(at + "/name", "a name no other feature has",
            InputException.quote(name) + " again");
      }
      String kind = text(f, at, "kind");
      switch (kind) {
        case "numeric" -> {
          JsonNode categories = f.get("categories");
          if (categories != null && !(categories.isArray() && categories.isEmpty())) {
            throw new BadModelException(at + "/categories", "no categories on a numeric feature",
                describe(categories));
          }
          features.add(Feature.numeric(name));
        }
        case "categorical" -> features.add(Feature.categorical(name,
            f.has("categories") ? distinctTexts(f, at, "categories", 0) : List.of()));
        default -> throw new BadModelException(at + "/kind", "'numeric' or 'categorical'",
            InputException.quote(kind));
      }
    }
    return features;
  }

  private Node nodes(JsonNode holder, String holderAt, Schema schema) throws BadModelException {
    String prefix = holderAt + "/nodes";
    JsonNode array = array(holder, holderAt, "nodes");
    int size = array.size();
    if (size == 0) {
      throw new BadModelException(prefix, "at least one node", "an empty list");
    }
    int[][] counts = new int[size][];
    int[] parent = new int[size];
    Arrays.fill(parent, -1);
    for (int i = 0; i < size; i++) {
      String at = prefix + "/" + i;
      JsonNode n = array.get(i);
      requireObject(n, at, NODE);
      counts[i] = counts(n, at, schema.classCount());
      if (n.has("predict")) {
        for (String member : SPLIT_ONLY) {
          if (n.has(member)) {
            throw new BadModelException(at + "/" + member,
                "no split members on a leaf (it has 'predict')", "'" + member + "'");
          }
        }
        integer(n, at, "predict", 0, schema.classCount() - 1);
        continue;
      }
      int feature = integer(n, at, "feature", 0, schema.featureCount() - 1);
      text(n, at, "missing", "left", "right");
      if (i == size - 1) {
        throw new BadModelException(at, "a leaf (a split's children follow it, and no node does)",
            "a split");
      }
      for (String side : List.of("left", "right")) {
        int child = integer(n, at, side, i + 1, size - 1);
        if (parent[child] >= 0) {
          throw new BadModelException(at + "/" + side, "a node that no other split has as a child",
              "node " + child + ", already a child of node " + parent[child]);
        }
        parent[child] = i;
      }
      boolean categorical = schema.feature(feature).isCategorical();
      String own = categorical ? "leftCodes" : "threshold";
      String other = categorical ? "threshold" : "leftCodes";
      if (n.has(other)) {
        throw new BadModelException(at + "/" + other, "'" + own + "' for "
            + (categorical ? "categorical" : "numeric") + " feature "
            + InputException.quote(schema.feature(feature).name()), "'" + other + "'");
      }
      if (categorical) {
        codes(n, at, schema.feature(feature).categories().size());
      } else {
        threshold(n, at);
      }
    }
    int[] level = new int[size];
    for (int i = 1; i < size; i++) {
      if (parent[i] < 0) {
        throw new BadModelException(prefix + "/" + i,
            "a node that some split has as a child (all but the first)", "none that has");
      }
      level[i] = level[parent[i]] + 1;
      if (level[i] > maxDepth) {
        throw new BadModelException(prefix + "/" + i,
            "a tree at most " + maxDepth + " levels deep", "a node at depth " + level[i]);
      }
    }
    return build(array, prefix, counts, schema);
  }

  /** Checks each split's counts against its children's, then builds leaves-first by index. */
  private static Node build(JsonNode array, String prefix, int[][] counts, Schema schema)
      throws BadModelException {
    int size = array.size();
    Node[] built = new Node[size];
    for (int i = size - 1; i >= 0; i--) {
      JsonNode n = array.get(i);
      ClassCounts own = ClassCounts.of(counts[i]);
      if (n.has("predict")) {
        built[i] = new Leaf(n.get("predict").intValue(), own);
        continue;
      }
      int left = n.get("left").intValue();
      int right = n.get("right").intValue();
      for (int c = 0; c < counts[i].length; c++) {
        long sum = (long) counts[left][c] + counts[right][c];
        if (sum != counts[i][c]) {
          throw new BadModelException(prefix + "/" + i + "/counts/" + c, sum + ", the sum of its "
              + "children's counts (nodes " + left + " and " + right + ")", "" + counts[i][c]);
        }
      }
      int feature = n.get("feature").intValue();
      boolean missingLeft = n.get("missing").textValue().equals("left");
      if (schema.feature(feature).isCategorical()) {
        int[] codes = new int[n.get("leftCodes").size()];
        for (int k = 0; k < codes.length; k++) {
          codes[k] = n.get("leftCodes").get(k).intValue();
        }
        built[i] = new CategoricalSplit(feature, CategoricalSplit.CodeSet.of(codes), missingLeft,
            built[left], built[right], own);
      } else {
        built[i] = new NumericSplit(feature, Float.parseFloat(n.get("threshold").textValue()),
            missingLeft, built[left], built[right], own);
      }
      built[left] = null;
      built[right] = null;
    }
    return built[0];
  }

  private static int[] counts(JsonNode n, String at, int classes) throws BadModelException {
    JsonNode array = array(n, at, "counts");
    if (array.size() != classes) {
      throw new BadModelException(at + "/counts", "one count per class (" + classes + ")",
          array.size() + " counts");
    }
    int[] counts = new int[classes];
    for (int c = 0; c < classes; c++) {
      counts[c] = element(array, at + "/counts", c, 0, Integer.MAX_VALUE);
    }
    return counts;
  }

  private static void codes(JsonNode n, String at, int categories) throws BadModelException {
    // No codes is valid: the trainer splits missing values (left) from present ones (right) so.
    JsonNode array = array(n, at, "leftCodes");
    int previous = -1;
    for (int k = 0; k < array.size(); k++) {
      int code = element(array, at + "/leftCodes", k, 0, categories - 1);
      if (code <= previous) {
        throw new BadModelException(at + "/leftCodes/" + k,
            "codes in ascending order without repeats, so above " + previous, "" + code);
      }
      previous = code;
    }
  }

  private static void threshold(JsonNode n, String at) throws BadModelException {
    String text = text(n, at, "threshold");
    if (text.equals("Infinity") || text.equals("-Infinity")) {
      return; // valid split thresholds (NumericSplit), written so; a CSV value never exceeds them
    }
    if (!DECIMAL.matcher(text).matches()) {
      throw new BadModelException(at + "/threshold", "a decimal number such as 0.5 or 1.0E-5 "
          + "(or Infinity, -Infinity)", InputException.quote(text));
    }
    float value = Float.parseFloat(text);
    if (Float.isInfinite(value)) {
      throw new BadModelException(at + "/threshold", "a number within 32-bit float range",
          InputException.quote(text));
    }
  }

  private static void requireObject(JsonNode node, String at, List<String> members)
      throws BadModelException {
    if (!node.isObject()) {
      throw new BadModelException(at, "an object", describe(node));
    }
    for (Iterator<String> names = node.fieldNames(); names.hasNext(); ) {
      String name = names.next();
      if (!members.contains(name)) {
        throw new BadModelException(at + "/" + escape(name), "only the members "
            + String.join(", ", members), "member " + InputException.quote(name));
      }
    }
  }

  private static JsonNode member(JsonNode node, String at, String name, String expected)
      throws BadModelException {
    JsonNode value = node.get(name);
    if (value == null) {
      throw new BadModelException(at + "/" + name, expected, "nothing");
    }
    return value;
  }

  private static String text(JsonNode node, String at, String name, String... allowed)
      throws BadModelException {
    String expected = allowed.length == 0 ? "a string" : "'" + String.join("' or '", allowed) + "'";
    JsonNode value = member(node, at, name, expected);
    if (!value.isTextual()) {
      throw new BadModelException(at + "/" + name, expected, describe(value));
    }
    if (allowed.length > 0 && !List.of(allowed).contains(value.textValue())) {
      throw new BadModelException(at + "/" + name, expected, describe(value));
    }
    return value.textValue();
  }

  private static int integer(JsonNode node, String at, String name, int min, int max)
      throws BadModelException {
    return checkInteger(member(node, at, name, range(min, max)), at + "/" + name, min, max);
  }

  private static int element(JsonNode array, String at, int index, int min, int max)
      throws BadModelException {
    return checkInteger(array.get(index), at + "/" + index, min, max);
  }

  private static int checkInteger(JsonNode value, String at, int min, int max)
      throws BadModelException {
    if (!value.isIntegralNumber() || !value.canConvertToInt() || value.intValue() < min
        || value.intValue() > max) {
      throw new BadModelException(at, range(min, max), describe(value));
    }
    return value.intValue();
  }

  private static String range(int min, int max) {
    if (min == Integer.MIN_VALUE) {
      return "an integer";
    }
    if (max < min) {
      return "nothing (there is no valid value)";
    }
    return max == Integer.MAX_VALUE ? "an integer of at least " + min
        : "an integer from " + min + " to " + max;
  }

  private static JsonNode array(JsonNode node, String at, String name) throws BadModelException {
    JsonNode value = member(node, at, name, "a list");
    if (!value.isArray()) {
      throw new BadModelException(at + "/" + name, "a list", describe(value));
    }
    return value;
  }

  private static List<String> distinctTexts(JsonNode node, String at, String name, int least)
      throws BadModelException {
    JsonNode array = array(node, at, name);
    if (array.size() < least) {
      throw new BadModelException(at + "/" + name, "at least " + least + " entry", "none");
    }
    if (array.size() > MAX_VALUES) {
      throw new BadModelException(at + "/" + name, "at most " + MAX_VALUES + " entries",
          array.size() + " entries");
    }
    List<String> values = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    for (int i = 0; i < array.size(); i++) {
      JsonNode value = array.get(i);
      String where = at + "/" + name + "/" + i;
      if (!value.isTextual()) {
        throw new BadModelException(where, "a string", describe(value));
      }
      if (!seen.add(value.textValue())) {
        throw new BadModelException(where, "a value not listed before",
            InputException.quote(value.textValue()) + " again");
      }
      values.add(value.textValue());
    }
    return values;
  }

  /** Shows a found value briefly: strings quoted, numbers as written, else the kind of value. */
  private static String describe(JsonNode value) {
    if (value.isTextual()) {
      return InputException.quote(value.textValue());
    }
    if (value.isNumber() || value.isBoolean()) {
      String text = value.isFloatingPointNumber() ? DecimalText.shortest(value.doubleValue())
          : value.asText();
      return text.length() > 40 ? text.substring(0, 37) + "..." : text;
    }
    if (value.isNull()) {
      return "null";
    }
    return value.isArray() ? "a list" : "an object";
  }

  /** Escapes a member name for a JSON Pointer (RFC 6901 §3). */
  private static String escape(String name) {
    String quoted = InputException.quote(name.replace("~", "~0").replace("/", "~1"));
    return quoted.substring(1, quoted.length() - 1);
  }
}
