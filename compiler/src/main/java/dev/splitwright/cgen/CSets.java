package dev.splitwright.cgen;

import dev.splitwright.emit.InputKind;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The code sets of categorical splits, packed into one {@code static const uint32_t} array: at
 * each set's offset the number of categories k, then ceil(k / 32) words, code c being bit {@code c
 * % 32} of word {@code c / 32}. Equal sets are stored once.
 */
final class CSets {
  private final String prefix;
  private final Map<String, Integer> offsets = new LinkedHashMap<>();
  private final List<Long> words = new ArrayList<>();

  CSets(String prefix) {
    this.prefix = prefix;
  }

  /** The offset of the set {@code codes} of a feature with {@code k} categories. */
  int offset(int k, int[] codes) {
    String key = k + ":" + Arrays.toString(codes);
    Integer at = offsets.get(key);
    if (at != null) {
      return at;
    }
    at = words.size();
    long[] bits = new long[(k + 31) / 32];
    for (int code : codes) {
      bits[code >>> 5] |= 1L << (code & 31);
    }
    words.add((long) k);
    for (long word : bits) {
      words.add(word);
    }
    offsets.put(key, at);
    return at;
  }

  boolean isEmpty() {
    return words.isEmpty();
  }

  String function() {
    return prefix + "_in_set";
  }

  /** The table and the membership function; nothing when no split is categorical. */
  void write(StringBuilder out, InputKind kind) {
    if (words.isEmpty()) {
      return;
    }
    out.append("/* Code sets of categorical splits: k, then ceil(k / 32) words; code c is bit\n"
        + " * c % 32 of word c / 32. */\n");
    List<String> hex = words.stream().map(w -> String.format(Locale.ROOT, "0x%08xu", w)).toList();
    CArrays.write(out, "uint32_t", prefix + "_sets", hex, 6);
    String sets = prefix + "_sets";
    out.append("/*\n * Tells whether category code v is in the set at ").append(sets)
        .append("[at]. A code that is not\n");
    if (kind == InputKind.INT) {
      out.append(" * in [0, k) is missing and goes to the side missing_left names.\n */\n")
          .append("static int ").append(function())
          .append("(int32_t v, uint32_t at, int missing_left)\n{\n")
          .append("    if (v >= 0 && (uint32_t)v < ").append(sets).append("[at]) {\n")
          .append("        const uint32_t c = (uint32_t)v;\n");
    } else {
      out.append(" * a whole number in [0, k), NaN included, is missing and goes to the side\n"
              + " * missing_left names. The range test comes first: converting a float out of\n"
              + " * range to an integer is undefined behaviour (C99 6.3.1.4). NaN fails v >= 0\n"
              + " * (IEEE 754: NaN is unordered). Truncation never rounds up, so c is whole\n"
              + " * exactly when (float)c is not below v.\n */\n")
          .append("static int ").append(function())
          .append("(float v, uint32_t at, int missing_left)\n{\n")
          .append("    const uint32_t k = ").append(sets).append("[at];\n")
          .append("    if (v >= 0 && v < (float)k) {\n")
          .append("        const uint32_t c = (uint32_t)v;\n")
          .append("        if (c < k && !((float)c < v)) {\n    ");
    }
    out.append("        return (int)((").append(sets)
        .append("[at + 1u + (c >> 5)] >> (c & 31u)) & 1u);\n");
    if (kind != InputKind.INT) {
      out.append("        }\n");
    }
    out.append("    }\n    return missing_left;\n}\n\n");
  }
}
