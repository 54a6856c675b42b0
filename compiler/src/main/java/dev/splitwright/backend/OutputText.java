package dev.splitwright.backend;

import java.nio.charset.StandardCharsets;
import java.util.Objects;

/**
 * One file an output language writes.
 *
 * @param path the path below the output directory, with {@code /} separators
 * @param text the file's text, written as UTF-8
 */
public record OutputText(String path, String text) {

  public OutputText {
    Objects.requireNonNull(path, "path");
    Objects.requireNonNull(text, "text");
    if (path.isEmpty() || path.startsWith("/") || path.contains("..")) {
      throw new IllegalArgumentException("path must be relative and plain: " + path);
    }
  }

  /** UTF-8 bytes of the text. */
  public int bytes() {
    return text.getBytes(StandardCharsets.UTF_8).length;
  }
}
