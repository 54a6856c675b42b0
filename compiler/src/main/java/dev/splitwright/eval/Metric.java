package dev.splitwright.eval;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/** A score used to choose among candidate models. */
public enum Metric {
  ACCURACY("accuracy"),
  BALANCED_ACCURACY("balanced-accuracy"),
  MACRO_F1("macro-f1");

  private final String optionName;

  Metric(String optionName) {
    this.optionName = optionName;
  }

  /** The spelling used on the command line and in reports. */
  public String optionName() {
    return optionName;
  }

  /** Finds a metric by its option spelling, case-insensitively. */
  public static Optional<Metric> parse(String text) {
    String wanted = text.trim().toLowerCase(Locale.ROOT);
    return Arrays.stream(values()).filter(m -> m.optionName.equals(wanted)).findFirst();
  }
}
