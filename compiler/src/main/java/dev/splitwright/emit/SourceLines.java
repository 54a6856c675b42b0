package dev.splitwright.emit;

import java.util.ArrayList;
import java.util.List;

/**
 * Keeps emitted lines within {@link #MAX_COLUMNS}: wraps comment text, shortens names for short
 * comments and measures text as it will stand in the ASCII-only file, where every non-ASCII
 * character takes the six characters of its unicode escape.
 */
final class SourceLines {
  /** Longest line of an emitted file, as the project's own Checkstyle rule. */
  static final int MAX_COLUMNS = 100;

  private SourceLines() {}

  /** Columns {@code text} takes once {@link JavaText#asciiOnly} has escaped it. */
  static int width(CharSequence text) {
    int n = 0;
    for (int i = 0; i < text.length(); i++) {
      n += text.charAt(i) > 0x7e ? 6 : 1;
    }
    return n;
  }

  /**
   * {@code name} cut to at most {@code max} characters with "..." added when cut, for a short
   * comment; a surrogate pair is never split. The caller escapes the result.
   */
  static String shortName(String name, int max) {
    if (name.length() <= max) {
      return name;
    }
    int end = max - 3;
    if (Character.isHighSurrogate(name.charAt(end - 1))) {
      end--;
    }
    return name.substring(0, end) + "...";
  }

  /**
   * Wraps escaped comment text into lines of at most {@code width} columns. Lines break at
   * spaces; a word longer than a line is cut where a cut is harmless: never inside an escaped
   * backslash pair (its second half would start a live unicode escape on the next line, JLS
   * §3.3), an HTML entity or tag, or a surrogate pair.
   */
  static List<String> wrap(String text, int width) {
    List<String> lines = new ArrayList<>();
    for (String paragraph : text.split("\n", -1)) {
      wrapLine(paragraph, Math.max(width, 16), lines);
    }
    return lines;
  }

  /** {@link #wrap} joined with newlines. */
  static String wrapped(String text, int width) {
    return String.join("\n", wrap(text, width));
  }

  private static void wrapLine(String text, int width, List<String> out) {
    int start = 0;
    while (wider(text, start, width)) {
      // Only the next line's worth of text decides where it breaks: looking at that window, not
      // the whole rest, keeps a megabyte-long word linear instead of quadratic.
      String rest = text.substring(start, Math.min(text.length(), start + width + 2));
      int cut = lastSpaceWithin(rest, width);
      if (cut > 0) {
        out.add(rest.substring(0, cut).stripTrailing());
        start += cut + 1;
        continue;
      }
      cut = lastSafeCutWithin(rest, width);
      if (cut == rest.length() && start + cut < text.length()) {
        // No harmless cut in the window at all: look further, as far as it takes.
        cut = lastSafeCutWithin(text.substring(start), width);
      }
      out.add(text.substring(start, start + cut));
      start += cut;
    }
    out.add(text.substring(start));
  }

  /** Whether {@code text} from {@code start} takes more than {@code width} columns. */
  private static boolean wider(String text, int start, int width) {
    int columns = 0;
    for (int i = start; i < text.length(); i++) {
      columns += text.charAt(i) > 0x7e ? 6 : 1;
      if (columns > width) {
        return true;
      }
    }
    return false;
  }

  /** The index of the last space whose text before it fits {@code width}, or -1. */
  private static int lastSpaceWithin(String text, int width) {
    int columns = 0;
    int best = -1;
    boolean word = false;
    for (int i = 0; i < text.length(); i++) {
      if (text.charAt(i) == ' ' && columns <= width && word) {
        best = i;
      }
      word |= text.charAt(i) != ' ';
      columns += text.charAt(i) > 0x7e ? 6 : 1;
      if (columns > width + 1) {
        break;
      }
    }
    return best;
  }

  /** The last harmless cut whose text before it fits {@code width}; at least 1. */
  private static int lastSafeCutWithin(String text, int width) {
    int columns = 0;
    int best = -1;
    for (int i = 1; i < text.length(); i++) {
      columns += text.charAt(i - 1) > 0x7e ? 6 : 1;
      if (columns > width) {
        break;
      }
      if (safeCut(text, i)) {
        best = i;
      }
    }
    if (best > 0) {
      return best;
    }
    // No harmless cut fits: take the first one, however long the line.
    for (int i = 1; i < text.length(); i++) {
      if (safeCut(text, i)) {
        return i;
      }
    }
    return text.length();
  }

  private static boolean safeCut(String text, int i) {
    char before = text.charAt(i - 1);
    char after = text.charAt(i);
    if (before == '\\' && after == '\\') {
      // Escaped backslashes come in pairs: a cut between two pairs leaves each half even.
      int run = 0;
      for (int j = i - 1; j >= 0 && text.charAt(j) == '\\'; j--) {
        run++;
      }
      return run % 2 == 0;
    }
    if (Character.isHighSurrogate(before) && Character.isLowSurrogate(after)) {
      return false;
    }
    // Inside "&...;" or "<...>": look back for an opener not yet closed.
    for (int j = i - 1; j >= 0 && j >= i - 8; j--) {
      char c = text.charAt(j);
      if (c == ';' || c == '>') {
        break;
      }
      if (c == '&' || c == '<') {
        return false;
      }
    }
    return true;
  }
}
