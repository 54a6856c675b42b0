package dev.splitwright.emit;

import java.util.List;
import java.util.Objects;

/**
 * What the emitted file says about where it came from: the data file's name (never its path), its
 * SHA-256, the options that reproduce it and one line per score. Nothing here may vary between two
 * runs on the same input, so no time, host or user.
 */
public record HeaderInfo(
    String dataName, String dataSha256, String command, List<String> scoreLines) {

  public HeaderInfo {
    Objects.requireNonNull(dataName, "dataName");
    Objects.requireNonNull(dataSha256, "dataSha256");
    Objects.requireNonNull(command, "command");
    scoreLines = List.copyOf(scoreLines);
  }

  /** A header for trees that did not come from a file, such as hand-built test trees. */
  public static HeaderInfo none() {
    return new HeaderInfo("(none)", "(none)", "(none)", List.of());
  }
}
