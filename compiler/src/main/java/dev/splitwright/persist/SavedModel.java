package dev.splitwright.persist;

import dev.splitwright.data.DataFile;
import dev.splitwright.model.DecisionTree;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * What a model file holds: the tree, the data file it was trained on, and how it was trained.
 * Reading a file and writing it back gives the same bytes, so a model passed through
 * {@code --model} keeps naming the data it learned from, not the data it was later scored on.
 *
 * @param training the options that trained it, in their order (written as they were read)
 */
public record SavedModel(DecisionTree tree, DataFile trainedOn, Map<String, Object> training)
    implements SavedClassifier {

  public SavedModel {
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(trainedOn, "trainedOn");
    training = Collections.unmodifiableMap(new LinkedHashMap<>(training));
  }

  /** Returns the tree. */
  @Override
  public DecisionTree classifier() {
    return tree;
  }
}
