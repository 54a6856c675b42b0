package dev.splitwright.cgen;

/** Lets tests of other packages (the on-chip proof) spell constants as the C emitter does. */
public final class CTextAccess {
  private CTextAccess() {}

  /** The C99 hexadecimal floating constant the emitter writes for {@code value}. */
  public static String hexFloat(float value) {
    return CText.hexFloat(value);
  }
}
