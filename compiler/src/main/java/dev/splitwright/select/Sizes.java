package dev.splitwright.select;

/**
 * Measured sizes of one emitted classifier. Class-file figures add up every class the source
 * declares.
 *
 * @param classFileBytes what javac writes with its default debug information
 * @param bytecodeBytes the sum of all methods' code lengths
 * @param sourceBytes UTF-8 bytes of the source
 * @param maxMethodBytes the largest method's code length
 * @param dexBytes the DEX files D8 writes for the classes, or 0 when not measured: only a DEX
 *     budget measures them, since loading and running D8 costs seconds
 */
public record Sizes(int classFileBytes, int bytecodeBytes, int sourceBytes,
    int maxMethodBytes, int dexBytes) {

  public Sizes {
    if (classFileBytes <= 0 || bytecodeBytes < 0 || sourceBytes <= 0 || maxMethodBytes < 0
        || dexBytes < 0) {
      throw new IllegalArgumentException("sizes must be positive: " + classFileBytes + ", "
          + bytecodeBytes + ", " + sourceBytes + ", " + maxMethodBytes + ", " + dexBytes);
    }
  }

  /** Sizes without DEX bytes. */
  public Sizes(int classFileBytes, int bytecodeBytes, int sourceBytes, int maxMethodBytes) {
    this(classFileBytes, bytecodeBytes, sourceBytes, maxMethodBytes, 0);
  }

  /** These sizes with {@code bytes} of DEX. */
  Sizes withDexBytes(int bytes) {
    if (bytes <= 0) {
      throw new IllegalArgumentException("DEX bytes must be positive: " + bytes);
    }
    return new Sizes(classFileBytes, bytecodeBytes, sourceBytes, maxMethodBytes, bytes);
  }

  /** The size counted by {@code unit}. */
  public int in(BudgetUnit unit) {
    return switch (unit) {
      case CLASS -> classFileBytes;
      case BYTECODE -> bytecodeBytes;
      case SOURCE -> sourceBytes;
      case DEX -> {
        if (dexBytes == 0) {
          throw new IllegalStateException("DEX bytes were not measured");
        }
        yield dexBytes;
      }
    };
  }
}
