package dev.splitwright.report;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.data.Schema;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.model.CategoricalSplit;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

class TreeSvgTest {
  private static final String HOSTILE = "<b>&amp;\"'\u0000\u2028]]>";

  /**
   * speed <= 1.5 (missing right) ? (mode in {auto, spare} (missing left) ? ok : HOSTILE) : HOSTILE.
   * Counts per class [ok, HOSTILE].
   */
  private static DecisionTree small() {
    Schema schema = new Schema(List.of(Feature.numeric("speed"),
        Feature.categorical("mode", List.of("auto", "manual", "spare"))), "state",
        List.of("ok", HOSTILE));
    Node modeSplit = new CategoricalSplit(1, CategoricalSplit.CodeSet.of(0, 2), true,
        new Leaf(0, ClassCounts.of(8, 2)), new Leaf(1, ClassCounts.of(1, 4)),
        ClassCounts.of(9, 6));
    Node root = new NumericSplit(0, 1.5f, false, modeSplit, new Leaf(1, ClassCounts.of(0, 5)),
        ClassCounts.of(9, 11));
    return new DecisionTree(schema, root);
  }

  @Test
  void smallTreeHasOneBoxPerNodeWithItsLabels() throws Exception {
    Document svg = parse(TreeSvg.render(small(), "Pump"));

    assertThat(groups(svg, "split")).hasSize(2);
    assertThat(groups(svg, "leaf")).hasSize(3);
    assertThat(groups(svg, "summary")).isEmpty();
    assertThat(groups(svg, "edge")).hasSize(4);
    assertThat(svg.getElementsByTagName("title").item(0).getTextContent())
        .isEqualTo("Pump: decision tree");

    // Pre-order: speed, mode.
    assertThat(texts(groups(svg, "split").get(0))).containsExactly("speed", "20 rows");
    assertThat(texts(groups(svg, "split").get(1))).containsExactly("mode", "15 rows");
    // Purity is the share of the leaf's class, worked by hand: 8/10, 4/5, 5/5.
    assertThat(texts(groups(svg, "leaf").get(0))).containsExactly("ok", "10 rows, 80.0% pure");
    assertThat(texts(groups(svg, "leaf").get(1))).containsExactly(
        HOSTILE.replace("\u0000", "\\u0000").replace("\u2028", "\\u2028"),
        "5 rows, 80.0% pure");
    assertThat(texts(groups(svg, "leaf").get(2)).get(1)).isEqualTo("5 rows, 100.0% pure");
    // The full hostile label survives escaping, in the leaf's title.
    assertThat(title(groups(svg, "leaf").get(2)))
        .isEqualTo("<b>&amp;\"'\\u0000\\u2028]]>; 5 rows; 100.0% pure");

    // Edges in pre-order of their child: the mode split, its two leaves, the right leaf.
    List<Element> edges = groups(svg, "edge");
    assertThat(edges).extracting(e -> texts(e).get(0))
        .containsExactly("\u2264 1.5", "in {auto, spare}", "not in {auto, spare}", "> 1.5");
    // Missing values: right at the root, left at the mode split; one marker each.
    assertThat(edges).extracting(e -> e.getAttribute("class")).containsExactly(
        "edge left", "edge left missing", "edge right", "edge right missing");
    assertThat(svg.getElementsByTagName("polygon").getLength()).isEqualTo(2 + 1); // + the key
  }

  @Test
  void hostileFeatureNamesStayWellFormed() throws Exception {
    String name = "</text><script>alert(1)</script>&\uD800\uFFFF\u0007";
    Schema schema = new Schema(List.of(Feature.numeric(name)), "y", List.of("a", "b"));
    DecisionTree tree = new DecisionTree(schema, new NumericSplit(0, -0.25f, true,
        new Leaf(0, ClassCounts.of(3, 0)), new Leaf(1, ClassCounts.of(0, 0)),
        ClassCounts.of(3, 0)));

    Document svg = parse(TreeSvg.render(tree, "A&B <C>"));

    assertThat(svg.getElementsByTagName("script").getLength()).isZero();
    assertThat(title(groups(svg, "split").get(0)))
        .startsWith("</text><script>alert(1)</script>&\\ud800\\uffff\\u0007; 3 rows");
    assertThat(texts(groups(svg, "leaf").get(1))).containsExactly("b", "0 rows, purity n/a");
    assertThat(texts(groups(svg, "edge").get(0))).containsExactly("\u2264 -0.25");
  }

  /** depth 9: splits at depth 0..8 down the left side, each right child a leaf. */
  private static DecisionTree chain(int depth) {
    Schema schema = new Schema(List.of(Feature.numeric("x")), "y", List.of("a", "b"));
    Node node = new Leaf(0, ClassCounts.of(2, 0));
    for (int d = depth - 1; d >= 0; d--) {
      int rows = node.counts().total();
      node = new NumericSplit(0, d, false, node, new Leaf(1, ClassCounts.of(0, 1)),
          ClassCounts.of(node.counts().get(0), node.counts().get(1) + 1));
      assertThat(node.counts().total()).isEqualTo(rows + 1);
    }
    return new DecisionTree(schema, node);
  }

  @Test
  void deeperTreesAreDrawnToDepthSixWithTheRestSummarised() throws Exception {
    DecisionTree tree = chain(9);
    Document svg = parse(TreeSvg.render(tree, "Chain"));

    // Worked by hand: splits at depths 0..5 are drawn, each with its right leaf (6 leaves);
    // the split at depth 6 heads a subtree of 3 splits (depths 6, 7, 8) and 4 leaves that
    // 2 + 3 = 5 training rows reach.
    assertThat(groups(svg, "split")).hasSize(6);
    assertThat(groups(svg, "leaf")).hasSize(6);
    assertThat(groups(svg, "summary")).hasSize(1);
    assertThat(texts(groups(svg, "summary").get(0)))
        .containsExactly("subtree: 3 splits", "4 leaves, 5 rows");
    assertThat(title(groups(svg, "summary").get(0)))
        .isEqualTo("subtree: 3 splits, 4 leaves, 5 rows");
    assertThat(texts(groups(svg, "facts").get(0)).get(0))
        .isEqualTo("depth 9, 10 leaves, 9 splits, 11 training rows; drawn to depth 6, dashed "
            + "boxes summarise the subtrees below");
  }

  @Test
  void aTrainedTreeIsDrawnNodeForNode() throws Exception {
    Dataset data = CsvLoader.load(DemoFiles.pump(),
        LoadOptions.builder().target("state").build()).dataset();
    DecisionTree tree = CartTrainer.train(data,
        TrainingOptions.builder().maxDepth(9).minLeaf(5).build());
    assertThat(tree.depth()).isGreaterThan(6);

    for (int drawnDepth : new int[] {3, 6, 20}) {
      Document svg = parse(TreeSvg.render(tree, "Pump", drawnDepth));
      List<String> splitNames = new ArrayList<>();
      List<String> leafLabels = new ArrayList<>();
      int[] summaries = new int[1];
      walk(tree, tree.root(), 0, drawnDepth, splitNames, leafLabels, summaries);

      assertThat(groups(svg, "split")).extracting(g -> texts(g).get(0))
          .containsExactlyElementsOf(splitNames);
      assertThat(groups(svg, "leaf")).extracting(g -> texts(g).get(0))
          .containsExactlyElementsOf(leafLabels);
      assertThat(groups(svg, "summary")).hasSize(summaries[0]);
      assertThat(groups(svg, "edge"))
          .hasSize(splitNames.size() + leafLabels.size() + summaries[0] - 1);
    }
  }

  /** What the picture should hold, from the model alone, in pre-order. */
  private static void walk(DecisionTree tree, Node node, int depth, int drawnDepth,
      List<String> splits, List<String> leaves, int[] summaries) {
    if (node instanceof Split split) {
      if (depth >= drawnDepth) {
        summaries[0]++;
        return;
      }
      splits.add(TreeSvg.shorten(tree.schema().feature(split.feature()).name(), 18));
      walk(tree, split.left(), depth + 1, drawnDepth, splits, leaves, summaries);
      walk(tree, split.right(), depth + 1, drawnDepth, splits, leaves, summaries);
    } else {
      leaves.add(tree.schema().classes().get(((Leaf) node).prediction()));
    }
  }

  @Test
  void equalTreesGiveEqualBytes() {
    assertThat(TreeSvg.render(chain(9), "C")).isEqualTo(TreeSvg.render(chain(9), "C"));
    assertThat(TreeSvg.render(small(), "P")).isEqualTo(TreeSvg.render(small(), "P"));
  }

  private static Document parse(String svg) throws Exception {
    DocumentBuilderFactory factory = DocumentBuilderFactory.newInstance();
    factory.setNamespaceAware(true);
    Document doc = factory.newDocumentBuilder()
        .parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8)));
    assertThat(doc.getDocumentElement().getNamespaceURI()).isEqualTo("http://www.w3.org/2000/svg");
    return doc;
  }

  /** Elements whose class attribute has {@code word} as its first word, in document order. */
  private static List<Element> groups(Document svg, String word) {
    List<Element> out = new ArrayList<>();
    NodeList all = svg.getElementsByTagName("*");
    for (int i = 0; i < all.getLength(); i++) {
      Element e = (Element) all.item(i);
      if (e.getAttribute("class").split(" ")[0].equals(word)) {
        out.add(e);
      }
    }
    return out;
  }

  private static List<String> texts(Element group) {
    List<String> out = new ArrayList<>();
    if (group.getTagName().equals("text")) {
      out.add(group.getTextContent());
    }
    NodeList texts = group.getElementsByTagName("text");
    for (int i = 0; i < texts.getLength(); i++) {
      out.add(texts.item(i).getTextContent());
    }
    return out;
  }

  private static String title(Element group) {
    return group.getElementsByTagName("title").item(0).getTextContent();
  }
}
