package dev.splitwright.onchip;

import java.time.Duration;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The outcome of running an emitted C classifier on an emulated Cortex-M core over the
 * verification inputs.
 *
 * @param core the profile's name, e.g. {@code cortex-m0plus}
 * @param compilerFlags every compiler option of the image, in order
 * @param linkFlags every link option of the image, after the sources
 * @param board the qemu machine that ran it, e.g. {@code mps2-an385}
 * @param emulatorVersion the first line of {@code qemu-system-arm --version}
 * @param inputsChecked rows run and compared
 * @param mismatches rows whose class or probability bits differ from the model's
 * @param firstMismatches the first five mismatches described
 * @param instructions instructions per classify call, when counted
 * @param imageFlashBytes flash of the whole proof image (harness and classifier)
 * @param emulatorTime wall-clock time of the emulator process
 */
public record OnChipProof(String core, List<String> compilerFlags, List<String> linkFlags,
    String board, String emulatorVersion, int inputsChecked, int mismatches,
    List<String> firstMismatches, Optional<InstructionCounts> instructions, long imageFlashBytes,
    Duration emulatorTime) {

  /** How many mismatches are described. */
  public static final int DESCRIBED = 5;

  public OnChipProof {
    Objects.requireNonNull(core, "core");
    compilerFlags = List.copyOf(compilerFlags);
    linkFlags = List.copyOf(linkFlags);
    Objects.requireNonNull(board, "board");
    Objects.requireNonNull(emulatorVersion, "emulatorVersion");
    firstMismatches = List.copyOf(firstMismatches);
    Objects.requireNonNull(instructions, "instructions");
    Objects.requireNonNull(emulatorTime, "emulatorTime");
    if (inputsChecked < 0 || mismatches < 0 || mismatches > inputsChecked) {
      throw new IllegalArgumentException("inputsChecked " + inputsChecked + ", mismatches "
          + mismatches);
    }
    if (firstMismatches.size() != Math.min(mismatches, DESCRIBED)) {
      throw new IllegalArgumentException(firstMismatches.size() + " mismatches described, "
          + "expected " + Math.min(mismatches, DESCRIBED));
    }
  }

  /** Whether every input gave the model's answer. */
  public boolean passed() {
    return mismatches == 0;
  }

  /** One line, e.g. {@code cortex-m0plus (mps2-an385): 0 mismatches in 1234 inputs}. */
  public String verdict() {
    String text = core + " (" + board + "): " + mismatches + " mismatches in " + inputsChecked
        + " inputs";
    return firstMismatches.isEmpty() ? text : text + "; " + String.join("; ", firstMismatches);
  }
}
