package dev.splitwright.onchip;

/**
 * The proof image did not give an answer to check: the emulator ran past its time limit, the
 * image exited with an error or a fault, or its output had the wrong length. The message says
 * which, with the emulator command and its console.
 */
public final class OnChipProofException extends Exception {
  private static final long serialVersionUID = 1L;

  OnChipProofException(String message) {
    super(message);
  }

  OnChipProofException(String message, Throwable cause) {
    super(message, cause);
  }
}
