package dev.splitwright.data;

import java.util.Locale;
import java.util.Objects;

/**
 * A data set read from a CSV file, with what identifies the file.
 *
 * @param sourceName the file's name without any directory, for reports and generated headers
 * @param sha256 the SHA-256 of the file's bytes, lowercase hex
 * @param dataRows data rows read (blank lines are not rows)
 */
public record LoadedData(Dataset dataset, String sourceName, String sha256, long dataRows) {

  public LoadedData {
    Objects.requireNonNull(dataset, "dataset");
    Objects.requireNonNull(sourceName, "sourceName");
    Objects.requireNonNull(sha256, "sha256");
    if (!DataFile.isSha256(sha256)) {
      throw new IllegalArgumentException("sha256 must be 64 lowercase hex digits: " + sha256);
    }
    if (dataRows != dataset.rows()) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT, "dataRows %d but the data set has %d", dataRows, dataset.rows()));
    }
  }

  /** The file's name and SHA-256. */
  public DataFile file() {
    return new DataFile(sourceName, sha256);
  }
}
