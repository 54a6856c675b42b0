package dev.splitwright.select;

/**
 * Measured sizes of one emitted classifier. A figure its language does not measure is 0: Java
 * measures class files (all classes the source declares added up), C the flash bytes of an object
 * file.
 *
 * @param classFileBytes what javac writes with its default debug information
 * @param bytecodeBytes the sum of all methods' code lengths
 * @param sourceBytes UTF-8 bytes of the source files
 * @param maxMethodBytes the largest method's code length
 * @param dexBytes the DEX files D8 writes for the classes, or 0 when not measured: only a DEX
 *     budget measures them, since loading and running D8 costs seconds
 * @param flashBytes the flash bytes of the C object file, or 0 for Java
 */
public record Sizes(int classFileBytes, int bytecodeBytes, int sourceBytes,
    int maxMethodBytes, int dexBytes, int flashBytes) {

  public Sizes {
    if (classFileBytes < 0 || bytecodeBytes < 0 || sourceBytes <= 0 || maxMethodBytes < 0
        || dexBytes < 0 || flashBytes < 0 || (classFileBytes == 0) == (flashBytes == 0)) {
      throw new IllegalArgumentException("sizes must be positive, with class-file or flash "
          + "bytes: " + classFileBytes + ", " + bytecodeBytes + ", " + sourceBytes + ", "
          + maxMethodBytes + ", " + dexBytes + ", " + flashBytes);
    }
  }

  /** Java sizes without DEX bytes. */
  public Sizes(int classFileBytes, int bytecodeBytes, int sourceBytes, int maxMethodBytes) {
    this(classFileBytes, bytecodeBytes, sourceBytes, maxMethodBytes, 0, 0);
  }

  /** Java sizes with DEX bytes, 0 when not measured. */
  public Sizes(int classFileBytes, int bytecodeBytes, int sourceBytes, int maxMethodBytes,
      int dexBytes) {
    this(classFileBytes, bytecodeBytes, sourceBytes, maxMethodBytes, dexBytes, 0);
  }

  /** The sizes of a C classifier: its files' bytes and its object file's flash bytes. */
  public static Sizes ofFlash(int sourceBytes, int flashBytes) {
    if (flashBytes <= 0) {
      throw new IllegalArgumentException("flash bytes must be positive: " + flashBytes);
    }
    return new Sizes(0, 0, sourceBytes, 0, 0, flashBytes);
  }

  /** These sizes with {@code bytes} of DEX. */
  Sizes withDexBytes(int bytes) {
    if (bytes <= 0) {
      throw new IllegalArgumentException("DEX bytes must be positive: " + bytes);
    }
    return new Sizes(classFileBytes, bytecodeBytes, sourceBytes, maxMethodBytes, bytes, 0);
  }

  /**
   * The size counted by {@code unit}.
   *
   * @throws IllegalStateException if that figure was not measured
   */
  public int in(BudgetUnit unit) {
    boolean measured = switch (unit) {
      case CLASS, BYTECODE -> classFileBytes > 0;
      case SOURCE -> true;
      case DEX -> dexBytes > 0;
      case FLASH -> flashBytes > 0;
    };
    if (!measured) {
      throw new IllegalStateException(unit.description() + " was not measured");
    }
    return switch (unit) {
      case CLASS -> classFileBytes;
      case BYTECODE -> bytecodeBytes;
      case SOURCE -> sourceBytes;
      case DEX -> dexBytes;
      case FLASH -> flashBytes;
    };
  }
}
