package dev.splitwright.persist;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadConstraints;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.core.exc.StreamConstraintsException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import dev.splitwright.data.DataFile;
import dev.splitwright.data.InputException;
import dev.splitwright.data.Schema;
import dev.splitwright.data.SourcePosition;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.model.TreeEnsemble;
import dev.splitwright.report.ReportJson;
import dev.splitwright.text.DecimalText;
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
 * the shortest decimal text that reads back as the float ({@link DecimalText}) and read back with
 * {@link Float#parseFloat}, which is exact (a JSON number would pass through a double and could
 * round twice).
 */
public final class ModelFile {
  /** Identifies the format; bump {@link #VERSION} on any incompatible change. */
  public static final String FORMAT = "splitwright-model";

  /**
   * Version 2 records the data the model was trained on ({@code trainedOn}); version 1 files did
   * not, and are refused with that reason rather than read without it.
   */
  public static final int VERSION = 2;

  /**
   * Version 3 holds an ensemble ({@code kind} forest or boosted, a list of {@code trees}, each
   * with its nodes as in version 2 and, if boosted, its {@code weight}). A single tree is still
   * written as version 2, so files of single trees stay readable by earlier builds.
   */
  public static final int ENSEMBLE_VERSION = 3;

  /**
   * Deepest JSON nesting read. A model file needs four levels (file, node list, node, counts), six
   * for an ensemble (file, tree list, tree, node list, node, counts);
   * limiting it in the parser keeps a hostile file from running anything deep.
   */
  static final int MAX_NESTING = 32;

  private static final String REMEDY = "pass a file written by --save-model";

  static final ObjectMapper MAPPER = JsonMapper.builder(JsonFactory.builder()
          .streamReadConstraints(StreamReadConstraints.builder().maxNestingDepth(MAX_NESTING)
              .build())
          .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
          .build())
      .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
      .build();

  private ModelFile() {}

  /** Serialises a model: writing what {@link #load} read gives the bytes it read. */
  public static String toJson(SavedModel model) {
    return toJson(model.tree(), model.trainedOn(), model.training());
  }

  /** Serialises a tree, the data file it was trained on and the options that trained it. */
  public static String toJson(DecisionTree tree, DataFile trainedOn,
      Map<String, Object> training) {
    ModelJson json = new ModelJson(FORMAT, VERSION, trainedOn, tree.schema().target(),
        tree.schema().classes(), features(tree.schema()), training, nodes(tree));
    return ReportJson.render(json);
  }

  /** Serialises an ensemble (version 3): writing what {@link #loadAny} read gives its bytes. */
  public static String toJson(SavedEnsemble model) {
    return toJson(model.ensemble(), model.trainedOn(), model.training());
  }

  /**
   * Serialises an ensemble, the data file it was trained on and the options that trained it;
   * weights are written as the shortest decimal text that reads back as the float.
   */
  public static String toJson(TreeEnsemble ensemble, DataFile trainedOn,
      Map<String, Object> training) {
    boolean boosted = ensemble.kind() == TreeEnsemble.Kind.BOOSTED;
    List<ModelJson.TreeJson> trees = new ArrayList<>();
    for (int t = 0; t < ensemble.treeCount(); t++) {
      trees.add(new ModelJson.TreeJson(
          boosted ? DecimalText.shortest(ensemble.weight(t)) : null,
          nodes(ensemble.trees().get(t))));
    }
    ModelJson.EnsembleJson json = new ModelJson.EnsembleJson(FORMAT, ENSEMBLE_VERSION,
        ensemble.kind().fileName(), trainedOn, ensemble.schema().target(),
        ensemble.schema().classes(), features(ensemble.schema()), training, trees);
    return ReportJson.render(json);
  }

  /** Serialises a tree (version 2) or an ensemble (version 3). */
  public static String toJson(SavedClassifier model) {
    return model instanceof SavedModel tree ? toJson(tree) : toJson((SavedEnsemble) model);
  }

  private static List<ModelJson.FeatureJson> features(Schema schema) {
    return schema.features().stream()
        .map(f -> new ModelJson.FeatureJson(f.name(), f.isCategorical() ? "categorical" : "numeric",
            f.categories()))
        .toList();
  }

  private static List<ModelJson.NodeJson> nodes(DecisionTree tree) {
    List<ModelJson.NodeJson> nodes = new ArrayList<>();
    flatten(tree.root(), nodes);
    return nodes;
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
      threshold = DecimalText.shortest(numeric.threshold());
    } else {
      codes = java.util.Arrays.stream(((CategoricalSplit) split).leftCodes().toArray()).boxed()
          .toList();
    }
    out.set(index, new ModelJson.NodeJson(split.feature(), threshold, codes,
        split.missingLeft() ? "left" : "right", left, right, null, counts));
    return index;
  }

  /** Writes the model file. */
  public static void write(Path file, SavedModel model) throws IOException {
    Files.writeString(file, toJson(model), StandardCharsets.UTF_8);
  }

  /** Writes the model file of a tree or an ensemble. */
  public static void write(Path file, SavedClassifier model) throws IOException {
    Files.writeString(file, toJson(model), StandardCharsets.UTF_8);
  }

  /**
   * Reads a model file's tree; see {@link #load}.
   *
   * @throws InputException as {@link #load} does
   */
  public static DecisionTree read(Path file) throws InputException {
    return load(file).tree();
  }

  /**
   * Reads a model file of a single tree, checking all of it: a version other than {@link
   * #VERSION} (an ensemble's {@link #ENSEMBLE_VERSION} included: see {@link #loadAny}), a
   * missing or malformed {@code trainedOn}, JSON nested deeper than {@link #MAX_NESTING}, a
   * duplicate member, an unknown member, an index, code, count or threshold out of range, a tree
   * deeper than {@link DecisionTree#MAX_DEPTH}, or counts that do not add up are refused.
   *
   * @throws InputException if the file cannot be read, is not JSON of this format, or describes an
   *     invalid tree; its one-line message names the file and the place in it
   */
  public static SavedModel load(Path file) throws InputException {
    SavedClassifier model = loadAny(file);
    if (model instanceof SavedEnsemble ensemble) {
      // Until ensembles can be emitted, the commands that re-emit take single trees only.
      throw new InputException(SourcePosition.ofFile(String.valueOf(file.getFileName())),
          "/version: expected version " + VERSION + " (a single tree; this build does not "
              + "emit ensembles yet) but found version " + ENSEMBLE_VERSION + " (a "
              + ensemble.ensemble() + ")", "pass a model file of a single tree");
    }
    return (SavedModel) model;
  }

  /**
   * Reads a model file of a single tree (version 2) or an ensemble (version 3), checking all of
   * it as {@link #load} does; in an ensemble every tree is checked so, and a boosted tree's
   * weight must be a positive float32 with the weights' float32 sum finite.
   *
   * @throws InputException as {@link #load} does
   */
  public static SavedClassifier loadAny(Path file) throws InputException {
    String name = String.valueOf(file.getFileName());
    JsonNode root;
    String text = "";
    try {
      text = Files.readString(file, StandardCharsets.UTF_8);
      root = MAPPER.readTree(text);
    } catch (StreamConstraintsException e) {
      throw new InputException(tooDeep(name, text), "not a valid Splitwright model file: JSON "
          + "nested more than " + MAX_NESTING + " levels deep", REMEDY);
    } catch (JsonProcessingException e) {
      throw new InputException(position(name, e), "not a valid Splitwright model file: "
          + e.getOriginalMessage().lines().findFirst().orElse("malformed JSON")
              .replaceFirst(" \\(set [A-Za-z_.]+ .*\\)$", "")
              .replaceFirst(" \\(bound as .*$", ""), REMEDY);
    } catch (IOException e) {
      throw new InputException(SourcePosition.ofFile(name),
          "cannot read the model file (" + e.getMessage() + ")",
          "check the path and permissions");
    }
    if (root == null || root.isMissingNode()) {
      throw new InputException(SourcePosition.ofFile(name),
          "not a valid Splitwright model file: the file is empty", REMEDY);
    }
    try {
      return new ModelReader(DecisionTree.MAX_DEPTH).read(root);
    } catch (BadModelException e) {
      throw new InputException(SourcePosition.ofFile(name), e.getMessage(),
          e.remedy().orElse(REMEDY));
    }
  }

  /** Where the nesting first goes past the limit (the parser's exception does not say). */
  private static SourcePosition tooDeep(String name, String text) {
    int depth = 0;
    long line = 1;
    int column = 0;
    boolean inString = false;
    boolean escaped = false;
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      column++;
      if (c == '\n') {
        line++;
        column = 0;
      } else if (inString) {
        inString = escaped || c != '"';
        escaped = !escaped && c == '\\';
      } else if (c == '"') {
        inString = true;
      } else if (c == '{' || c == '[') {
        if (++depth > MAX_NESTING) {
          return SourcePosition.ofCell(name, line, column, "");
        }
      } else if (c == '}' || c == ']') {
        depth--;
      }
    }
    return SourcePosition.ofFile(name);
  }

  private static SourcePosition position(String name, JsonProcessingException e) {
    JsonLocation location = e.getLocation();
    long line = location == null ? 0 : location.getLineNr();
    int column = location == null ? 0 : location.getColumnNr();
    return line < 1 ? SourcePosition.ofFile(name)
        : SourcePosition.ofCell(name, line, Math.max(1, column), "");
  }
}
