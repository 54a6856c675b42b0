package dev.splitwright.demo;

import java.util.SplittableRandom;

/**
 * The random draws the scenarios need, built only on {@link SplittableRandom#nextLong()} and {@link
 * StrictMath}, so that a seed gives the same file on every JDK and platform ({@code Math} may
 * differ in the last bit between platforms; {@code nextGaussian} is not specified exactly).
 */
final class DemoRandom {
  private final SplittableRandom random;

  DemoRandom(long seed) {
    this.random = new SplittableRandom(seed);
  }

  /** Uniform in [0, 1), 53 random bits. */
  double uniform() {
    return (random.nextLong() >>> 11) * 0x1.0p-53;
  }

  double uniform(double low, double high) {
    return low + (high - low) * uniform();
  }

  int uniformInt(int low, int highInclusive) {
    return low + (int) StrictMath.floor(uniform() * (highInclusive - low + 1));
  }

  boolean chance(double probability) {
    return uniform() < probability;
  }

  /** Standard normal by the Box–Muller transform (Box and Muller, 1958). */
  double gaussian() {
    double u1 = 1.0 - uniform(); // (0, 1]: log stays finite
    double u2 = uniform();
    return StrictMath.sqrt(-2.0 * StrictMath.log(u1)) * StrictMath.cos(2.0 * StrictMath.PI * u2);
  }

  double normal(double mean, double sd) {
    return mean + sd * gaussian();
  }

  /** Log-normal with the given median and log-space standard deviation. */
  double logNormal(double median, double sigma) {
    return median * StrictMath.exp(sigma * gaussian());
  }

  /** Index drawn with the given probabilities (which sum to 1). */
  int pick(double[] probabilities) {
    double u = uniform();
    double cumulative = 0;
    for (int i = 0; i < probabilities.length - 1; i++) {
      cumulative += probabilities[i];
      if (u < cumulative) {
        return i;
      }
    }
    return probabilities.length - 1;
  }

  /** With probability {@code rate}, a uniformly chosen other class; else {@code trueClass}. */
  int noisyLabel(int trueClass, int classes, double rate) {
    if (!chance(rate)) {
      return trueClass;
    }
    int other = uniformInt(0, classes - 2);
    return other >= trueClass ? other + 1 : other;
  }
}
