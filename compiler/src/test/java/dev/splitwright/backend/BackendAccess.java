package dev.splitwright.backend;

/** Lets tests of other packages (the command line's error handling) make backend failures. */
public final class BackendAccess {
  private BackendAccess() {}

  /** An unfinished on-chip proof with {@code message}, as {@link OnChipStage} throws it. */
  public static RuntimeException unfinishedProof(String message) {
    return new UnfinishedProofException(message, new IllegalStateException("cause"));
  }
}
