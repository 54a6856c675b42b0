package dev.splitwright.cli;

import java.util.Locale;
import picocli.CommandLine;
import picocli.CommandLine.ParameterException;

/** Parses {@code --split TRAIN,VALIDATION,TEST}. */
final class Fractions {
  private static final String EXAMPLE = "give three fractions summing to 1, e.g. 0.6,0.2,0.2";

  private Fractions() {}

  static double[] parse(CommandLine cli, String option, String text) {
    String[] parts = text.split(",", -1);
    if (parts.length != 3) {
      throw bad(cli, option,
          "needs three fractions TRAIN,VALIDATION,TEST, but it is '" + text + "'");
    }
    double[] f = new double[3];
    double sum = 0;
    for (int i = 0; i < 3; i++) {
      try {
        f[i] = Double.parseDouble(parts[i].trim());
      } catch (NumberFormatException e) {
        throw bad(cli, option, "has '" + parts[i] + "', which is not a number");
      }
      if (!(f[i] >= 0 && f[i] <= 1)) {
        throw bad(cli, option, "fractions must be between 0 and 1, but one is " + parts[i].trim());
      }
      sum += f[i];
    }
    if (Math.abs(sum - 1) > 1e-9) {
      throw bad(cli, option, String.format(Locale.ROOT,
          "fractions must sum to 1, but '%s' sums to %s", text, sum));
    }
    if (f[0] == 0) {
      throw bad(cli, option,
          "gives the train part 0 in '" + text + "', so nothing could be trained");
    }
    return f;
  }

  private static ParameterException bad(CommandLine cli, String option, String message) {
    return new ParameterException(cli, "option '" + option + "' " + message + "; " + EXAMPLE);
  }
}
