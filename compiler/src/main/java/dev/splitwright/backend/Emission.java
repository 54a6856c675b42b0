package dev.splitwright.backend;

import java.util.List;
import java.util.Optional;

/** What an {@link OutputLanguage} emitted for one tree: its files and how they were made. */
public interface Emission {

  /** The files to write, in the order they are written. */
  List<OutputText> files();

  /** The layout kept, as spelled on the command line ({@code branches} or {@code table}). */
  String layout();

  /** The input type, as spelled on the command line. */
  String input();

  /**
   * How {@code --layout smallest} was decided (the layouts' sizes and the one kept), for the
   * report's options; empty where the language reports it elsewhere.
   */
  default Optional<String> layoutChoice() {
    return Optional.empty();
  }

  /** UTF-8 bytes of every file together. */
  default int sourceBytes() {
    return files().stream().mapToInt(OutputText::bytes).sum();
  }
}
