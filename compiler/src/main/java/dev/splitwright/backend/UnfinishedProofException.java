package dev.splitwright.backend;

/**
 * A proof of emitted code could not be completed: an emulated image ran past its time limit,
 * took a fault or wrote the wrong amount of output. The code is then not shown to agree with the
 * model, so the run fails as a mismatch does and writes nothing; the message says which core and
 * why.
 */
public final class UnfinishedProofException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  UnfinishedProofException(String message, Throwable cause) {
    super(message, cause);
  }
}
