package dev.splitwright.persist;

import dev.splitwright.data.DataFile;
import dev.splitwright.model.TreeEnsemble;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * What a version 3 model file holds: an ensemble, the data file it was trained on and how it was
 * trained. Reading a file and writing it back gives the same bytes, as for {@link SavedModel}.
 *
 * @param training the options that trained it, in their order (written as they were read)
 */
public record SavedEnsemble(
    TreeEnsemble ensemble, DataFile trainedOn, Map<String, Object> training)
    implements SavedClassifier {

  public SavedEnsemble {
    Objects.requireNonNull(ensemble, "ensemble");
    Objects.requireNonNull(trainedOn, "trainedOn");
    training = Collections.unmodifiableMap(new LinkedHashMap<>(training));
  }

  /** Returns the ensemble. */
  @Override
  public TreeEnsemble classifier() {
    return ensemble;
  }
}
