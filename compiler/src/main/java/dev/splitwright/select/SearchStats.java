package dev.splitwright.select;

import java.util.Objects;

/**
 * What the search did and how long it took. Kept out of the report, whose bytes must not depend on
 * timing.
 *
 * @param settingsTried pruning-path entries over all depth and leaf-size limits
 * @param distinctTrees distinct candidates measured
 * @param settingsSkipped settings not measured: a smaller candidate nested in theirs was over the
 *     budget
 * @param sourcesCompiled emitted sources compiled to measure them
 * @param compiler the compiler that measured them, e.g. {@code javac} or {@code cc}
 * @param compilerRuns runs of it the measuring took
 * @param d8Runs D8 runs the measuring took, 0 unless the budget counts DEX bytes
 * @param elapsedNanos wall time of the whole search, refit and final check included
 */
public record SearchStats(int settingsTried, int distinctTrees, int settingsSkipped,
    int sourcesCompiled,
    String compiler, int compilerRuns, int d8Runs, long elapsedNanos) {

  public SearchStats {
    Objects.requireNonNull(compiler, "compiler");
  }

  /** Statistics of a search that ran javac and no D8. */
  public SearchStats(int settingsTried, int distinctTrees, int sourcesCompiled, int javacRuns,
      long elapsedNanos) {
    this(settingsTried, distinctTrees, 0, sourcesCompiled, "javac", javacRuns, 0, elapsedNanos);
  }

  /** Elapsed seconds. */
  public double seconds() {
    return elapsedNanos / 1e9;
  }
}
