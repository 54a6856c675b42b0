package dev.splitwright.backend;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CSource;
import dev.splitwright.check.CCompileException;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.check.ProcessTimeoutException;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.InputKind;
import dev.splitwright.model.Classifier;
import dev.splitwright.onchip.OnChipProof;
import dev.splitwright.onchip.OnChipProofException;
import dev.splitwright.onchip.OnChipProver;
import dev.splitwright.onchip.ProofInputs;
import dev.splitwright.report.CompileReport;
import dev.splitwright.verify.BatchVerifier;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.UnaryOperator;

/**
 * The proof of emitted C on emulated Cortex-M cores that follows the host proof ({@code
 * --prove-on}): for each core the files are built with the bare-metal harness and the core's
 * flags, run on qemu over the very inputs the host check used, and every answer is compared with
 * the model ({@link OnChipProver}).
 *
 * <p>Each emulator run has a time limit; past it, or when the image faults, the proof is {@link
 * UnfinishedProofException unfinished}, which fails the run like a mismatch.
 */
public final class OnChipStage {
  private final OnChipProver prover;
  private final List<CortexMProfile> cores;
  private final List<String> codeFlags;
  private final UnaryOperator<CSource> chipSource;

  /**
   * Proofs on {@code cores}, in that order.
   *
   * @param codeFlags the compiler options after the core's own ({@link
   *     CortexMProfile#compilerFlags}), with exactly one optimisation level
   * @param runLimit wall-clock time limit of each emulator run
   */
  public OnChipStage(CortexMToolchain arm, List<CortexMProfile> cores, List<String> codeFlags,
      Duration runLimit) {
    this(arm, cores, codeFlags, runLimit, UnaryOperator.identity());
  }

  /**
   * Test seam: the image of every core is built from {@code chipSource(source)} while the model
   * and the host check see the emitted source, so a test can make the on-chip proof alone fail.
   */
  OnChipStage(CortexMToolchain arm, List<CortexMProfile> cores, List<String> codeFlags,
      Duration runLimit, UnaryOperator<CSource> chipSource) {
    this.prover = new OnChipProver(Objects.requireNonNull(arm, "arm"),
        Objects.requireNonNull(runLimit, "runLimit"));
    this.cores = List.copyOf(cores);
    if (this.cores.isEmpty()) {
      throw new IllegalArgumentException("an on-chip proof needs at least one core");
    }
    this.codeFlags = List.copyOf(codeFlags);
    // Checks the optimisation level now rather than after the host proof.
    this.cores.get(0).compilerFlags(this.codeFlags);
    this.chipSource = Objects.requireNonNull(chipSource, "chipSource");
  }

  /** The cores, in the order they are proved. */
  public List<CortexMProfile> cores() {
    return cores;
  }

  /**
   * Proves {@code source} on each core in turn over {@code inputs}, stopping after the first core
   * with a mismatch.
   *
   * @return the proof of each core run, in order; only the last may have mismatches
   * @throws InputException naming {@code --cflags} if the cross compiler rejects the image
   * @throws UnfinishedProofException if an image runs past the time limit or fails
   */
  List<OnChipProof> prove(Classifier tree, CSource source, CEmitOptions options,
      BatchVerifier.Inputs inputs) throws InputException {
    int features = tree.schema().featureCount();
    ProofInputs chipInputs = inputs.kind() == InputKind.FLOAT
        ? ProofInputs.ofFloats(features, inputs.floats())
        : ProofInputs.ofInts(features, inputs.ints());
    CSource built = chipSource.apply(source);
    List<OnChipProof> proofs = new ArrayList<>();
    for (CortexMProfile core : cores) {
      OnChipProof proof;
      try {
        proof = prover.prove(tree, built, options, chipInputs, core, codeFlags, true);
      } catch (CCompileException e) {
        throw new InputException("cflags", "the proof image for " + core.id()
            + " does not build with " + CortexMToolchain.COMPILER + " "
            + String.join(" ", core.compilerFlags(codeFlags)) + ": " + e.firstErrorLine(),
            "check --cflags; the host compiler accepted the same files");
      } catch (ProcessTimeoutException e) {
        throw new IllegalStateException(e.getMessage(), e);
      } catch (OnChipProofException e) {
        throw new UnfinishedProofException("the proof on " + core.id() + " did not finish: "
            + e.getMessage(), e);
      }
      proofs.add(proof);
      if (!proof.passed()) {
        break;
      }
    }
    return List.copyOf(proofs);
  }

  /** The report's record of {@code proof}. */
  static CompileReport.OnChip reported(OnChipProof proof) {
    return new CompileReport.OnChip(proof.core(), proof.board(), proof.emulatorVersion(),
        proof.compilerFlags(), proof.linkFlags(), proof.inputsChecked(), proof.mismatches(),
        proof.instructions()
            .map(n -> new CompileReport.Instructions(n.best(), n.worst(), n.mean()))
            .orElse(null));
  }
}
