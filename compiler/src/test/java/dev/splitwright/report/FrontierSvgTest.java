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
      new FrontierSvg.Dot(1900, 0.82));

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
        "validation balanced accuracy", "budget 2048 B", "chosen: 1900 B, 0.8200");
  }

  @Test
  void drawsEveryCandidateInRangeAndTheFrontierAsSteps() throws Exception {
    String text = FrontierSvg.render(CHART);
    Document svg = parse(text);

    // The size axis runs from 1200 to 2200 (round ticks around the frontier and the budget), so
    // 4 candidates are drawn and 2300 and 90000 are not; then 3 frontier points, the chosen ring
    // and 3 legend circles.
    assertThat(svg.getElementsByTagName("circle").getLength()).isEqualTo(4 + 3 + 1 + 3);
    NodeList paths = svg.getElementsByTagName("path");
    String frontier = ((Element) paths.item(0)).getAttribute("d");
    assertThat(frontier).matches("M[\\d.]+ [\\d.]+( H[\\d.]+ V[\\d.]+){2} H[\\d.]+");
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
