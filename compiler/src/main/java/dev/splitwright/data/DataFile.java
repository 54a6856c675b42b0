package dev.splitwright.data;

import java.util.Objects;

/**
 * A data file as outputs name it: its name without any directory and the SHA-256 of its bytes, so
 * a reader can tell which file it was without the path of the machine that read it.
 *
 * @param sha256 lowercase hex
 */
public record DataFile(String name, String sha256) {

  public DataFile {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(sha256, "sha256");
    if (!isSha256(sha256)) {
      throw new IllegalArgumentException("sha256 must be 64 lowercase hex digits: " + sha256);
    }
  }

  /** True for 64 lowercase hex digits, the form of {@link #sha256}. */
  public static boolean isSha256(String text) {
    return text.matches("[0-9a-f]{64}");
  }
}
