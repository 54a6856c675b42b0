package dev.splitwright.data;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Gives distinct strings provisional codes in first-seen order while a file streams past, then
 * renumbers them so that codes follow sorted (natural {@code String}) order: the final codes depend
 * only on the set of values, never on row order or hash order.
 */
final class CodeBook {
  private final Map<String, Integer> codes = new HashMap<>();
  private final List<String> values = new ArrayList<>();

  /** Returns the provisional code of {@code value}, adding it if new. */
  int code(String value) {
    Integer code = codes.get(value);
    if (code == null) {
      code = values.size();
      codes.put(value, code);
      values.add(value);
    }
    return code;
  }

  int size() {
    return values.size();
  }

  /** The distinct values in sorted order; index = final code. */
  List<String> sortedValues() {
    String[] sorted = values.toArray(new String[0]);
    Arrays.sort(sorted);
    return List.of(sorted);
  }

  /** Maps each provisional code to its final code. */
  int[] finalCodes() {
    List<String> sorted = sortedValues();
    int[] remap = new int[values.size()];
    for (int finalCode = 0; finalCode < sorted.size(); finalCode++) {
      remap[codes.get(sorted.get(finalCode))] = finalCode;
    }
    return remap;
  }
}
