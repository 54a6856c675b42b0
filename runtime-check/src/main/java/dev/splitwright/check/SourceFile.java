package dev.splitwright.check;

import java.util.Objects;
import javax.lang.model.SourceVersion;

/**
 * One compilation unit held in memory.
 *
 * @param binaryClassName name of the top-level class the source declares, e.g. {@code demo.Pump};
 *     javac requires a public class to live in a file of the same name
 * @param source the Java source text
 */
public record SourceFile(String binaryClassName, String source) {

  public SourceFile {
    Objects.requireNonNull(binaryClassName, "binaryClassName");
    Objects.requireNonNull(source, "source");
    if (!SourceVersion.isName(binaryClassName)) {
      throw new IllegalArgumentException(
          "binaryClassName \"" + binaryClassName + "\" is not a qualified Java name");
    }
  }
}
