package dev.splitwright.persist;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
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
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Model files: what is written reads back equal; anything else is refused with its place. */
class ModelFileTest {
  private static final ObjectMapper JSON = new ObjectMapper();

  /** A made-up training file; only its form (64 lowercase hex digits) matters here. */
  static final DataFile TRAINED_ON = new DataFile("t.csv", "0123456789abcdef".repeat(4));

  @TempDir Path dir;

  /** Numeric split on "a", then a categorical split on "c" (3 categories), three leaves. */
  static DecisionTree tree() {
    Schema schema = new Schema(List.of(Feature.numeric("a"),
        Feature.categorical("c", List.of("p", "q", "r"))), "label", List.of("x", "y"));
    Node low = new Leaf(0, ClassCounts.of(3, 0));
    Node inP = new Leaf(1, ClassCounts.of(0, 2));
    Node other = new Leaf(0, ClassCounts.of(1, 1));
    Node cat = new CategoricalSplit(1, CategoricalSplit.CodeSet.of(1, 2), false, inP, other,
        ClassCounts.of(1, 3));
    return new DecisionTree(schema,
        new NumericSplit(0, 1.18846831E13f, true, low, cat, ClassCounts.of(4, 3)));
  }

  @Test
  void infiniteThresholdsReadBack() throws Exception {
    // NumericSplit allows them and the emitter writes them (RandomTrees makes such trees).
    for (String t : List.of("Infinity", "-Infinity")) {
      ObjectNode doc = (ObjectNode) JSON.readTree(ModelFile.toJson(tree(), TRAINED_ON, Map.of()));
      node(doc, 0).put("threshold", t);
      Path file = Files.writeString(dir.resolve("m.json"), JSON.writeValueAsString(doc));

      DecisionTree read = ModelFile.read(file);
      assertThat(((NumericSplit) read.root()).threshold()).isEqualTo(Float.parseFloat(t));
      assertThat(ModelFile.toJson(read, TRAINED_ON, Map.of()))
          .contains("\"threshold\" : \"" + t + "\"");
    }
  }

  @Test
  void aSplitWithNoCodesOnTheLeftIsValid() throws Exception {
    // The trainer makes such splits: missing values left, every present code right
    // (DeterminismTest found one in a trained tree).
    ObjectNode doc = (ObjectNode) JSON.readTree(ModelFile.toJson(tree(), TRAINED_ON, Map.of()));
    codes(doc);
    node(doc, 2).put("missing", "left");
    Path file = Files.writeString(dir.resolve("m.json"), JSON.writeValueAsString(doc));

    Node split = ((NumericSplit) ModelFile.read(file).root()).right();
    assertThat(((CategoricalSplit) split).leftCodes().size()).isZero();
  }

  @Test
  void aWrittenModelReadsBackEqualWithItsThresholdExact() throws Exception {
    Path file = dir.resolve("m.json");
    ModelFile.write(file, new SavedModel(tree(), TRAINED_ON, Map.of("seed", 1)));

    assertThat(ModelFile.read(file)).isEqualTo(tree());
    // Shortest text, not JDK 17's 1.18846831E13 (see DecimalTextTest).
    assertThat(Files.readString(file)).contains("\"threshold\" : \"1.1884683E13\"");
  }

  static Stream<Arguments> faults() {
    return Stream.of(
        fault("category code equal to the number of categories",
            d -> codes(d, 1, 3),
            "/nodes/2/leftCodes/1: expected an integer from 0 to 2 but found 3"),
        fault("category code above 64", d -> codes(d, 1, 70), "/nodes/2/leftCodes/1", "found 70"),
        fault("negative category code", d -> codes(d, -1, 2), "/nodes/2/leftCodes/0", "found -1"),
        fault("repeated category code", d -> codes(d, 1, 1),
            "/nodes/2/leftCodes/1: expected codes in ascending order without repeats"),
        fault("feature index out of range", d -> node(d, 0).put("feature", 2),
            "/nodes/0/feature: expected an integer from 0 to 1 but found 2"),
        fault("fractional feature index", d -> node(d, 0).put("feature", 0.5),
            "/nodes/0/feature", "found 0.5"),
        fault("feature index as text", d -> node(d, 0).put("feature", "0"),
            "/nodes/0/feature", "found '0'"),
        fault("class index out of range", d -> node(d, 1).put("predict", 2),
            "/nodes/1/predict: expected an integer from 0 to 1 but found 2"),
        fault("NaN threshold", d -> node(d, 0).put("threshold", "NaN"),
            "/nodes/0/threshold: expected a decimal number", "found 'NaN'"),
        fault("lower-case infinity", d -> node(d, 0).put("threshold", "infinity"),
            "/nodes/0/threshold: expected a decimal number"),
        fault("threshold beyond float range", d -> node(d, 0).put("threshold", "3.5e38"),
            "/nodes/0/threshold: expected a number within 32-bit float range"),
        fault("threshold as a JSON number", d -> node(d, 0).put("threshold", 0.5),
            "/nodes/0/threshold: expected a string but found 0.5"),
        fault("threshold on a categorical feature", d -> node(d, 2).put("threshold", "1.0"),
            "/nodes/2/threshold: expected 'leftCodes' for categorical feature 'c'"),
        fault("negative count", d -> counts(d, 3, -1, 0), "/nodes/3/counts/0",
            "found -1"),
        fault("counts that do not add up", d -> counts(d, 3, 2, 2),
            "/nodes/2/counts/0: expected 3, the sum of its children's counts (nodes 3 and 4)"),
        fault("one count too few", d -> counts(d, 3, 0), "/nodes/3/counts: expected one count "
            + "per class (2) but found 1 counts"),
        fault("no classes", d -> d.putArray("classes"), "/classes: expected at least 1 entry"),
        fault("a class twice", d -> d.putArray("classes").add("x").add("x"),
            "/classes/1: expected a value not listed before but found 'x' again"),
        fault("a category twice", d -> ((ObjectNode) d.at("/features/1")).putArray("categories")
            .add("p").add("p").add("r"), "/features/1/categories/1"),
        fault("unknown feature kind", d -> ((ObjectNode) d.at("/features/0")).put("kind", "text"),
            "/features/0/kind: expected 'numeric' or 'categorical' but found 'text'"),
        fault("unknown member", d -> node(d, 1).put("weight", 1),
            "/nodes/1/weight: expected only the members"),
        fault("a leaf with a split member", d -> node(d, 1).put("left", 2),
            "/nodes/1/left: expected no split members on a leaf"),
        fault("a child before its parent", d -> node(d, 2).put("left", 1),
            "/nodes/2/left: expected an integer from 3 to 4 but found 1"),
        fault("a child shared by two splits", d -> node(d, 0).put("right", 1),
            "/nodes/0/right: expected a node that no other split has as a child"),
        fault("missing side neither left nor right", d -> node(d, 0).put("missing", "up"),
            "/nodes/0/missing: expected 'left' or 'right' but found 'up'"),
        fault("a node no split refers to", d -> nodes(d).addObject().put("predict", 0)
            .putArray("counts").add(0).add(0), "/nodes/5: expected a node that some split has"),
        fault("a split as the last node", d -> nodes(d).add(nodes(d).get(0).deepCopy()),
            "/nodes/5: expected a leaf"),
        fault("no nodes", d -> d.putArray("nodes"), "/nodes: expected at least one node"),
        fault("wrong format", d -> d.put("format", "other"),
            "/format: expected 'splitwright-model' but found 'other'"),
        fault("wrong version", d -> d.put("version", 4),
            "/version: expected version 2 or 3 (the ones this build reads) but found version 4"),
        fault("no training data", d -> d.remove("trainedOn"),
            "/trainedOn: expected an object with the members name, sha256 but found nothing"),
        fault("training data without its SHA-256",
            d -> ((ObjectNode) d.get("trainedOn")).remove("sha256"),
            "/trainedOn/sha256: expected a string but found nothing"),
        fault("a SHA-256 in upper case", d -> ((ObjectNode) d.get("trainedOn"))
            .put("sha256", "0123456789ABCDEF".repeat(4)),
            "/trainedOn/sha256: expected 64 lowercase hex digits"),
        fault("a SHA-256 one digit short", d -> ((ObjectNode) d.get("trainedOn"))
            .put("sha256", "0".repeat(63)), "/trainedOn/sha256: expected 64 lowercase hex digits"),
        fault("training data with another member", d -> ((ObjectNode) d.get("trainedOn"))
            .put("path", "/home"), "/trainedOn/path: expected only the members name, sha256"),
        fault("missing target", d -> d.remove("target"),
            "/target: expected a string but found nothing"),
        fault("training not an object", d -> d.put("training", 3),
            "/training: expected an object but found 3"));
  }

  private static Arguments fault(String name, Consumer<ObjectNode> edit, String... mentions) {
    return Arguments.of(name, edit, List.of(mentions));
  }

  private static ObjectNode node(ObjectNode doc, int index) {
    return (ObjectNode) doc.at("/nodes/" + index);
  }

  private static ArrayNode nodes(ObjectNode doc) {
    return (ArrayNode) doc.get("nodes");
  }

  private static void codes(ObjectNode doc, int... codes) {
    ArrayNode array = node(doc, 2).putArray("leftCodes");
    for (int c : codes) {
      array.add(c);
    }
  }

  private static void counts(ObjectNode doc, int index, int... counts) {
    ArrayNode array = node(doc, index).putArray("counts");
    for (int c : counts) {
      array.add(c);
    }
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("faults")
  void aFaultIsRefusedWithItsPlace(String name, Consumer<ObjectNode> edit, List<String> mentions)
      throws Exception {
    ObjectNode doc = (ObjectNode) JSON.readTree(ModelFile.toJson(tree(), TRAINED_ON, Map.of()));
    edit.accept(doc);
    Path file = Files.writeString(dir.resolve("m.json"), JSON.writeValueAsString(doc));

    assertThatThrownBy(() -> ModelFile.read(file)).isInstanceOf(InputException.class)
        .hasMessageStartingWith("m.json: /")
        .hasMessageContainingAll(mentions.toArray(new String[0]))
        .hasMessageEndingWith("; pass a file written by --save-model");
  }

  @Test
  void aVersionOneFileIsRefusedBecauseItDoesNotNameItsTrainingData() throws Exception {
    ObjectNode doc = (ObjectNode) JSON.readTree(ModelFile.toJson(tree(), TRAINED_ON, Map.of()));
    doc.put("version", 1);
    doc.remove("trainedOn");
    Path file = Files.writeString(dir.resolve("m.json"), JSON.writeValueAsString(doc));

    assertThatThrownBy(() -> ModelFile.read(file)).isInstanceOf(InputException.class)
        .hasMessage("m.json: /version: expected version 2 (version 1 files do not record the data "
            + "the model was trained on) but found version 1; train it again with compile "
            + "--save-model, which records its training data");
  }

  @Test
  void readingAndWritingBackGivesTheSameBytes() throws Exception {
    Path file = dir.resolve("m.json");
    ModelFile.write(file, new SavedModel(tree(), TRAINED_ON,
        Map.of("command", "compile --data t.csv", "seed", 7L)));

    assertThat(ModelFile.toJson(ModelFile.load(file))).isEqualTo(Files.readString(file));
    assertThat(ModelFile.load(file).trainedOn()).isEqualTo(TRAINED_ON);
  }

  /** A chain of {@code depth} numeric splits, each with a leaf on its right, in pre-order. */
  static String chain(int depth) {
    StringBuilder nodes = new StringBuilder();
    // Node 2i is the split at level i (its left child 2i+2 or the last leaf), 2i+1 its right leaf.
    for (int level = 0; level < depth; level++) {
      int below = depth - level;
      nodes.append("{\"feature\":0,\"threshold\":\"").append(level).append(".5\",\"missing\":")
          .append("\"left\",\"left\":").append(2 * level + 2).append(",\"right\":")
          .append(2 * level + 1).append(",\"counts\":[1,").append(below).append("]},")
          .append("{\"predict\":1,\"counts\":[0,1]},");
    }
    nodes.setLength(nodes.length() - 1);
    return "{\"format\":\"splitwright-model\",\"version\":2,\"trainedOn\":{\"name\":"
        + "\"t.csv\",\"sha256\":\"" + "0".repeat(64) + "\"},\"target\":\"label\","
        + "\"classes\":[\"x\",\"y\"],\"features\":[{\"name\":\"a\",\"kind\":\"numeric\"}],"
        + "\"nodes\":[" + nodes + ",{\"predict\":0,\"counts\":[1,0]}]}";
  }

  @Test
  void aTreeAtTheDepthCapIsReadAndOneLevelMoreIsRefused() throws Exception {
    Path ok = Files.writeString(dir.resolve("ok.json"), chain(DecisionTree.MAX_DEPTH));
    Path deep = Files.writeString(dir.resolve("deep.json"), chain(DecisionTree.MAX_DEPTH + 1));

    assertThat(ModelFile.read(ok).depth()).isEqualTo(100);
    assertThatThrownBy(() -> ModelFile.read(deep)).isInstanceOf(InputException.class)
        .hasMessage("deep.json: /nodes/201: expected a tree at most 100 levels deep but found a "
            + "node at depth 101; pass a file written by --save-model");
  }

  @Test
  void aTreeThousandsOfLevelsDeepIsRefusedWithoutRecursing() throws Exception {
    Path deep = Files.writeString(dir.resolve("deep.json"), chain(5_000));

    // Before: the command line died of a StackOverflowError (exit 3).
    assertThatThrownBy(() -> ModelFile.read(deep)).isInstanceOf(InputException.class)
        .hasMessageContaining("deep.json: /nodes/201: expected a tree at most 100 levels deep");
  }

  @Test
  void jsonNestedThousandsOfLevelsIsRefusedAtThePlaceItGoesTooDeep() throws IOException {
    String text = "{\"training\":{\"x\":" + "[".repeat(5_000) + "]".repeat(5_000) + "}}";
    Path file = Files.writeString(dir.resolve("nested.json"), text);

    // 17 characters, then the 31st '[' is the 33rd level, one past ModelFile.MAX_NESTING = 32.
    assertThatThrownBy(() -> ModelFile.read(file)).isInstanceOf(InputException.class)
        .hasMessage("nested.json:1:48: not a valid Splitwright model file: JSON nested more than "
            + "32 levels deep; pass a file written by --save-model");
  }

  @Test
  void aDuplicateMemberIsRefused() throws IOException {
    Path file = Files.writeString(dir.resolve("dup.json"),
        "{\"format\":\"splitwright-model\",\"format\":\"splitwright-model\"}");

    assertThatThrownBy(() -> ModelFile.read(file)).isInstanceOf(InputException.class)
        .hasMessageStartingWith("dup.json:1:").hasMessageContaining("Duplicate field 'format'");
  }
}
