package dev.splitwright.onchip;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CSource;
import dev.splitwright.check.BareMetalImage;
import dev.splitwright.check.BareMetalRun;
import dev.splitwright.check.CCompileException;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.check.LittleEndian;
import dev.splitwright.check.ProcessTimeoutException;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * Proves an emitted C classifier on an emulated Cortex-M core: builds it with {@link
 * BareMetalHarness} for the core, runs the image on qemu over every input and compares each class
 * with the model's prediction and, with probabilities, each float bit pattern with {@link
 * DecisionTree#probabilities} narrowed to float or an ensemble's {@link
 * TreeEnsemble#probabilities}. The build is the one a device would get (the
 * core's compiler flags, libgcc's soft-float helpers on cores without FPU), so a helper or an
 * instruction sequence that treats NaN, signed zeros or a threshold's neighbours differently
 * shows as a mismatch.
 *
 * <p>Instances are immutable and may be shared between threads.
 */
public final class OnChipProver {
  private static final Duration VERSION_LIMIT = Duration.ofSeconds(30);

  private final CortexMToolchain arm;
  private final Duration runLimit;

  /**
   * A prover using {@code arm} to build and run.
   *
   * @param runLimit wall-clock time limit of each emulator run; past it the emulator is killed and
   *     the proof fails with an {@link OnChipProofException}
   */
  public OnChipProver(CortexMToolchain arm, Duration runLimit) {
    this.arm = Objects.requireNonNull(arm, "arm");
    this.runLimit = Objects.requireNonNull(runLimit, "runLimit");
    if (runLimit.isNegative() || runLimit.isZero()) {
      throw new IllegalArgumentException("runLimit must be positive, but it is " + runLimit);
    }
  }

  /**
   * Builds {@code source} for {@code profile} and runs it over {@code inputs}.
   *
   * @param source the emitted classifier, as emitted or deliberately altered
   * @param options the options {@code source} was emitted with
   * @param codeFlags the caller's compiler options, with one optimisation level (see {@link
   *     CortexMProfile#compilerFlags})
   * @param countInstructions whether to count the instructions of each classify call
   * @throws CCompileException if the cross compiler or the linker rejects the sources
   * @throws ProcessTimeoutException if the build runs past the toolchain's time limit
   * @throws OnChipProofException if the emulator runs past {@code runLimit}, the image exits with
   *     an error or a fault, or its output has the wrong length
   */
  public OnChipProof prove(Classifier tree, CSource source, CEmitOptions options,
      ProofInputs inputs, CortexMProfile profile, List<String> codeFlags,
      boolean countInstructions)
      throws CCompileException, ProcessTimeoutException, OnChipProofException {
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(options, "options");
    Objects.requireNonNull(inputs, "inputs");
    Objects.requireNonNull(profile, "profile");
    Objects.requireNonNull(codeFlags, "codeFlags");
    if (inputs.kind() != options.inputKind()) {
      throw new IllegalArgumentException("the classifier takes " + options.inputKind()
          + " input, but the inputs are " + inputs.kind());
    }
    if (inputs.featureCount() != tree.schema().featureCount()) {
      throw new IllegalArgumentException("the inputs have " + inputs.featureCount()
          + " features, the tree " + tree.schema().featureCount());
    }
    if (inputs.size() == 0) {
      throw new IllegalArgumentException("a proof needs at least one input");
    }
    Map<String, String> files = new LinkedHashMap<>();
    files.put(source.headerName(), source.headerText());
    files.put(source.sourceName(), source.sourceText());
    files.put(BareMetalHarness.fileName(options),
        BareMetalHarness.source(options, countInstructions));
    String version = EmulatorVersion.of(arm.emulator(), VERSION_LIMIT);
    try (BareMetalImage image = arm.build(profile, codeFlags, files)) {
      BareMetalRun run;
      try {
        run = image.run(inputs.packed(), runLimit);
      } catch (ProcessTimeoutException e) {
        throw new OnChipProofException("the " + profile.id() + " image did not finish "
            + inputs.size() + " inputs within " + runLimit.toMillis() + " ms on qemu's "
            + profile.machine() + " and was stopped (" + image.emulatorCommand() + ")", e);
      }
      if (!run.succeeded()) {
        throw new OnChipProofException("the " + profile.id() + " image exited with status "
            + run.exitStatus() + (run.faulted() ? " (the core took a fault)" : "") + " on qemu's "
            + profile.machine() + " (" + image.emulatorCommand() + "); console: "
            + run.console().strip());
      }
      int classes = tree.schema().classCount();
      int record = BareMetalHarness.recordWords(options, classes, countInstructions);
      byte[] output = run.output();
      long expected = (long) inputs.size() * record * Integer.BYTES;
      if (output.length != expected) {
        throw new OnChipProofException("the " + profile.id() + " image wrote " + output.length
            + " bytes, expected " + expected + " (" + inputs.size() + " records of " + record
            + " words)");
      }
      int[] words = LittleEndian.unpackInts(output);
      List<String> first = new ArrayList<>();
      int mismatches = 0;
      long[] counts = new long[countInstructions ? inputs.size() : 0];
      for (int r = 0; r < inputs.size(); r++) {
        int at = r * record;
        Optional<String> wrong = compare(tree, options, inputs.modelRow(r), words, at, r);
        if (wrong.isPresent()) {
          mismatches++;
          if (first.size() < OnChipProof.DESCRIBED) {
            first.add(wrong.get());
          }
        }
        if (countInstructions) {
          counts[r] = Integer.toUnsignedLong(words[at + record - 1]);
        }
      }
      Optional<InstructionCounts> instructions = countInstructions
          ? Optional.of(InstructionCounts.of(counts)) : Optional.empty();
      return new OnChipProof(profile.id(), image.compilerFlags(), image.linkFlags(),
          profile.machine(), version, inputs.size(), mismatches, first, instructions,
          image.flashBytes(), run.elapsed());
    }
  }

  /** What is wrong with the record at {@code at}; empty when it matches the model. */
  private static Optional<String> compare(Classifier tree, CEmitOptions options, float[] x,
      int[] words, int at, int row) {
    int expected = tree.predict(x);
    if (words[at] != expected) {
      return Optional.of("row " + row + " " + Arrays.toString(x) + ": class " + words[at]
          + ", model " + expected);
    }
    if (options.probabilities()) {
      float[] p = tree.floatProbabilities(x);
      for (int c = 0; c < p.length; c++) {
        int bits = Float.floatToRawIntBits(p[c]);
        if (words[at + 1 + c] != bits) {
          return Optional.of("row " + row + " " + Arrays.toString(x) + ": p[" + c + "] "
              + Float.intBitsToFloat(words[at + 1 + c]) + ", model " + p[c]);
        }
      }
    }
    return Optional.empty();
  }
}
