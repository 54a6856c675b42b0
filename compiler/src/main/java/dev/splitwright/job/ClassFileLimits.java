package dev.splitwright.job;

import dev.splitwright.check.CompilationException;
import dev.splitwright.check.CompileDiagnostic;
import dev.splitwright.data.InputException;
import dev.splitwright.data.SourcePosition;
import dev.splitwright.model.DecisionTree;
import java.util.List;
import java.util.Locale;

/**
 * Tells a classifier too large for one class file apart from a bug in the emitter: javac reports
 * the class file format's limits (64 KiB of code per method, 65535 constants, 65535-byte strings;
 * JVM Specification §4.4, §4.7.3, §4.11) with these messages (javac 17, root locale).
 */
final class ClassFileLimits {
  private static final List<String> LIMIT_MESSAGES = List.of("code too large",
      "too many constants", "constant string too long", "is too long for the constant pool",
      "too many parameters", "too many local variables");

  private ClassFileLimits() {}

  /** Tells whether every error javac reported is a class file limit. */
  static boolean exceeded(CompilationException e) {
    List<CompileDiagnostic> errors = e.errors();
    return !errors.isEmpty() && errors.stream().allMatch(d -> isLimit(d.message()));
  }

  private static boolean isLimit(String message) {
    return LIMIT_MESSAGES.stream().anyMatch(message::contains);
  }

  /** The user-facing error for a classifier that does not fit in one class file. */
  static InputException tooLarge(String dataFile, DecisionTree tree, CompilationException e) {
    String javac = e.errors().get(0).message();
    return new InputException(SourcePosition.ofFile(dataFile),
        String.format(Locale.ROOT, "the classifier for %d classes, %d features and %d leaves does"
            + " not fit in one Java class file (javac: %s)", tree.schema().classCount(),
            tree.schema().featureCount(), tree.leafCount(), InputException.quote(javac)),
        "use fewer class labels or feature columns, or a smaller tree (--max-depth, --max-leaves)");
  }
}
