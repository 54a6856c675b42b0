package dev.splitwright.emit;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/** How the tree is laid out in the emitted class. */
public enum Layout {
  /** Nested {@code if} comparisons: the fastest form. */
  BRANCHES("branches"),
  /** The tree packed into a constant and walked by a loop: fewer class-file bytes for big trees. */
  TABLE("table"),
  /**
   * The tree padded to a complete tree and walked without branching on comparisons: steady
   * speed on inputs that jump around. Chosen by name only, never by {@code smallest}.
   */
  FLAT("flat"),
  /** Branches and table emitted and compiled; the one with the smaller class file is kept. */
  SMALLEST("smallest");

  private final String optionName;

  Layout(String optionName) {
    this.optionName = optionName;
  }

  public String optionName() {
    return optionName;
  }

  /** Finds a layout by its option spelling, case-insensitively. */
  public static Optional<Layout> parse(String text) {
    String wanted = text.trim().toLowerCase(Locale.ROOT);
    return Arrays.stream(values()).filter(l -> l.optionName.equals(wanted)).findFirst();
  }
}
