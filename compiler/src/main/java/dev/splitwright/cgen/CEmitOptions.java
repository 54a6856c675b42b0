package dev.splitwright.cgen;

import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import java.util.Locale;
import java.util.Objects;

/**
 * How to emit C: the base name of the files and of every public identifier, the layout ({@link
 * Layout#BRANCHES} or {@link Layout#TABLE}; {@code smallest} is resolved by the caller, who
 * measures both), the input type ({@link InputKind#FLOAT} or {@link InputKind#INT}, which is
 * {@code int32_t} in C), class probabilities, and {@code bare} (no label and feature-name strings).
 */
public record CEmitOptions(String baseName, Layout layout, InputKind inputKind,
    boolean probabilities, boolean bare) {

  public CEmitOptions {
    CNames.requireBase(Objects.requireNonNull(baseName, "baseName"));
    Objects.requireNonNull(layout, "layout");
    Objects.requireNonNull(inputKind, "inputKind");
    if (layout == Layout.SMALLEST) {
      throw new IllegalArgumentException(
          "layout 'smallest' is chosen by measuring both layouts; emit each and compare");
    }
    if (inputKind == InputKind.DOUBLE) {
      throw new IllegalArgumentException("C input is float or int32, not double");
    }
  }

  /** Options for {@code baseName} with the branches layout, float input and no extras. */
  public static CEmitOptions of(String baseName) {
    return new CEmitOptions(baseName, Layout.BRANCHES, InputKind.FLOAT, false, false);
  }

  public CEmitOptions withLayout(Layout value) {
    return new CEmitOptions(baseName, value, inputKind, probabilities, bare);
  }

  public CEmitOptions withInputKind(InputKind value) {
    return new CEmitOptions(baseName, layout, value, probabilities, bare);
  }

  public CEmitOptions withProbabilities(boolean value) {
    return new CEmitOptions(baseName, layout, inputKind, value, bare);
  }

  public CEmitOptions withBare(boolean value) {
    return new CEmitOptions(baseName, layout, inputKind, probabilities, value);
  }

  /** The base name in upper case: the prefix of every macro. */
  public String macroPrefix() {
    return baseName.toUpperCase(Locale.ROOT);
  }

  /** The C element type of the input array. */
  String elementType() {
    return inputKind == InputKind.INT ? "int32_t" : "float";
  }
}
