package dev.splitwright.persist;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.splitwright.data.InputException;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.TreeEnsemble;
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

/** Model files of ensembles (version 3): written, read back equal, and checked as strictly. */
class EnsembleFileTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final String REMEDY = "; pass a file written by --save-model";

  @TempDir Path dir;

  /** ModelFileTest's tree, then the same tree with its categorical split's sides swapped. */
  private static List<DecisionTree> trees() {
    DecisionTree first = ModelFileTest.tree();
    NumericSplit root = (NumericSplit) first.root();
    CategoricalSplit cat = (CategoricalSplit) root.right();
    DecisionTree second = new DecisionTree(first.schema(), root.withChildren(root.left(),
        new CategoricalSplit(1, CategoricalSplit.CodeSet.of(0), true, cat.right(), cat.left(),
            cat.counts())));
    return List.of(first, second);
  }

  private static SavedEnsemble forest() {
    return new SavedEnsemble(TreeEnsemble.forest(trees()), ModelFileTest.TRAINED_ON,
        Map.of("trees", 2));
  }

  private static SavedEnsemble boosted() {
    return new SavedEnsemble(TreeEnsemble.boosted(trees(), new float[] {0.1f, 1.3862944f}),
        ModelFileTest.TRAINED_ON, Map.of("seed", 5));
  }

  @Test
  void aForestAndABoostedEnsembleReadBackEqualAndWriteBackTheSameBytes() throws Exception {
    for (SavedEnsemble model : List.of(forest(), boosted())) {
      Path file = dir.resolve(model.ensemble().kind().fileName() + ".json");
      ModelFile.write(file, model);

      SavedClassifier read = ModelFile.loadAny(file);
      assertThat(read).isEqualTo(model);
      assertThat(ModelFile.toJson(read)).isEqualTo(Files.readString(file));
    }
  }

  @Test
  void weightsAreWrittenAsTheShortestTextAndForestsHaveNone() throws Exception {
    String boosted = ModelFile.toJson(boosted());
    String forest = ModelFile.toJson(forest());

    assertThat(boosted).contains("\"version\" : 3,\n  \"kind\" : \"boosted\"")
        .contains("\"weight\" : \"0.1\"").contains("\"weight\" : \"1.3862944\"");
    assertThat(forest).contains("\"kind\" : \"forest\"").doesNotContain("weight");
  }

  @Test
  void aSingleTreeIsStillWrittenAsVersionTwoAndLoadAnyReadsIt() throws Exception {
    Path file = dir.resolve("tree.json");
    ModelFile.write(file, new SavedModel(ModelFileTest.tree(), ModelFileTest.TRAINED_ON, Map.of()));

    assertThat(Files.readString(file)).contains("\"version\" : 2,").doesNotContain("\"trees\"");
    assertThat(ModelFile.loadAny(file).classifier()).isEqualTo(ModelFileTest.tree());
  }

  @Test
  void theSingleTreeReaderRefusesAnEnsembleWithItsReason() throws Exception {
    Path file = dir.resolve("m.json");
    ModelFile.write(file, forest());

    assertThatThrownBy(() -> ModelFile.load(file)).isInstanceOf(InputException.class)
        .hasMessage("m.json: /version: expected version 2 (a single tree; this build does not "
            + "emit ensembles yet) but found version 3 (a forest of 2 trees); pass a model file "
            + "of a single tree");
  }

  static Stream<Arguments> faults() {
    return Stream.of(
        fault("a kind of ours that is no ensemble", true, d -> d.put("kind", "tree"),
            "/kind: expected 'forest' or 'boosted' but found 'tree'"),
        fault("no kind", true, d -> d.remove("kind"),
            "/kind: expected 'forest' or 'boosted' but found nothing"),
        fault("no trees", true, d -> d.remove("trees"),
            "/trees: expected a list but found nothing"),
        fault("trees not a list", true, d -> d.putObject("trees"),
            "/trees: expected a list but found an object"),
        fault("an empty list of trees", true, d -> d.putArray("trees"),
            "/trees: expected 1 to 4096 trees but found 0 trees"),
        fault("a tree that is not an object", true, d -> trees(d).insertArray(0),
            "/trees/0: expected an object but found a list"),
        fault("a single tree's nodes beside the trees", true, d -> d.putArray("nodes"),
            "/nodes: expected only the members format, version, kind, trainedOn, target, "
                + "classes, features, training, trees but found member 'nodes'"),
        fault("a weight in a forest", false, d -> tree(d, 1).put("weight", "1"),
            "/trees/1/weight: expected only the members nodes but found member 'weight'"),
        fault("a boosted tree without weight", true, d -> tree(d, 0).remove("weight"),
            "/trees/0/weight: expected a string but found nothing"),
        fault("a weight as a JSON number", true, d -> tree(d, 0).put("weight", 0.5),
            "/trees/0/weight: expected a string but found 0.5"),
        fault("a NaN weight", true, d -> tree(d, 0).put("weight", "NaN"),
            "/trees/0/weight: expected a positive decimal number such as 0.75 or 1.5E-3 but "
                + "found 'NaN'"),
        fault("a zero weight", true, d -> tree(d, 1).put("weight", "0"),
            "/trees/1/weight: expected a weight above 0 (the smallest float32 is 1.4E-45) but "
                + "found '0'"),
        fault("a negative weight", true, d -> tree(d, 1).put("weight", "-0.5"),
            "/trees/1/weight: expected a weight above 0 (the smallest float32 is 1.4E-45) but "
                + "found '-0.5'"),
        fault("a weight that rounds to float32 zero", true, d -> tree(d, 0).put("weight", "1e-46"),
            "/trees/0/weight: expected a weight above 0 (the smallest float32 is 1.4E-45) but "
                + "found '1e-46'"),
        fault("a weight beyond float32", true, d -> tree(d, 0).put("weight", "1e39"),
            "/trees/0/weight: expected a number within 32-bit float range but found '1e39'"),
        fault("weights whose float32 sum overflows", true, d -> {
          tree(d, 0).put("weight", "3e38");
          tree(d, 1).put("weight", "3e38");
        }, "/trees/1/weight: expected a weight that keeps the float32 sum of the weights finite "
            + "but found '3e38'"),
        fault("a feature index out of range in the second tree", false,
            d -> node(d, 1, 0).put("feature", 2),
            "/trees/1/nodes/0/feature: expected an integer from 0 to 1 but found 2"),
        fault("counts that do not add up in the second tree", true,
            d -> node(d, 1, 3).putArray("counts").add(2).add(2),
            "/trees/1/nodes/2/counts/0: expected 2, the sum of its children's counts (nodes 3 "
                + "and 4) but found 1"),
        fault("a tree without nodes", false, d -> tree(d, 0).remove("nodes"),
            "/trees/0/nodes: expected a list but found nothing"),
        fault("a tree with no node", false, d -> tree(d, 1).putArray("nodes"),
            "/trees/1/nodes: expected at least one node but found an empty list"),
        fault("a version this build does not know", false, d -> d.put("version", 4),
            "/version: expected version 2 or 3 (the ones this build reads) but found version 4"));
  }

  private static Arguments fault(String name, boolean boosted, Consumer<ObjectNode> edit,
      String message) {
    return Arguments.of(name, boosted, edit, message);
  }

  private static ArrayNode trees(ObjectNode doc) {
    return (ArrayNode) doc.get("trees");
  }

  private static ObjectNode tree(ObjectNode doc, int t) {
    return (ObjectNode) doc.at("/trees/" + t);
  }

  private static ObjectNode node(ObjectNode doc, int t, int index) {
    return (ObjectNode) doc.at("/trees/" + t + "/nodes/" + index);
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("faults")
  void aFaultIsRefusedWithItsPlace(String name, boolean boosted, Consumer<ObjectNode> edit,
      String message) throws Exception {
    ObjectNode doc =
        (ObjectNode) JSON.readTree(ModelFile.toJson(boosted ? boosted() : forest()));
    edit.accept(doc);
    Path file = Files.writeString(dir.resolve("m.json"), JSON.writeValueAsString(doc));

    assertThatThrownBy(() -> ModelFile.loadAny(file)).isInstanceOf(InputException.class)
        .hasMessage("m.json: " + message + REMEDY);
  }
}
