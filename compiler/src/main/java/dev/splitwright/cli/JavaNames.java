package dev.splitwright.cli;

import dev.splitwright.data.InputException;
import java.nio.charset.StandardCharsets;
import java.util.Locale;
import java.util.Set;
import javax.lang.model.SourceVersion;

/**
 * Checks {@code --package} and {@code --class} before any work starts, so that a name javac, the
 * class loader or the file system would refuse is an option error that says what to do, not a
 * failure after training.
 */
final class JavaNames {
  /**
   * Longest class name accepted: {@code <Class>.report.json} must stay under the 255-byte file
   * name limit of ext4, NTFS and APFS (from memory), with room to spare.
   */
  static final int MAX_CLASS_NAME_BYTES = 200;

  // Java 17 forbids these as type names although they are not keywords (JLS 17 §3.9, §8.1).
  private static final Set<String> RESTRICTED_TYPE_NAMES =
      Set.of("var", "yield", "record", "sealed", "permits");

  private JavaNames() {}

  /**
   * Checks a package name; the empty name (no package) is allowed.
   *
   * @throws InputException naming {@code --package} and what to do
   */
  static void checkPackage(String name) throws InputException {
    if (name.isEmpty()) {
      return;
    }
    String shown = InputException.quote(name);
    String[] parts = name.split("\\.", -1);
    for (String part : parts) {
      if (part.isEmpty()) {
        throw bad("package", shown + " has an empty part (a leading, trailing or doubled dot)",
            "write dot-separated identifiers such as com.example.pump");
      }
      if (SourceVersion.isKeyword(part)) {
        throw bad("package", shown + " contains " + InputException.quote(part)
            + ", a reserved word of Java", "rename that part, e.g. to " + part + "_");
      }
      if (!SourceVersion.isIdentifier(part)) {
        throw bad("package", shown + " contains " + InputException.quote(part)
            + ", which is not a Java identifier (it must start with a letter, '_' or '$' and hold"
            + " only letters, digits, '_' and '$')", "write dot-separated identifiers such as"
            + " com.example.pump");
      }
    }
    if (parts[0].equals("java")) {
      throw bad("package", shown + " is under 'java', which the JVM reserves for the JDK and"
          + " refuses to load", "use your own package, such as com.example.pump");
    }
  }

  /**
   * Checks a simple class name.
   *
   * @throws InputException naming {@code --class} and what to do
   */
  static void checkClass(String name) throws InputException {
    String shown = InputException.quote(name);
    String remedy = "choose a name such as PumpClassifier";
    if (SourceVersion.isKeyword(name)) {
      throw bad("class", shown + " is a reserved word of Java", remedy);
    }
    if (!SourceVersion.isIdentifier(name)) {
      throw bad("class", shown + " is not a Java identifier (it must start with a letter, '_' or"
          + " '$' and hold only letters, digits, '_' and '$')", remedy);
    }
    if (RESTRICTED_TYPE_NAMES.contains(name)) {
      throw bad("class", shown + " cannot name a class in Java 17 (a restricted identifier)",
          remedy);
    }
    if (isJavaLangType(name)) {
      throw bad("class", shown + " would hide java.lang." + name + ", which generated code may"
          + " use", remedy);
    }
    int bytes = name.getBytes(StandardCharsets.UTF_8).length;
    if (bytes > MAX_CLASS_NAME_BYTES) {
      throw bad("class", String.format(Locale.ROOT, "the name is %d bytes long, more than %d;"
          + " its files would pass the 255-byte file name limit of common file systems", bytes,
          MAX_CLASS_NAME_BYTES), "choose a shorter name");
    }
  }

  private static boolean isJavaLangType(String simpleName) {
    try {
      // The boot loader, without initialising: only asks whether java.base has the type.
      Class.forName("java.lang." + simpleName, false, null);
      return true;
    } catch (ClassNotFoundException | LinkageError e) {
      return false;
    }
  }

  private static InputException bad(String option, String problem, String remedy) {
    return new InputException(option, problem, remedy);
  }
}
