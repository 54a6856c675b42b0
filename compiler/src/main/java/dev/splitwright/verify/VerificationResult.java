package dev.splitwright.verify;

import dev.splitwright.check.MethodSize;
import java.util.List;
import java.util.Objects;

/**
 * What verifying one emitted classifier found: how many inputs agreed with the model, which did
 * not, how many splits were taken both ways, and what the compiled class weighs.
 *
 * @param maxMethodBytes the largest bytecode of a method that runs per call: every method but the
 *     static initializer, which runs once and is held only to the JVM's limit
 * @param foreignReferences classes the compiled code refers to outside {@code java/lang}
 */
public record VerificationResult(
    long inputsChecked,
    long mismatches,
    List<String> firstMismatches,
    int splits,
    int coveredSplits,
    int classFileBytes,
    int maxMethodBytes,
    int methodByteCap,
    List<MethodSize> methods,
    int constantPoolCount,
    List<String> foreignReferences) {

  public VerificationResult {
    firstMismatches = List.copyOf(firstMismatches);
    methods = List.copyOf(Objects.requireNonNull(methods, "methods"));
    foreignReferences = List.copyOf(foreignReferences);
  }

  /** Splits taken both ways over all splits; 1.0 for a single leaf. */
  public double branchCoverage() {
    return splits == 0 ? 1.0 : (double) coveredSplits / splits;
  }

  /**
   * True when every input agreed, every per-call method fits the cap and nothing outside java.lang
   * is used.
   */
  public boolean passed() {
    return mismatches == 0 && maxMethodBytes <= methodByteCap && foreignReferences.isEmpty();
  }

  /** One line saying why verification failed, or "passed". */
  public String verdict() {
    if (passed()) {
      return "passed";
    }
    if (mismatches > 0) {
      return mismatches + " of " + inputsChecked + " inputs disagree with the model; first: "
          + String.join("; ", firstMismatches);
    }
    if (maxMethodBytes > methodByteCap) {
      return "a method has " + maxMethodBytes + " bytes of bytecode, over the cap of "
          + methodByteCap;
    }
    return "the class refers to classes outside java.lang: " + foreignReferences;
  }
}
