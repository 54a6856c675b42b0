package dev.splitwright.cgen;

import java.util.List;

/** Writes {@code static const} arrays, several values a line. */
final class CArrays {
  private CArrays() {}

  /** The smallest unsigned {@code <stdint.h>} type that holds every value up to {@code max}. */
  static String unsignedType(long max) {
    if (max < 0 || max > 0xffffffffL) {
      throw new IllegalArgumentException("no uint32_t: " + max);
    }
    return max <= 0xff ? "uint8_t" : max <= 0xffff ? "uint16_t" : "uint32_t";
  }

  /**
   * Appends {@code static const <type> <name>[] = { ... };} with {@code perLine} items a line. C99
   * has no empty initializer (6.7.8), so callers emit no array for no items.
   */
  static void write(StringBuilder out, String type, String name, List<String> items,
      int perLine) {
    if (items.isEmpty()) {
      throw new IllegalArgumentException("C99 has no empty array: " + name);
    }
    out.append("static const ").append(type).append(' ').append(name).append("[")
        .append(items.size()).append("] = {\n");
    for (int i = 0; i < items.size(); i++) {
      out.append(i % perLine == 0 ? "    " : " ").append(items.get(i))
          .append(i + 1 < items.size() ? "," : "");
      if (i % perLine == perLine - 1 || i + 1 == items.size()) {
        out.append('\n');
      }
    }
    out.append("};\n\n");
  }

  /** Appends an array of unsigned values in the smallest type that holds them. */
  static void writeUnsigned(StringBuilder out, String name, List<Long> values) {
    long max = values.stream().mapToLong(Long::longValue).max().orElse(0);
    String type = unsignedType(max);
    String suffix = type.equals("uint32_t") ? "u" : "";
    write(out, type, name, values.stream().map(v -> v + suffix).toList(), 12);
  }
}
