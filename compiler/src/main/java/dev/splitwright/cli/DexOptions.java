package dev.splitwright.cli;

import dev.splitwright.check.Dexer;
import dev.splitwright.select.DexMeter;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;
import picocli.CommandLine;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;

/**
 * The {@code compile} options of DEX sizes, mixed into {@link CompileCommand}. A run that asks for
 * none never loads D8.
 */
final class DexOptions {
  @Option(names = "--dex-size",
      description = "Also measure the emitted class as DEX, the bytes an Android app ships: D8 in "
          + "release mode at --min-api, the class alone and an empty class of the same name; "
          + "reported as dexBytes. Loads D8, which takes a few seconds. Implied by "
          + "--budget-unit dex.")
  boolean dexSize;

  @Option(names = "--min-api", paramLabel = "N",
      description = "Lowest Android API level the DEX is for, " + Dexer.LOWEST_MIN_API + " to "
          + Dexer.HIGHEST_MIN_API + " (default: " + DexMeter.DEFAULT_MIN_API + "); with "
          + "--dex-size or --budget-unit dex.")
  Integer minApi;

  /**
   * The minimum API level to measure DEX bytes for, or empty when no DEX size is wanted.
   *
   * @param dexBudget whether the budget counts DEX bytes
   * @throws ParameterException if {@code --min-api} is out of D8's range, or given when no DEX
   *     size is wanted
   */
  OptionalInt minApi(CommandLine cli, boolean dexBudget) {
    if (!dexSize && !dexBudget) {
      if (minApi != null) {
        throw new ParameterException(cli,
            "option '--min-api' only applies together with --dex-size or --budget-unit dex");
      }
      return OptionalInt.empty();
    }
    int level = minApi == null ? DexMeter.DEFAULT_MIN_API : minApi;
    if (level < Dexer.LOWEST_MIN_API || level > Dexer.HIGHEST_MIN_API) {
      throw new ParameterException(cli, "option '--min-api' must be between "
          + Dexer.LOWEST_MIN_API + " and " + Dexer.HIGHEST_MIN_API + " (the levels D8 "
          + "supports), but it is " + level);
    }
    return OptionalInt.of(level);
  }

  /** The DEX options for the reproducing command line, given the level {@link #minApi} gave. */
  List<String> optionsText(OptionalInt level) {
    List<String> parts = new ArrayList<>();
    if (dexSize) {
      parts.add("--dex-size");
    }
    level.ifPresent(n -> parts.add("--min-api " + n));
    return parts;
  }
}
