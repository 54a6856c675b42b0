package dev.splitwright.cgen;

import java.util.HashSet;
import java.util.Locale;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * C identifiers: the file's base name from a class name, and macro names made from user text,
 * unique within one header.
 */
public final class CNames {
  /** Longest part of a macro name made from user text; C99 5.2.4.1 promises 63 significant. */
  static final int MAX_TEXT_LENGTH = 40;

  /** Lower case words joined by single underscores; {@code __} is reserved in C++ (header). */
  private static final Pattern BASE = Pattern.compile("[a-z][a-z0-9]*(_[a-z0-9]+)*");

  private final Set<String> used = new HashSet<>();

  CNames() {}

  /**
   * Returns the snake case of a class name, e.g. {@code PumpStateClassifier} to {@code
   * pump_state_classifier} and {@code HTTPServer2} to {@code http_server2}: a word starts at an
   * upper case letter after a lower case letter or digit, and at the last of a run of upper case
   * letters before a lower case one; other characters than ASCII letters and digits separate words.
   *
   * @throws IllegalArgumentException if no valid base name results
   */
  public static String baseName(String className) {
    StringBuilder out = new StringBuilder();
    boolean pending = false;
    for (int i = 0; i < className.length(); i++) {
      char c = className.charAt(i);
      boolean upper = c >= 'A' && c <= 'Z';
      boolean lower = c >= 'a' && c <= 'z';
      boolean digit = c >= '0' && c <= '9';
      if (!upper && !lower && !digit) {
        pending = true;
        continue;
      }
      if (upper && i > 0) {
        char prev = className.charAt(i - 1);
        boolean prevLowerOrDigit = (prev >= 'a' && prev <= 'z') || (prev >= '0' && prev <= '9');
        boolean prevUpper = prev >= 'A' && prev <= 'Z';
        boolean nextLower = i + 1 < className.length()
            && className.charAt(i + 1) >= 'a' && className.charAt(i + 1) <= 'z';
        pending |= prevLowerOrDigit || (prevUpper && nextLower);
      }
      if (pending && out.length() > 0) {
        out.append('_');
      }
      pending = false;
      out.append(Character.toLowerCase(c));
    }
    String base = out.toString();
    requireBase(base);
    return base;
  }

  /** Checks a base name: lower case ASCII words joined by single underscores, a letter first. */
  static String requireBase(String base) {
    if (!BASE.matcher(base).matches()) {
      throw new IllegalArgumentException("not a C base name (lower case letters, digits and "
          + "single underscores, a letter first): '" + base + "'");
    }
    return base;
  }

  /** Takes {@code name} as used; it must be free. */
  String reserve(String name) {
    if (!used.add(name)) {
      throw new IllegalStateException("name taken twice: " + name);
    }
    return name;
  }

  /**
   * A macro name {@code prefix + TEXT} (for example {@code PUMP_CLASS_BEARING_WEAR}) with TEXT from
   * {@code [A-Z0-9]} runs of {@code text} joined by single underscores, or {@code fallback} when
   * the text has no letter or digit; {@code _2}, {@code _3}... are added until it is unique and not
   * a name that {@code <stdint.h>} reserves (C99 7.26.8: INT or UINT with _MAX, _MIN or _C).
   * The prefix ends with an underscore and starts with a letter, so the name never starts with a
   * digit or an underscore and, being upper case, is never a keyword.
   */
  String macro(String prefix, String text, String fallback) {
    String body = upperWords(text);
    String base = prefix + (body.isEmpty() ? fallback : body);
    String name = base;
    for (int n = 2; used.contains(name) || reservedByStdint(name); n++) {
      name = base + "_" + n;
    }
    used.add(name);
    return name;
  }

  private static boolean reservedByStdint(String name) {
    return (name.startsWith("INT") || name.startsWith("UINT"))
        && (name.endsWith("_MAX") || name.endsWith("_MIN") || name.endsWith("_C"));
  }

  /** The ASCII letters and digits of {@code text} in upper case, other runs as one {@code _}. */
  static String upperWords(String text) {
    StringBuilder out = new StringBuilder();
    boolean pending = false;
    for (int i = 0; i < text.length() && out.length() < MAX_TEXT_LENGTH; i++) {
      char c = text.charAt(i);
      boolean usable = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9');
      if (usable) {
        if (pending && out.length() > 0) {
          out.append('_');
        }
        out.append(Character.toUpperCase(c));
        pending = false;
      } else {
        pending = true;
      }
    }
    return out.toString().toUpperCase(Locale.ROOT);
  }
}
