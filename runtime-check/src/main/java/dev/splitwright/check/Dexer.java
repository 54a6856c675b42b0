package dev.splitwright.check;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * Turns class files into DEX files with D8, Android's dexer, run in this JVM through its public
 * API ({@code com.android.tools.r8.D8}), in release mode: the bytes an Android app would ship.
 *
 * <p>One {@link #dex(CompiledClasses)} call is one D8 run giving one DEX file per class, so the
 * size of each class can be read without dexing it alone. D8's start-up is costly (several seconds
 * for the first run in a JVM, while it loads its classes), and each run costs more than each class
 * in it, so dex many classes in one call.
 *
 * <p>Creating a dexer loads none of D8: its classes are loaded on the first call that dexes.
 *
 * <p>Immutable.
 */
public final class Dexer {

  /** The lowest Android API level D8 accepts as the minimum API level. */
  public static final int LOWEST_MIN_API = 1;

  /**
   * The highest Android API level D8 8.7.18 supports; above it D8 warns "An API level of N is not
   * supported by this compiler" (tried by hand) and compiles for a level it does not know.
   */
  public static final int HIGHEST_MIN_API = 35;

  private final int minApi;

  private Dexer(int minApi) {
    this.minApi = minApi;
  }

  /**
   * A dexer for devices of Android API level {@code minApi} and above; the level decides which
   * DEX version is written and which Java features D8 rewrites.
   *
   * @throws IllegalArgumentException if {@code minApi} is not in {@value #LOWEST_MIN_API} to
   *     {@value #HIGHEST_MIN_API}
   */
  public static Dexer forMinApi(int minApi) {
    if (minApi < LOWEST_MIN_API || minApi > HIGHEST_MIN_API) {
      throw new IllegalArgumentException(
          "minimum Android API level "
              + minApi
              + " is not in the range D8 supports, "
              + LOWEST_MIN_API
              + " to "
              + HIGHEST_MIN_API);
    }
    return new Dexer(minApi);
  }

  /** The minimum Android API level the DEX files are written for. */
  public int minApi() {
    return minApi;
  }

  /**
   * Dexes all {@code classes} in one D8 run and returns one DEX file per class, nested classes
   * included, keyed by class descriptor ({@code Ldemo/Pump;}). Classes the batch refers to but does
   * not contain (the JDK's) are not needed.
   *
   * @throws IllegalArgumentException if D8 rejects a class file; the message holds D8's errors
   * @throws IllegalStateException if D8 is not on the class path
   */
  public DexedClasses dex(CompiledClasses classes) {
    Objects.requireNonNull(classes, "classes");
    Map<String, byte[]> classFiles = new LinkedHashMap<>();
    for (String name : classes.names()) {
      classFiles.put(name, classes.bytes(name));
    }
    requireD8();
    return DexedClasses.of(D8Runner.dexEach(classFiles, minApi));
  }

  /**
   * The length of the DEX file of {@code public final class <binaryClassName> {}} with no members
   * at all, not even a constructor: the fixed cost of one DEX file (header, map, the class's own
   * name and {@code java.lang.Object}). Subtract it from the size of a class of the same name to
   * get what its fields and code cost.
   *
   * @throws IllegalArgumentException if {@code binaryClassName} is not a qualified Java name
   * @throws IllegalStateException if D8 is not on the class path
   */
  public int emptyClassSize(String binaryClassName) {
    byte[] classFile = EmptyClassFile.of(binaryClassName);
    requireD8();
    Map<String, byte[]> dexed = D8Runner.dexEach(Map.of(binaryClassName, classFile), minApi);
    byte[] dex = dexed.get(DexedClasses.descriptorOf(binaryClassName));
    if (dex == null || dexed.size() != 1) {
      throw new IllegalStateException("D8 gave " + dexed.keySet() + " for " + binaryClassName);
    }
    return dex.length;
  }

  /** Names the missing jar instead of letting a NoClassDefFoundError escape from D8Runner. */
  private static void requireD8() {
    try {
      Class.forName("com.android.tools.r8.D8", false, Dexer.class.getClassLoader());
    } catch (ClassNotFoundException e) {
      throw new IllegalStateException(
          "D8 is not on the class path: DEX sizes need Maven Central's com.android.tools:r8", e);
    }
  }

  @Override
  public String toString() {
    return "Dexer[minApi=" + minApi + "]";
  }
}
