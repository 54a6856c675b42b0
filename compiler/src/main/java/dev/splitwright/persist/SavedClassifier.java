package dev.splitwright.persist;

import dev.splitwright.data.DataFile;
import dev.splitwright.model.Classifier;
import java.util.Map;

/**
 * What any model file holds: a single tree ({@link SavedModel}, format version 2) or an ensemble
 * ({@link SavedEnsemble}, version 3), the data file it was trained on, and how it was trained.
 */
public sealed interface SavedClassifier permits SavedModel, SavedEnsemble {

  /** The tree or ensemble. */
  Classifier classifier();

  DataFile trainedOn();

  /** The options that trained it, in their order (written as they were read). */
  Map<String, Object> training();
}
