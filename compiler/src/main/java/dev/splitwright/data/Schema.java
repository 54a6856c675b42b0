package dev.splitwright.data;

import java.util.HashSet;
import java.util.List;
import java.util.Objects;

/** The input features, in column order, the target column's name and the class labels. */
public record Schema(List<Feature> features, String target, List<String> classes) {

  public Schema {
    features = List.copyOf(Objects.requireNonNull(features, "features"));
    Objects.requireNonNull(target, "target");
    classes = List.copyOf(Objects.requireNonNull(classes, "classes"));
    if (classes.isEmpty()) {
      throw new IllegalArgumentException("a schema needs at least one class");
    }
    if (new HashSet<>(classes).size() != classes.size()) {
      throw new IllegalArgumentException("class labels must be distinct: " + classes);
    }
  }

  public int featureCount() {
    return features.size();
  }

  public int classCount() {
    return classes.size();
  }

  public Feature feature(int index) {
    return features.get(index);
  }

  /** Returns the features' names in column order. */
  public List<String> featureNames() {
    return features.stream().map(Feature::name).toList();
  }
}
