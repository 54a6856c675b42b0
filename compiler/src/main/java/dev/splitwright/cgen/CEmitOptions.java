package dev.splitwright.cgen;

import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import java.util.Locale;
import java.util.Objects;

/**
 * How to emit C: the base name of the files and of every public identifier, the layout ({@link
 * Layout#BRANCHES} or {@link Layout#TABLE}; {@code smallest} is resolved by the caller, who
 * measures both), the input type ({@link InputKind#FLOAT} or {@link InputKind#INT}, which is
 * {@code int32_t} in C), class probabilities, {@code bare} (no label and feature-name strings)
 * and {@code compareBits} (float input compared as IEEE 754 bit patterns in integer registers, see
 * {@link CFloatKeys}, so a core without FPU needs no soft-float helper).
 */
public record CEmitOptions(String baseName, Layout layout, InputKind inputKind,
    boolean probabilities, boolean bare, boolean compareBits) {

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
    if (compareBits && inputKind != InputKind.FLOAT) {
      throw new IllegalArgumentException("comparing bit patterns applies to float input only");
    }
  }

  /** Options that compare floats as floats. */
  public CEmitOptions(String baseName, Layout layout, InputKind inputKind, boolean probabilities,
      boolean bare) {
    this(baseName, layout, inputKind, probabilities, bare, false);
  }

  /** Options for {@code baseName} with the branches layout, float input and no extras. */
  public static CEmitOptions of(String baseName) {
    return new CEmitOptions(baseName, Layout.BRANCHES, InputKind.FLOAT, false, false);
  }

  public CEmitOptions withLayout(Layout value) {
    return new CEmitOptions(baseName, value, inputKind, probabilities, bare, compareBits);
  }

  public CEmitOptions withInputKind(InputKind value) {
    return new CEmitOptions(baseName, layout, value, probabilities, bare, compareBits);
  }

  public CEmitOptions withProbabilities(boolean value) {
    return new CEmitOptions(baseName, layout, inputKind, value, bare, compareBits);
  }

  public CEmitOptions withBare(boolean value) {
    return new CEmitOptions(baseName, layout, inputKind, probabilities, value, compareBits);
  }

  public CEmitOptions withCompareBits(boolean value) {
    return new CEmitOptions(baseName, layout, inputKind, probabilities, bare, value);
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
