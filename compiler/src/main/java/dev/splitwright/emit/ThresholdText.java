package dev.splitwright.emit;

/**
 * A threshold as other outputs (pictures, reports) show it: the very digits of the emitted
 * literal, so a reader can match a picture to the code, and one formatter serves both.
 */
public final class ThresholdText {
  private ThresholdText() {}

  /** The emitted literal of {@code t} without its {@code f} suffix; infinities spelled out. */
  public static String of(float t) {
    if (Float.isInfinite(t)) {
      return t > 0 ? "Infinity" : "-Infinity";
    }
    String literal = JavaText.floatLiteral(t);
    return literal.endsWith("f") ? literal.substring(0, literal.length() - 1) : literal;
  }
}
