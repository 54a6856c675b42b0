package dev.splitwright.job;

import dev.splitwright.data.InputException;
import dev.splitwright.data.IntegerColumns;
import dev.splitwright.data.LoadedData;
import dev.splitwright.emit.InputKind;
import java.nio.file.Path;
import java.util.List;

/** Checks of options that only the loaded data can settle. */
final class DataChecks {
  private DataChecks() {}

  /**
   * Checks the training file: int inputs need whole numbers, class weights must name its classes.
   *
   * @throws InputException naming the offending cell or option
   */
  static void trainingData(CompileRequest request, LoadedData loaded) throws InputException {
    evaluationData(request, request.data(), loaded);
    List<String> classes = loaded.dataset().schema().classes();
    List<String> unknown = request.training().weights().unknownLabels(classes);
    if (!unknown.isEmpty()) {
      throw new InputException("class-weight",
          "no class " + InputException.quote(unknown.get(0)) + " in column "
              + InputException.quote(loaded.dataset().schema().target()) + " of "
              + loaded.sourceName(),
          "name classes among " + String.join(", ", classes));
    }
  }

  /**
   * Checks a file whose rows are scored and verified: with int inputs, every numeric cell must be
   * a whole number, or the scores would describe inputs the device cannot send.
   *
   * @throws InputException naming the offending cell
   */
  static void evaluationData(CompileRequest request, Path file, LoadedData loaded)
      throws InputException {
    if (request.emit().inputKind() == InputKind.INT) {
      IntegerColumns.require(loaded, file, request.load());
    }
  }
}
