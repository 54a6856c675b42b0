package dev.splitwright.bench;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.ArrayList;
import weka.core.Attribute;
import weka.core.DenseInstance;
import weka.core.Instance;
import weka.core.Instances;
import weka.core.Utils;

/**
 * Converts our float32 tables to Weka's {@link Instances}: same columns in the same order, the
 * class last; NaN becomes Weka's missing value, categorical codes become nominal value indices.
 */
final class WekaData {
  private WekaData() {}

  /** An empty table with the attributes of {@code schema}, class attribute set. */
  static Instances header(Schema schema, String relation, int capacity) {
    ArrayList<Attribute> attributes = new ArrayList<>(schema.featureCount() + 1);
    for (Feature f : schema.features()) {
      attributes.add(f.isCategorical()
          ? new Attribute(f.name(), new ArrayList<>(f.categories()))
          : new Attribute(f.name()));
    }
    attributes.add(new Attribute(schema.target(), new ArrayList<>(schema.classes())));
    Instances data = new Instances(relation, attributes, capacity);
    data.setClassIndex(schema.featureCount());
    return data;
  }

  /** All rows of {@code data}, labels included. */
  static Instances of(Dataset data, String relation) {
    Instances out = header(data.schema(), relation, data.rows());
    for (int r = 0; r < data.rows(); r++) {
      Instance row = instance(out, data.row(r));
      row.setClassValue(data.label(r));
      out.add(row);
    }
    return out;
  }

  /** One unlabelled input row attached to {@code header}, as a caller would build it. */
  static Instance instance(Instances header, float[] x) {
    double[] values = new double[x.length + 1];
    for (int f = 0; f < x.length; f++) {
      values[f] = Float.isNaN(x[f]) ? Utils.missingValue() : x[f];
    }
    values[x.length] = Utils.missingValue();
    Instance row = new DenseInstance(1.0, values);
    row.setDataset(header);
    return row;
  }
}
