package dev.splitwright.cgen;

import java.util.Locale;

/**
 * Float comparisons done on the IEEE 754 bit patterns in integer registers, for cores without FPU,
 * where each float comparison is a call into libgcc's soft-float helpers.
 *
 * <p>The key of a float with bits {@code b}: {@code b | 0x80000000} when the sign is clear, {@code
 * ~b} when it is set. Keys are ordered as unsigned integers exactly as the floats they come from
 * (IEEE 754-2008 3.4: a finite or infinite value's magnitude grows with its bits read as an
 * integer, the sign aside), so for x and t not NaN, {@code x <= t} exactly when {@code key(x) <=
 * key(t)}. The two zeros are equal as floats but their keys differ: -0 has 0x7fffffff, +0 has
 * 0x80000000, adjacent with no key between. A threshold of -0 is therefore stored with the key of
 * +0; then an input of -0 or +0 compares as IEEE 754 says with any threshold. NaN (exponent all
 * ones, fraction not zero) is tested first and goes the split's missing-value way. Thresholds of
 * minus or plus Infinity need no special case: their keys are the extremes of the non-NaN keys.
 */
final class CFloatKeys {
  private static final int SIGN = 0x80000000;

  private final String prefix;
  private boolean used;

  CFloatKeys(String prefix) {
    this.prefix = prefix;
  }

  /** The key of threshold {@code t} (not NaN), -0 taken as +0, as a 32-bit unsigned value. */
  static long key(float t) {
    if (Float.isNaN(t)) {
      throw new IllegalArgumentException("a threshold is never NaN");
    }
    int bits = Float.floatToRawIntBits(t == 0f ? 0f : t);
    int key = bits < 0 ? ~bits : bits | SIGN;
    return Integer.toUnsignedLong(key);
  }

  /** The key as a C constant with the threshold's decimal value in a comment. */
  static String constant(float t) {
    return String.format(Locale.ROOT, "0x%08xu", key(t)) + " /* " + CText.decimal(t) + " */";
  }

  String function() {
    return prefix + "_goes_left";
  }

  /** The call deciding a split on {@code value}; the helper is written once some call is made. */
  String call(String value, float threshold, boolean missingLeft) {
    used = true;
    return function() + "(" + value + ", " + constant(threshold) + ", " + (missingLeft ? 1 : 0)
        + ")";
  }

  /** Marks the helper as needed (the table's loop calls it with operands from the array). */
  void use() {
    used = true;
  }

  /** The helper function; nothing when no split called it. */
  void write(StringBuilder out) {
    if (!used) {
      return;
    }
    out.append("/*\n"
        + " * Whether x goes left of threshold key t: x <= t compared as IEEE 754 bit patterns\n"
        + " * in integer registers, no float operation. The key of bits b is b | 0x80000000 for\n"
        + " * a clear sign and ~b for a set one, ordered as unsigned like the floats; NaN goes\n"
        + " * the missing-value way. A threshold of -0 is stored with the key of +0.\n"
        + " */\n")
        .append("static int ").append(function())
        .append("(float x, uint32_t t, int missing_left)\n{\n")
        .append("    union {\n        float value;\n        uint32_t bits;\n    } u;\n")
        .append("    uint32_t key;\n")
        .append("    u.value = x;\n")
        .append("    if ((u.bits & 0x7fffffffu) > 0x7f800000u) {\n"
            + "        return missing_left;\n    }\n")
        .append("    key = (u.bits & 0x80000000u) ? ~u.bits : u.bits | 0x80000000u;\n")
        .append("    return key <= t;\n}\n\n");
  }
}
