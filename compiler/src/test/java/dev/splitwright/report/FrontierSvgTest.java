package dev.splitwright.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

class FrontierSvgTest {
  private static final FrontierSvg.Chart CHART = new FrontierSvg.Chart(
      "pump <A&B>.csv", "validation balanced accuracy vs class file size",
      "class file size (bytes)", "validation balanced accuracy", 2048,
      List.of(new FrontierSvg.Dot(1400, 0.2), new FrontierSvg.Dot(1500, 0.7),
          new FrontierSvg.Dot(1600, 0.65), new FrontierSvg.Dot(1900, 0.82),
          new FrontierSvg.Dot(2300, 0.81), new FrontierSvg.Dot(90000, 0.5)),
      List.of(new FrontierSvg.Dot(1400, 0.2), new FrontierSvg.Dot(1500, 0.7),
          new FrontierSvg.Dot(1900, 0.82)),
      new FrontierSvg.Dot(1900, 0.82), 9);

  private static Document parse(String svg) throws Exception {
    DocumentBuilderFactory factory = DocumentBuilderFactory.newInstance();
    factory.setNamespaceAware(true);
    return factory.newDocumentBuilder()
        .parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8)));
  }

  @Test
  void isWellFormedSvgWithEscapedTitleAndLabelledAxes() throws Exception {
    Document svg = parse(FrontierSvg.render(CHART));

    Element root = svg.getDocumentElement();
    assertThat(root.getLocalName()).isEqualTo("svg");
    assertThat(root.getNamespaceURI()).isEqualTo("http://www.w3.org/2000/svg");
    assertThat(svg.getElementsByTagName("title").item(0).getTextContent())
        .isEqualTo("pump <A&B>.csv: validation balanced accuracy vs class file size");
    List<String> texts = texts(svg);
    assertThat(texts).contains("pump <A&B>.csv", "validation balanced accuracy vs class file size",
        "class file size (bytes)",
        "validation balanced accuracy", "budget 2048 B",
        "chosen: 1900 B, 0.8200, 9 leaves");
  }

  @Test
  void drawsEveryCandidateAndTheFrontierAsSteps() throws Exception {
    String text = FrontierSvg.render(CHART);
    Document svg = parse(text);

    // 6 candidates, 3 frontier points, the chosen ring and 3 legend circles.
    assertThat(svg.getElementsByTagName("circle").getLength()).isEqualTo(6 + 3 + 1 + 3);
    NodeList paths = svg.getElementsByTagName("path");
    String frontier = ((Element) paths.item(0)).getAttribute("d");
    assertThat(frontier).matches("M[\\d.]+ [\\d.]+( H[\\d.]+ V[\\d.]+){2} H[\\d.]+");
  }

  @Test
  void eachKindHasItsMarkerAndTheLegendNamesTheKindsDrawn() throws Exception {
    FrontierSvg.Chart chart = new FrontierSvg.Chart("gesture", "validation vs size",
        "class file size (bytes)", "validation balanced accuracy", 8192,
        List.of(new FrontierSvg.Dot(1000, 0.8), new FrontierSvg.Dot(3000, 0.85, "forest"),
            new FrontierSvg.Dot(4000, 0.9, "boosted")),
        List.of(new FrontierSvg.Dot(1000, 0.8), new FrontierSvg.Dot(4000, 0.9, "boosted")),
        new FrontierSvg.Dot(4000, 0.9, "boosted"), 40, 8);
    Document svg = parse(FrontierSvg.render(chart));

    // Circles: the tree candidate and frontier point, the chosen ring, 3 legend circles and the
    // legend's tree marker. Triangles (paths closed with Z): the forest candidate and its legend
    // marker. Squares: the boosted candidate, frontier point and legend marker, beside the legend's
    // over-budget swatch.
    assertThat(svg.getElementsByTagName("circle").getLength()).isEqualTo(2 + 1 + 3 + 1);
    NodeList paths = svg.getElementsByTagName("path");
    int triangles = 0;
    for (int i = 0; i < paths.getLength(); i++) {
      triangles += ((Element) paths.item(i)).getAttribute("d").endsWith("Z") ? 1 : 0;
    }
    assertThat(triangles).isEqualTo(2);
    assertThat(svg.getElementsByTagName("rect").getLength()).isEqualTo(3 + 1 + 2);
    assertThat(texts(svg)).contains("tree", "forest", "boosted",
        "chosen: 4000 B, 0.9000, boosted of 8 trees, 40 leaves");
    // A chart of one kind has no kind legend, as before.
    assertThat(texts(parse(FrontierSvg.render(CHART)))).doesNotContain("tree", "forest");
  }

  @Test
  void axesCoverEveryCandidateAndTheBudgetAndAreZoomedToThem() throws Exception {
    // Scores between 0.90 and 0.97 and sizes between 5000 and 6400: far from zero on both axes.
    FrontierSvg.Chart chart = new FrontierSvg.Chart("far.csv", "s", "size", "score", 4800,
        List.of(new FrontierSvg.Dot(5000, 0.90), new FrontierSvg.Dot(5300, 0.95),
            new FrontierSvg.Dot(6400, 0.93)),
        List.of(new FrontierSvg.Dot(5000, 0.90), new FrontierSvg.Dot(5300, 0.95)),
        new FrontierSvg.Dot(5300, 0.97), 1);
    Document svg = parse(FrontierSvg.render(chart));

    Axis x = Axis.of(svg, "middle");
    Axis y = Axis.of(svg, "end");
    assertThat(x.low()).isLessThanOrEqualTo(4800).isGreaterThan(4000);
    assertThat(x.high()).isGreaterThanOrEqualTo(6400).isLessThan(7500);
    assertThat(y.low()).isLessThanOrEqualTo(0.90).isGreaterThan(0.5);
    assertThat(y.high()).isGreaterThanOrEqualTo(0.97).isLessThanOrEqualTo(1.0);
    assertThat(x.labels()).hasSizeGreaterThanOrEqualTo(3);
    assertThat(y.labels()).hasSizeGreaterThanOrEqualTo(3);
    // Round ticks: every label is a whole multiple of the step between the first two.
    for (Axis axis : List.of(x, y)) {
      double step = axis.values().get(1) - axis.values().get(0);
      for (double v : axis.values()) {
        assertThat(Math.abs(v / step - Math.rint(v / step))).isLessThan(1e-6);
      }
    }
    assertThat(texts(svg)).contains("chosen: 5300 B, 0.9700, 1 leaf");
  }

  /**
   * A value axis read back from the tick labels: the size axis's are centred under the plot, the
   * score axis's right-aligned beside it.
   */
  private record Axis(List<String> labels, List<Double> values) {
    static Axis of(Document svg, String anchor) {
      List<String> labels = new java.util.ArrayList<>();
      NodeList nodes = svg.getElementsByTagName("text");
      for (int i = 0; i < nodes.getLength(); i++) {
        Element e = (Element) nodes.item(i);
        if (e.getAttribute("text-anchor").equals(anchor)
            && e.getTextContent().matches("-?\\d+(\\.\\d+)?")) {
          labels.add(e.getTextContent());
        }
      }
      return new Axis(labels, labels.stream().map(Double::valueOf).toList());
    }

    double low() {
      return values.stream().mapToDouble(Double::doubleValue).min().orElseThrow();
    }

    double high() {
      return values.stream().mapToDouble(Double::doubleValue).max().orElseThrow();
    }
  }

  @Test
  void outputDoesNotDependOnTheDefaultLocale() {
    Locale saved = Locale.getDefault();
    try {
      Locale.setDefault(Locale.GERMANY);
      String german = FrontierSvg.render(CHART);
      Locale.setDefault(Locale.US);
      assertThat(FrontierSvg.render(CHART)).isEqualTo(german);
      assertThat(german).doesNotContain(",5\"").contains("0.8");
    } finally {
      Locale.setDefault(saved);
    }
  }

  @Test
  void ticksAreRoundNumbers() {
    FrontierSvg.Scale scale = FrontierSvg.Scale.of(1313, 2151, 0, 100);
    // Range 838 / 6 = 140 -> step 200 (1, 2 or 5 times a power of ten), from 1200 to 2200.
    assertThat(scale.ticks()).containsExactly(1200.0, 1400.0, 1600.0, 1800.0, 2000.0, 2200.0);
    assertThat(scale.label(1400)).isEqualTo("1400");
    FrontierSvg.Scale scores = FrontierSvg.Scale.of(0.18, 0.84, 0, 100);
    // 0.66 / 6 = 0.11 -> step 0.2, from 0 to 1.
    assertThat(scores.ticks()).hasSize(6);
    assertThat(scores.label(scores.ticks().get(1))).isEqualTo("0.2");
  }

  private static List<String> texts(Document svg) {
    NodeList nodes = svg.getElementsByTagName("text");
    List<String> out = new java.util.ArrayList<>();
    for (int i = 0; i < nodes.getLength(); i++) {
      out.add(nodes.item(i).getTextContent());
    }
    return out;
  }
}
