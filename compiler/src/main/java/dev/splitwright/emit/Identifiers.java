package dev.splitwright.emit;

import java.util.Set;
import javax.lang.model.SourceVersion;

/** Makes ASCII Java identifiers out of user text such as column headers and class labels. */
final class Identifiers {
  /** Longest identifier made; the original text stays in the string tables. */
  static final int MAX_LENGTH = 48;

  private Identifiers() {}

  /**
   * Reduces {@code text} to {@code [A-Za-z0-9_]}, runs of other characters becoming one underscore,
   * cut at {@link #MAX_LENGTH} characters; {@code fallback} stands in for text with no usable
   * character.
   */
  static String ascii(String text, String fallback) {
    StringBuilder out = new StringBuilder(Math.min(text.length(), MAX_LENGTH));
    boolean pendingUnderscore = false;
    for (int i = 0; i < text.length() && out.length() < MAX_LENGTH; i++) {
      char c = text.charAt(i);
      boolean usable = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9');
      if (usable) {
        if (pendingUnderscore && out.length() > 0) {
          out.append('_');
        }
        out.append(c);
        pendingUnderscore = false;
      } else {
        pendingUnderscore = true;
      }
    }
    return out.length() == 0 ? fallback : out.toString();
  }

  /** Longest parameter name before a repeat's number: a call still wraps within a line. */
  static final int MAX_PARAMETER_LENGTH = 32;

  /**
   * A lower camel case name such as {@code vibrationRmsMmS}, not in {@code used} and not a
   * keyword; a repeat gets a number ({@code speed2}), so many similar names stay short. The name
   * is added to {@code used}.
   */
  static String parameter(Set<String> used, String text) {
    String[] words = ascii(text, "feature").split("_");
    StringBuilder out = new StringBuilder();
    for (String word : words) {
      if (word.isEmpty()) {
        continue;
      }
      if (out.length() == 0) {
        out.append(Character.toLowerCase(word.charAt(0))).append(word.substring(1));
      } else {
        out.append(Character.toUpperCase(word.charAt(0))).append(word.substring(1));
      }
    }
    String base = out.length() <= MAX_PARAMETER_LENGTH ? out.toString()
        : out.substring(0, MAX_PARAMETER_LENGTH);
    if (Character.isDigit(base.charAt(0))) {
      base = "_" + base;
    }
    if (SourceVersion.isKeyword(base)) {
      base = base + "_";
    }
    String name = base;
    for (int n = 2; !used.add(name); n++) {
      name = base + n;
    }
    return name;
  }
}
