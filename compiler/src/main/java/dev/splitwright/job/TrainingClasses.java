package dev.splitwright.job;

import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadedData;
import dev.splitwright.data.Schema;
import dev.splitwright.data.SourcePosition;
import java.util.Locale;

/** Checks that a training file can give a classifier worth emitting. */
final class TrainingClasses {
  private TrainingClasses() {}

  /**
   * Requires at least two classes: with one, the "classifier" would answer the same whatever its
   * input, which is surely a wrong {@code --target} or a filtered export, not what the user wants.
   *
   * @throws InputException naming the file, the target column and the one class
   */
  static void requireTwo(String fileName, LoadedData loaded) throws InputException {
    Schema schema = loaded.dataset().schema();
    if (schema.classCount() >= 2) {
      return;
    }
    String only = InputException.quote(schema.classes().get(0));
    throw new InputException(SourcePosition.ofFile(fileName),
        String.format(Locale.ROOT, "all %d rows have the same class %s in target column %s",
            loaded.dataRows(), only, InputException.quote(schema.target())),
        "a classifier needs at least two classes (this one would always answer " + only
            + "); check --target, or add rows of the other classes");
  }
}
