package dev.splitwright.job;

import dev.splitwright.data.LoadOptions;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.train.TrainingOptions;
import java.nio.file.Path;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;

/**
 * Everything one compile run needs. Paths are used to read and write only; what is recorded in the
 * outputs is {@link #optionsText}, which names no path, so outputs do not depend on where files
 * are.
 *
 * @param data the labelled CSV; with {@code model} set, only used to report scores and verify
 * @param testData a separate test CSV with the same header, replacing the test fraction
 * @param model a saved model file to emit instead of training
 * @param fractions train, validation and test fractions, summing to 1
 * @param saveModel where to write the model file
 * @param optionsText the options that reproduce the run, without paths, for headers and reports
 * @param dexMinApi measure the emitted class in DEX bytes for this minimum Android API level;
 *     needed for a DEX budget, and empty otherwise keeps D8 unloaded
 * @param ensemble train this ensemble instead of a single tree (never with a budget or a model)
 */
public record CompileRequest(
    Path data,
    Optional<Path> testData,
    Optional<Path> model,
    LoadOptions load,
    double[] fractions,
    long seed,
    TrainingOptions training,
    EmitOptions emit,
    Path outDir,
    Optional<Path> saveModel,
    String optionsText,
    OptionalInt dexMinApi,
    Optional<EnsembleRequest> ensemble) {

  public CompileRequest {
    Objects.requireNonNull(data, "data");
    Objects.requireNonNull(testData, "testData");
    Objects.requireNonNull(model, "model");
    Objects.requireNonNull(load, "load");
    fractions = fractions.clone();
    if (fractions.length != 3) {
      throw new IllegalArgumentException("fractions must be train, validation, test");
    }
    Objects.requireNonNull(training, "training");
    Objects.requireNonNull(emit, "emit");
    Objects.requireNonNull(outDir, "outDir");
    Objects.requireNonNull(saveModel, "saveModel");
    Objects.requireNonNull(optionsText, "optionsText");
    Objects.requireNonNull(dexMinApi, "dexMinApi");
    Objects.requireNonNull(ensemble, "ensemble");
    if (ensemble.isPresent() && model.isPresent()) {
      throw new IllegalArgumentException("an ensemble is trained or read, not both");
    }
  }

  /** A request that trains a single tree (or reads {@code model}). */
  public CompileRequest(Path data, Optional<Path> testData, Optional<Path> model,
      LoadOptions load, double[] fractions, long seed, TrainingOptions training, EmitOptions emit,
      Path outDir, Optional<Path> saveModel, String optionsText, OptionalInt dexMinApi) {
    this(data, testData, model, load, fractions, seed, training, emit, outDir, saveModel,
        optionsText, dexMinApi, Optional.empty());
  }

  /** A request that measures no DEX bytes. */
  public CompileRequest(Path data, Optional<Path> testData, Optional<Path> model,
      LoadOptions load, double[] fractions, long seed, TrainingOptions training, EmitOptions emit,
      Path outDir, Optional<Path> saveModel, String optionsText) {
    this(data, testData, model, load, fractions, seed, training, emit, outDir, saveModel,
        optionsText, OptionalInt.empty(), Optional.empty());
  }

  @Override
  public double[] fractions() {
    return fractions.clone();
  }
}
