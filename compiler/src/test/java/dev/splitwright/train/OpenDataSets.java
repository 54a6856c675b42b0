package dev.splitwright.train;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.LoadOptions;
import java.io.InputStream;
import java.nio.file.Path;
import weka.core.Instances;
import weka.core.converters.ArffLoader;

/**
 * The four shared open data sets (src/test/resources/datasets/README.md has their provenance):
 * three CSV copies loaded by our loader, and German credit from the test-scoped Weka jar.
 */
public final class OpenDataSets {
  /** Inside the Weka jar; see the data sets README. */
  private static final String GERMAN_CREDIT = "/weka/gui/beans/templates/credit-g.arff";

  private OpenDataSets() {}

  /** Loads a data set by key: {@code breast}, {@code pima}, {@code votes} or {@code credit}. */
  public static Dataset load(String key) throws Exception {
    switch (key) {
      case "breast":
        return csv("breast-cancer-wisconsin-diagnostic.csv", "diagnosis");
      case "pima":
        return csv("pima-indians-diabetes-2.csv", "diabetes");
      case "votes":
        return csv("house-votes-84.csv", "Class");
      case "credit":
        ArffLoader loader = new ArffLoader();
        try (InputStream in = Instances.class.getResourceAsStream(GERMAN_CREDIT)) {
          loader.setSource(in);
          Instances instances = loader.getDataSet();
          instances.setClassIndex(instances.attribute("class").index());
          return WekaBridge.toDataset(instances);
        }
      default:
        throw new IllegalArgumentException("no data set " + key);
    }
  }

  private static Dataset csv(String file, String target) throws Exception {
    Path path = Path.of(OpenDataSets.class.getResource("/datasets/" + file).toURI());
    return CsvLoader.load(path, LoadOptions.builder().target(target).build()).dataset();
  }
}
