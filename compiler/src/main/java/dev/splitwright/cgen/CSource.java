package dev.splitwright.cgen;

import java.nio.charset.StandardCharsets;
import java.util.Objects;

/**
 * One emitted C classifier: the header and the source file, each with its file name (e.g. {@code
 * pump.h}, {@code pump.c}) and text (ASCII, {@code \n} line ends).
 */
public record CSource(String headerName, String headerText, String sourceName,
    String sourceText) {

  public CSource {
    Objects.requireNonNull(headerName, "headerName");
    Objects.requireNonNull(headerText, "headerText");
    Objects.requireNonNull(sourceName, "sourceName");
    Objects.requireNonNull(sourceText, "sourceText");
  }

  /** Bytes of both files as written. */
  public int totalBytes() {
    return headerText.getBytes(StandardCharsets.UTF_8).length
        + sourceText.getBytes(StandardCharsets.UTF_8).length;
  }
}
