package dev.splitwright.backend;

import java.util.List;

/** What an {@link OutputLanguage} emitted for one tree: its files and how they were made. */
public interface Emission {

  /** The files to write, in the order they are written. */
  List<OutputText> files();

  /** The layout kept, as spelled on the command line ({@code branches} or {@code table}). */
  String layout();

  /** The input type, as spelled on the command line. */
  String input();

  /** UTF-8 bytes of every file together. */
  default int sourceBytes() {
    return files().stream().mapToInt(OutputText::bytes).sum();
  }
}
