package dev.splitwright.emit;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/** The parameter type of the emitted {@code classify} method. */
public enum InputKind {
  /** {@code float[]}: compares exactly the float32 values the tree was trained on. */
  FLOAT("float"),
  /**
   * {@code double[]}: thresholds are moved so that {@code x <= t'} in double holds exactly when
   * {@code (float) x <= t} in float, so the class equals the float model on {@code (float) x}.
   */
  DOUBLE("double"),
  /** {@code int[]}: integer thresholds, exact on whole-number inputs (raw sensor counts). */
  INT("int");

  private final String optionName;

  InputKind(String optionName) {
    this.optionName = optionName;
  }

  public String optionName() {
    return optionName;
  }

  /** Finds an input kind by its option spelling. */
  public static Optional<InputKind> parse(String text) {
    String wanted = text.trim().toLowerCase(Locale.ROOT);
    return Arrays.stream(values()).filter(k -> k.optionName.equals(wanted)).findFirst();
  }
}
