package dev.splitwright.emit;

import dev.splitwright.data.DataFile;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What the emitted file says about where it came from: the data file's name (never its path), its
 * SHA-256, the options that reproduce it and one line per score. Nothing here may vary between two
 * runs on the same input, so no time, host or user.
 *
 * @param dataName the file whose rows were scored (and, without {@code trainedOn}, trained on)
 * @param trainedOn the training data of a saved model ({@code --model}), when it was not this run's
 * @param testData a separate test file ({@code --test-data}), if one was scored
 */
public record HeaderInfo(String dataName, String dataSha256, String command,
    List<String> scoreLines, Optional<DataFile> trainedOn, Optional<DataFile> testData) {

  public HeaderInfo {
    Objects.requireNonNull(dataName, "dataName");
    Objects.requireNonNull(dataSha256, "dataSha256");
    Objects.requireNonNull(command, "command");
    scoreLines = List.copyOf(scoreLines);
    Objects.requireNonNull(trainedOn, "trainedOn");
    Objects.requireNonNull(testData, "testData");
  }

  /** A header for a run that trained on the file it scored, with no separate test file. */
  public HeaderInfo(String dataName, String dataSha256, String command, List<String> scoreLines) {
    this(dataName, dataSha256, command, scoreLines, Optional.empty(), Optional.empty());
  }

  /** A header for trees that did not come from a file, such as hand-built test trees. */
  public static HeaderInfo none() {
    return new HeaderInfo("(none)", "(none)", "(none)", List.of());
  }

  /** The file the tree was learned from, which the file comment names. */
  public String origin() {
    return trainedOn.map(DataFile::name).orElse(dataName);
  }

  /**
   * The data files, one plain-text line each: the training data and, for a saved model, separately
   * the data it was scored on but never trained on, so the scores are not read as training scores.
   */
  public List<String> dataLines() {
    List<String> lines = new ArrayList<>();
    if (trainedOn.isPresent()) {
      lines.add("Trained on " + trainedOn.get().name() + ", SHA-256 " + trainedOn.get().sha256()
          + ";");
      lines.add("scored on " + dataName + ", SHA-256 " + dataSha256 + " (not trained on).");
    } else {
      lines.add("Data: " + dataName + ", SHA-256 " + dataSha256 + ".");
    }
    testData.ifPresent(t -> lines.add("Test data: " + t.name() + ", SHA-256 " + t.sha256() + "."));
    return lines;
  }
}
