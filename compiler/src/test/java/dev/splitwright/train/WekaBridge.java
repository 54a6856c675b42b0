package dev.splitwright.train;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import weka.core.Attribute;
import weka.core.DenseInstance;
import weka.core.Instance;
import weka.core.Instances;
import weka.core.Utils;

/**
 * Converts between Weka's {@link Instances} and our {@link Dataset} (test scope only: Weka is
 * GPL). Numeric attributes become float32 features, nominal ones categorical codes in Weka's value
 * order, the class attribute the labels; Weka's missing value is NaN.
 */
public final class WekaBridge {
  private WekaBridge() {}

  /** Converts {@code data}, whose class index must be set to a nominal attribute. */
  public static Dataset toDataset(Instances data) {
    Attribute target = data.classAttribute();
    if (!target.isNominal()) {
      throw new IllegalArgumentException("class attribute must be nominal: " + target.name());
    }
    List<Feature> features = new ArrayList<>();
    List<Integer> attributeIndex = new ArrayList<>();
    for (int a = 0; a < data.numAttributes(); a++) {
      if (a == data.classIndex()) {
        continue;
      }
      Attribute attribute = data.attribute(a);
      if (attribute.isNumeric()) {
        features.add(Feature.numeric(attribute.name()));
      } else if (attribute.isNominal()) {
        features.add(Feature.categorical(attribute.name(), values(attribute)));
      } else {
        throw new IllegalArgumentException("unsupported attribute type: " + attribute);
      }
      attributeIndex.add(a);
    }
    Schema schema = new Schema(features, target.name(), values(target));
    float[][] columns = new float[features.size()][data.numInstances()];
    int[] labels = new int[data.numInstances()];
    for (int r = 0; r < data.numInstances(); r++) {
      Instance instance = data.instance(r);
      if (instance.classIsMissing()) {
        throw new IllegalArgumentException("row " + r + " has no class");
      }
      labels[r] = (int) instance.classValue();
      for (int f = 0; f < features.size(); f++) {
        int a = attributeIndex.get(f);
        columns[f][r] = instance.isMissing(a) ? Float.NaN : (float) instance.value(a);
      }
    }
    return Dataset.of(schema, columns, labels);
  }

  /** Converts {@code data} with the class attribute last; values are the float32 values. */
  public static Instances toInstances(Dataset data, String relation) {
    Schema schema = data.schema();
    ArrayList<Attribute> attributes = new ArrayList<>();
    for (Feature feature : schema.features()) {
      attributes.add(
          feature.isCategorical()
              ? new Attribute(feature.name(), new ArrayList<>(feature.categories()))
              : new Attribute(feature.name()));
    }
    attributes.add(new Attribute(schema.target(), new ArrayList<>(schema.classes())));
    Instances out = new Instances(relation, attributes, data.rows());
    out.setClassIndex(attributes.size() - 1);
    for (int r = 0; r < data.rows(); r++) {
      double[] values = new double[attributes.size()];
      for (int f = 0; f < schema.featureCount(); f++) {
        float v = data.value(r, f);
        values[f] = schema.feature(f).isMissing(v) ? Utils.missingValue() : v;
      }
      values[schema.featureCount()] = data.label(r);
      out.add(new DenseInstance(1.0, values));
    }
    return out;
  }

  private static List<String> values(Attribute attribute) {
    List<String> out = new ArrayList<>();
    for (int v = 0; v < attribute.numValues(); v++) {
      out.add(attribute.value(v));
    }
    return Collections.unmodifiableList(out);
  }
}
