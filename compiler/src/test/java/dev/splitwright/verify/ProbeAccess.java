package dev.splitwright.verify;

import dev.splitwright.data.Dataset;
import dev.splitwright.model.Classifier;
import java.util.List;

/**
 * Lets tests of other packages (the C back end) use the inputs verification uses: every
 * threshold's IEEE 754 neighbours, NaN, signed zeros, infinities, invalid codes on inputs that
 * reach each split, and seeded random probes; for int input the int boundary probes.
 */
public final class ProbeAccess {
  private ProbeAccess() {}

  /** Boundary probes of every split, then {@code randomProbes} seeded random inputs. */
  public static List<float[]> floatProbes(Classifier tree, long seed, int randomProbes) {
    return Verifier.inputs(tree, List.of(), seed, randomProbes);
  }

  /**
   * The inputs verification runs: every row of {@code data}, the boundary probes of every split,
   * then {@code randomProbes} seeded random inputs.
   */
  public static List<float[]> verificationInputs(Classifier tree, List<Dataset> data,
      long seed, int randomProbes) {
    return Verifier.inputs(tree, data, seed, randomProbes);
  }

  /**
   * Int boundary probes: each threshold's integer neighbours and the int extremes, for every tree
   * of an ensemble.
   */
  public static List<int[]> intProbes(Classifier tree) {
    return Trees.probes(tree, IntProbes::of);
  }
}
