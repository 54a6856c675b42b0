package dev.splitwright.onchip;

import java.util.List;
import java.util.Objects;

/**
 * What an emitted C classifier costs in flash on one Cortex-M core.
 *
 * <p>{@link #objectFlashBytes} is the classifier's own object file. A core without FPU also calls
 * libgcc's soft-float helpers for each float comparison; {@link #helpers} names those the link
 * pulled in and {@link #helperBytes} is their size. A firmware that already uses float pays the
 * helpers once, for all its code: for it the classifier costs about the object bytes; for a
 * firmware without float it costs about {@link #linkedCost()}.
 *
 * @param core the profile's name, e.g. {@code cortex-m0plus}
 * @param compilerFlags every compiler option, in order
 * @param objectFlashBytes {@code .text*}, {@code .rodata*} and {@code .data*} of the classifier's
 *     object file
 * @param linkedWithout flash of a minimal image whose {@code main} returns 0
 * @param linkedWith flash of the same image whose {@code main} calls the classifier (and its
 *     probabilities and labels when emitted), call site included
 * @param helpers the libgcc functions in the second image that neither the first image nor the
 *     classifier defines, by name
 * @param helperBytes their size in bytes
 */
public record FlashCost(String core, List<String> compilerFlags, long objectFlashBytes,
    long linkedWithout, long linkedWith, List<String> helpers, long helperBytes) {

  public FlashCost {
    Objects.requireNonNull(core, "core");
    compilerFlags = List.copyOf(compilerFlags);
    helpers = List.copyOf(helpers);
    if (objectFlashBytes < 0 || linkedWithout < 0 || linkedWith < linkedWithout
        || helperBytes < 0) {
      throw new IllegalArgumentException("inconsistent sizes: object " + objectFlashBytes
          + ", linked " + linkedWithout + " -> " + linkedWith + ", helpers " + helperBytes);
    }
  }

  /** The flash the classifier adds to the minimal image, helpers and call site included. */
  public long linkedCost() {
    return linkedWith - linkedWithout;
  }
}
