package dev.splitwright.check;

import java.util.Objects;

/**
 * Bytecode size of one method.
 *
 * @param name method name, e.g. {@code classify} or {@code <init>}
 * @param descriptor JVM method descriptor, e.g. {@code ([F)I}
 * @param codeLength {@code code_length} of its {@code Code} attribute (JVMS §4.7.3); 0 for
 *     abstract and native methods, which have none
 */
public record MethodSize(String name, String descriptor, int codeLength) {

  public MethodSize {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(descriptor, "descriptor");
    if (codeLength < 0 || codeLength > 65535) {
      throw new IllegalArgumentException(
          "codeLength must be in 0..65535, but it is " + codeLength);
    }
  }
}
