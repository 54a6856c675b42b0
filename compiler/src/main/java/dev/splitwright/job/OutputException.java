package dev.splitwright.job;

import java.io.IOException;

/**
 * An output could not be written. The message is one line saying which file, why, and that earlier
 * outputs were left as they were; the command line prints it as is.
 */
public final class OutputException extends IOException {
  private static final long serialVersionUID = 1L;

  OutputException(String message, Throwable cause) {
    super(message, cause);
  }
}
