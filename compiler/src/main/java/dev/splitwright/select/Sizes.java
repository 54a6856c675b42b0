package dev.splitwright.select;

/**
 * Measured sizes of one emitted classifier. Class-file figures add up every class the source
 * declares.
 *
 * @param classFileBytes what javac writes with its default debug information
 * @param bytecodeBytes the sum of all methods' code lengths
 * @param sourceBytes UTF-8 bytes of the source
 * @param maxMethodBytes the largest method's code length
 */
public record Sizes(int classFileBytes, int bytecodeBytes, int sourceBytes,
    int maxMethodBytes) {

  public Sizes {
    if (classFileBytes <= 0 || bytecodeBytes < 0 || sourceBytes <= 0 || maxMethodBytes < 0) {
      throw new IllegalArgumentException("sizes must be positive: " + classFileBytes + ", "
          + bytecodeBytes + ", " + sourceBytes + ", " + maxMethodBytes);
    }
  }

  /** The size counted by {@code unit}. */
  public int in(BudgetUnit unit) {
    return switch (unit) {
      case CLASS -> classFileBytes;
      case BYTECODE -> bytecodeBytes;
      case SOURCE -> sourceBytes;
    };
  }
}
