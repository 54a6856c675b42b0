package dev.splitwright.emit;

import com.palantir.javapoet.NameAllocator;
import java.util.Locale;

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

  /** A constant name such as {@code CLASS_BEARING_WEAR}, unique within {@code names}. */
  static String constant(NameAllocator names, String prefix, String text, Object tag) {
    return names.newName(prefix + ascii(text, "").toUpperCase(Locale.ROOT), tag);
  }

  /** A lower camel case name such as {@code vibrationRmsMmS}, unique within {@code names}. */
  static String parameter(NameAllocator names, String text, Object tag) {
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
    // NameAllocator prefixes a digit start with '_' and suffixes keywords and repeats.
    return names.newName(out.toString(), tag);
  }
}
