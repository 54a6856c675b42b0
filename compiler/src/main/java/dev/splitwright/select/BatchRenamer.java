package dev.splitwright.select;

import dev.splitwright.check.SourceFile;
import dev.splitwright.emit.EmittedSource;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Renames emitted sources so that many candidates of one class can be compiled in one javac run.
 *
 * <p>javac refuses two classes of the same name in one run, so each candidate gets a name of the
 * same length: the package is replaced by {@code Q} and a base-62 number padded to the package's
 * length (or, without a package, the class name is). Names in a class file are stored in modified
 * UTF-8 (JVM Specification §4.4.7), so the ASCII alias is as many characters long as the original
 * takes bytes there; every length, and so the class file's size, stays the same. The alias starts
 * with an upper-case letter, which neither a Java keyword nor a JDK package does.
 */
final class BatchRenamer {
  private static final String DIGITS =
      "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";
  private static final String LETTERS = "ABCDEFGHIJKLMNOPQRSTUVWXYZ";
  private static final Pattern PACKAGE = Pattern.compile("(?m)^package\\s+[^;]+;");
  private static final Pattern CLASS =
      Pattern.compile("(?m)^(?:public\\s+)?(?:final\\s+)?class\\s+([^\\s{]+)");

  private final String packageName;
  private final String className;

  BatchRenamer(String qualifiedName) {
    int dot = qualifiedName.lastIndexOf('.');
    this.packageName = dot < 0 ? "" : qualifiedName.substring(0, dot);
    this.className = dot < 0 ? qualifiedName : qualifiedName.substring(dot + 1);
  }

  /** How many distinct renamer there are: enough for any batch unless the name is very short. */
  int capacity() {
    int length = byteLength();
    if (length == 1) {
      return LETTERS.length();
    }
    double n = Math.pow(DIGITS.length(), length - 1);
    return n >= Integer.MAX_VALUE ? Integer.MAX_VALUE : (int) n;
  }

  /** The source renamed to alias number {@code i}, below {@link #capacity()}. */
  SourceFile alias(EmittedSource source, int i) {
    String name = name(i);
    String text = source.source();
    // Names are matched as spelled in the source, which may use Unicode escapes.
    if (!packageName.isEmpty()) {
      Matcher declaration = PACKAGE.matcher(text);
      if (!declaration.find()) {
        throw new IllegalStateException("no package declaration in the emitted source");
      }
      String renamed = text.substring(0, declaration.start()) + "package " + name + ";"
          + text.substring(declaration.end());
      return new SourceFile(name + "." + className, renamed);
    }
    Matcher declaration = CLASS.matcher(text);
    if (!declaration.find()) {
      throw new IllegalStateException("no class declaration in the emitted source");
    }
    return new SourceFile(name, replaceWord(text, declaration.group(1), name));
  }

  private String renamed() {
    return packageName.isEmpty() ? className : packageName;
  }

  /** Length of the renamed part in modified UTF-8 (JVM Specification §4.4.7). */
  private int byteLength() {
    int bytes = 0;
    for (char c : renamed().toCharArray()) {
      bytes += c >= 1 && c <= 0x7f ? 1 : c <= 0x7ff ? 2 : 3;
    }
    return bytes;
  }

  private String name(int i) {
    int length = byteLength();
    if (i < 0 || i >= capacity()) {
      throw new IllegalArgumentException("alias " + i + " is beyond " + capacity());
    }
    if (length == 1) {
      return String.valueOf(LETTERS.charAt(i));
    }
    char[] out = new char[length];
    out[0] = 'Q';
    int rest = i;
    for (int p = length - 1; p >= 1; p--) {
      out[p] = DIGITS.charAt(rest % DIGITS.length());
      rest /= DIGITS.length();
    }
    return new String(out);
  }

  /** Replaces whole-identifier occurrences of {@code word} (a backslash counts as inside). */
  private static String replaceWord(String text, String word, String replacement) {
    StringBuilder out = new StringBuilder(text.length());
    int from = 0;
    int at;
    while ((at = text.indexOf(word, from)) >= 0) {
      int end = at + word.length();
      boolean whole = (at == 0 || !identifierPart(text.charAt(at - 1)))
          && (end == text.length() || !identifierPart(text.charAt(end)));
      out.append(text, from, at).append(whole ? replacement : word);
      from = end;
    }
    return out.append(text, from, text.length()).toString();
  }

  private static boolean identifierPart(char c) {
    return c == '\\' || Character.isJavaIdentifierPart(c);
  }
}
