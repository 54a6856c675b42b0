package dev.splitwright.cgen;

import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Thresholds;
import dev.splitwright.model.NumericSplit;

/**
 * The C comparison of a numeric split, as an operator and an operand that the table stores and the
 * branches write out. Float input follows the model exactly: {@code x <= t}, with NaN sent by
 * writing {@code x <= t} (NaN fails it: right) or {@code !(x > t)} (NaN passes it: left), since
 * every ordered comparison with NaN is false (IEEE 754-2008 5.11). C99 has no infinity constant
 * without {@code <math.h>}, so an infinite threshold becomes a comparison with the largest finite
 * float. Int32 input compares with the largest int whose float conversion is at most t, the rule
 * of the Java emitter.
 */
record CComparison(Op op, float floatOperand, long intOperand) {

  /** How the value compares with the operand to go left (NaN aside). */
  enum Op {
    /** {@code v <= t}. */
    AT_MOST,
    /** {@code v < t}: a threshold of -Infinity (t = -FLT_MAX), or no int at or below it. */
    BELOW,
    /** Every number goes left: a threshold of +Infinity (t = FLT_MAX). */
    ANY_NUMBER
  }

  static CComparison of(NumericSplit split, InputKind kind) {
    float t = split.threshold();
    if (kind == InputKind.INT) {
      long n = Thresholds.forInt(t);
      return n == Long.MIN_VALUE ? new CComparison(Op.BELOW, 0f, Integer.MIN_VALUE)
          : new CComparison(Op.AT_MOST, 0f, n);
    }
    if (t == Float.NEGATIVE_INFINITY) {
      return new CComparison(Op.BELOW, -Float.MAX_VALUE, 0);
    }
    if (t == Float.POSITIVE_INFINITY) {
      return new CComparison(Op.ANY_NUMBER, Float.MAX_VALUE, 0);
    }
    return new CComparison(Op.AT_MOST, t, 0);
  }

  /** The operand as a C constant with, for floats, its decimal value in a comment. */
  String operand(InputKind kind) {
    if (kind == InputKind.INT) {
      return CText.int32(intOperand);
    }
    return CText.hexFloat(floatOperand) + " /* " + CText.decimal(floatOperand) + " */";
  }

  /**
   * The condition for going left on {@code value}; {@code "1"} when every input goes left (then
   * the value is not read).
   */
  String condition(String value, boolean missingLeft, InputKind kind) {
    String t = operand(kind);
    if (kind == InputKind.INT) {
      return value + (op == Op.BELOW ? " < " : " <= ") + t;
    }
    return switch (op) {
      case AT_MOST -> missingLeft ? "!(" + value + " > " + t + ")" : value + " <= " + t;
      case BELOW -> "/* x <= -Infinity */ " + (missingLeft
          ? "!(" + value + " >= " + t + ")" : value + " < " + t);
      case ANY_NUMBER -> missingLeft ? "1 /* x <= +Infinity or NaN: always */"
          : "/* x <= +Infinity: not NaN */ (" + value + " <= " + t + " || " + value + " > " + t
              + ")";
    };
  }
}
