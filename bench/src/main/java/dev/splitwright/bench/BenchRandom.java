package dev.splitwright.bench;

import java.util.SplittableRandom;

/**
 * Seeded draws built only on {@link SplittableRandom#nextLong()} and {@link StrictMath}, so a seed
 * gives the same rows on every JDK ({@code nextGaussian} is not specified exactly).
 */
final class BenchRandom {
  private final SplittableRandom random;

  BenchRandom(long seed) {
    this.random = new SplittableRandom(seed);
  }

  /** Uniform in [0, 1), 53 random bits. */
  double uniform() {
    return (random.nextLong() >>> 11) * 0x1.0p-53;
  }

  /** Uniform in [0, bound). */
  int below(int bound) {
    return (int) StrictMath.floor(uniform() * bound);
  }

  /** Standard normal by the Box–Muller transform (Box and Muller, 1958). */
  double gaussian() {
    double u1 = 1.0 - uniform(); // (0, 1]: log stays finite
    double u2 = uniform();
    return StrictMath.sqrt(-2.0 * StrictMath.log(u1)) * StrictMath.cos(2.0 * StrictMath.PI * u2);
  }

  /** Shuffles {@code items} in place (Fisher–Yates, Knuth's Algorithm P). */
  <T> void shuffle(T[] items) {
    for (int i = items.length - 1; i > 0; i--) {
      int j = below(i + 1);
      T t = items[i];
      items[i] = items[j];
      items[j] = t;
    }
  }
}
