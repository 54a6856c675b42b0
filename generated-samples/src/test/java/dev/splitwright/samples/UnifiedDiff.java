package dev.splitwright.samples;

import java.util.ArrayList;
import java.util.List;

/** A small line diff (longest common subsequence) rendered in unified format for test failures. */
final class UnifiedDiff {
  private static final int CONTEXT = 3;

  private UnifiedDiff() {}

  static String of(String expectedName, String expected, String actualName, String actual) {
    List<String> a = expected.lines().toList();
    List<String> b = actual.lines().toList();
    List<String[]> ops = script(a, b);
    StringBuilder out = new StringBuilder("--- " + expectedName + "\n+++ " + actualName + "\n");
    int i = 0;
    while (i < ops.size()) {
      if (ops.get(i)[0].equals(" ")) {
        i++;
        continue;
      }
      int start = Math.max(0, i - CONTEXT);
      int end = i;
      int quiet = 0;
      while (end < ops.size() && quiet <= 2 * CONTEXT) {
        quiet = ops.get(end)[0].equals(" ") ? quiet + 1 : 0;
        end++;
      }
      end = Math.min(ops.size(), end - Math.max(0, quiet - CONTEXT));
      out.append("@@ ").append(start + 1).append(" @@\n");
      for (int k = start; k < end; k++) {
        out.append(ops.get(k)[0]).append(ops.get(k)[1]).append('\n');
      }
      i = end;
    }
    return out.toString();
  }

  /** Edit script: each entry is {" ", line}, {"-", line} or {"+", line}. */
  private static List<String[]> script(List<String> a, List<String> b) {
    int n = a.size();
    int m = b.size();
    int[][] lcs = new int[n + 1][m + 1];
    for (int i = n - 1; i >= 0; i--) {
      for (int j = m - 1; j >= 0; j--) {
        lcs[i][j] = a.get(i).equals(b.get(j)) ? lcs[i + 1][j + 1] + 1
            : Math.max(lcs[i + 1][j], lcs[i][j + 1]);
      }
    }
    List<String[]> ops = new ArrayList<>();
    int i = 0;
    int j = 0;
    while (i < n && j < m) {
      if (a.get(i).equals(b.get(j))) {
        ops.add(new String[] {" ", a.get(i++)});
        j++;
      } else if (lcs[i + 1][j] >= lcs[i][j + 1]) {
        ops.add(new String[] {"-", a.get(i++)});
      } else {
        ops.add(new String[] {"+", b.get(j++)});
      }
    }
    while (i < n) {
      ops.add(new String[] {"-", a.get(i++)});
    }
    while (j < m) {
      ops.add(new String[] {"+", b.get(j++)});
    }
    return ops;
  }
}
