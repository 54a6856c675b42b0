package dev.splitwright.select;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/** The kinds of classifier the budget search can offer. */
public enum ModelKind {
  /** One CART tree and its cost-complexity prunings. */
  TREE("tree"),
  /** A voting forest (Breiman 2001): bootstrap samples, a random feature subset per split. */
  FOREST("forest"),
  /** Shallow trees boosted by SAMME (Zhu, Zou, Rosset and Hastie 2009). */
  BOOSTED("boosted");

  private final String optionName;

  ModelKind(String optionName) {
    this.optionName = optionName;
  }

  /** The spelling used on the command line and in reports. */
  public String optionName() {
    return optionName;
  }

  /** Finds a kind by its option spelling, case-insensitively. */
  public static Optional<ModelKind> parse(String text) {
    String wanted = text.strip().toLowerCase(Locale.ROOT);
    return Arrays.stream(values()).filter(k -> k.optionName.equals(wanted)).findFirst();
  }
}
