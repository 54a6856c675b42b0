package dev.splitwright.select;

/**
 * What one emitted class weighs as DEX ({@link DexMeter}).
 *
 * @param minApi the minimum Android API level D8 compiled for
 * @param dexBytes the DEX file of the class alone
 * @param emptyClassBytes the DEX file of an empty class of the same name (no members, not even a
 *     constructor): header, map and names, the fixed cost of any one-class file
 */
public record DexSizes(int minApi, int dexBytes, int emptyClassBytes) {

  public DexSizes {
    if (dexBytes <= 0 || emptyClassBytes <= 0) {
      throw new IllegalArgumentException(
          "DEX sizes must be positive: " + dexBytes + ", " + emptyClassBytes);
    }
  }

  /** What the classifier's fields and code add to an empty class. */
  public int classifierBytes() {
    return dexBytes - emptyClassBytes;
  }
}
