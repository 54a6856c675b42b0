package dev.splitwright.select;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.DexedClasses;
import dev.splitwright.check.Dexer;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.emit.EmittedSource;
import java.util.List;
import java.util.Objects;

/**
 * Measures compiled classes in DEX bytes, the bytes an Android app ships: D8 in release mode at a
 * minimum API level ({@link Dexer}), one DEX file per class, all classes of a batch in one D8 run
 * (a run's fixed cost is far above a small class's). Creating a meter loads none of D8; the first
 * measurement does, which takes seconds.
 */
public final class DexMeter {
  /**
   * The minimum API level when none is given: 24 (Android 7.0), a common floor of current apps
   * (common practice, not a rule); D8 writes DEX version 035 for it.
   */
  public static final int DEFAULT_MIN_API = 24;

  private final Dexer dexer;
  private int d8Runs;

  private DexMeter(Dexer dexer) {
    this.dexer = dexer;
  }

  /**
   * A meter for devices of API level {@code minApi} and above.
   *
   * @throws IllegalArgumentException if D8 does not accept {@code minApi} ({@link
   *     Dexer#LOWEST_MIN_API} to {@link Dexer#HIGHEST_MIN_API})
   */
  public static DexMeter forMinApi(int minApi) {
    return new DexMeter(Dexer.forMinApi(minApi));
  }

  /** The minimum API level the classes are dexed for. */
  public int minApi() {
    return dexer.minApi();
  }

  /** D8 runs so far. */
  public int d8Runs() {
    return d8Runs;
  }

  /**
   * The DEX bytes of each class of {@code binaryNames}, its nested classes added, dexing every
   * class of {@code classes} in one D8 run.
   */
  int[] measure(CompiledClasses classes, List<String> binaryNames) {
    Objects.requireNonNull(classes, "classes");
    DexedClasses dexed = dexer.dex(classes);
    d8Runs++;
    int[] sizes = new int[binaryNames.size()];
    for (int i = 0; i < sizes.length; i++) {
      String descriptor = DexedClasses.descriptorOf(binaryNames.get(i));
      String nested = descriptor.substring(0, descriptor.length() - 1) + "$";
      for (String d : dexed.descriptors()) {
        if (d.equals(descriptor) || d.startsWith(nested)) {
          sizes[i] += dexed.size(d);
        }
      }
      if (sizes[i] == 0) {
        throw new IllegalStateException("no DEX file for " + descriptor + " in " + dexed);
      }
    }
    return sizes;
  }

  /**
   * The DEX figures of the class {@code binaryName} of {@code classes}: its DEX bytes and those of
   * an empty class of the same name, dexed the same way (two D8 runs).
   */
  public DexSizes measure(CompiledClasses classes, String binaryName) {
    Objects.requireNonNull(binaryName, "binaryName");
    int bytes = measure(classes, List.of(binaryName))[0];
    int empty = dexer.emptyClassSize(binaryName);
    d8Runs++;
    return new DexSizes(minApi(), bytes, empty);
  }

  /**
   * The DEX figures of {@code source}, compiled under its own name with {@code compiler}.
   *
   * @throws IllegalStateException if javac rejects the source, a bug of ours
   */
  public DexSizes measure(EmittedSource source, InMemoryCompiler compiler) {
    CompiledClasses classes = new SizeMeter(compiler).compileAlone(source);
    return measure(classes, source.qualifiedName());
  }
}
