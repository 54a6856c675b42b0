package dev.splitwright.cgen;

import dev.splitwright.emit.LeafNumbers;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.Leaf;
import java.util.ArrayList;
import java.util.List;

/**
 * What the tree code returns at a leaf: the class, or with probabilities a leaf number that tables
 * map to the class and to the class frequencies. Leaves with the same class and frequencies share
 * a number. The frequencies are {@code (float) (count / (double) total)}, computed here as {@code
 * DecisionTree.probabilities} computes them and then narrowed, so the C code needs no arithmetic
 * and gives the model's floats bit for bit.
 */
final class CLeaves {
  private final String prefix;
  private final boolean probabilities;
  private final LeafNumbers numbers = new LeafNumbers();

  CLeaves(String prefix, boolean probabilities) {
    this.prefix = prefix;
    this.probabilities = probabilities;
  }

  int payload(Leaf leaf) {
    return probabilities ? numbers.numberOf(leaf) : leaf.prediction();
  }

  private static float[] frequencies(ClassCounts counts) {
    return LeafNumbers.frequencies(counts);
  }

  /**
   * The tables {@code <prefix>_probabilities} reads: per leaf number its class and the range of its
   * non-zero frequencies in the share tables. Call after every leaf got its payload.
   */
  void writeTables(StringBuilder out) {
    if (!probabilities) {
      return;
    }
    List<Long> classes = new ArrayList<>();
    List<Long> starts = new ArrayList<>();
    List<Long> shareClasses = new ArrayList<>();
    List<String> shares = new ArrayList<>();
    for (Leaf leaf : numbers.distinct()) {
      classes.add((long) leaf.prediction());
      starts.add((long) shares.size());
      float[] p = frequencies(leaf.counts());
      for (int c = 0; c < p.length; c++) {
        if (p[c] != 0f) {
          shareClasses.add((long) c);
          shares.add(CText.hexFloat(p[c]) + " /* " + CText.decimal(p[c]) + " */");
        }
      }
    }
    starts.add((long) shares.size());
    out.append("/* Leaf number to class. */\n");
    CArrays.writeUnsigned(out, prefix + "_leaf_class", classes);
    if (shares.isEmpty()) {
      return;
    }
    out.append("/* Leaf n's non-zero class frequencies are entries start[n] to start[n + 1] - 1\n"
        + " * of the class and share tables. */\n");
    CArrays.writeUnsigned(out, prefix + "_share_start", starts);
    CArrays.writeUnsigned(out, prefix + "_share_class", shareClasses);
    CArrays.write(out, "float", prefix + "_share", shares, 3);
  }

  /** {@code <prefix>_probabilities}: fills {@code out} from the leaf {@code leafCall} returns. */
  void writeProbabilities(StringBuilder out, String signature, String leafCall) {
    out.append(signature).append("\n{\n");
    boolean anyShare = numbers.distinct().stream()
        .anyMatch(l -> l.counts().total() > 0);
    String macro = prefix.toUpperCase(java.util.Locale.ROOT);
    if (anyShare) {
      out.append("    const int leaf = ").append(leafCall).append(";\n");
      out.append("    int j;\n");
    } else {
      out.append("    (void)x;\n");
    }
    out.append("    int c;\n")
        .append("    for (c = 0; c < ").append(macro).append("_CLASS_COUNT; c++) {\n")
        .append("        out[c] = 0x0p+0f;\n    }\n");
    if (anyShare) {
      String start = prefix + "_share_start";
      out.append("    for (j = (int)").append(start).append("[leaf]; j < (int)").append(start)
          .append("[leaf + 1]; j++) {\n")
          .append("        out[").append(prefix).append("_share_class[j]] = ").append(prefix)
          .append("_share[j];\n    }\n");
    }
    out.append("}\n\n");
  }
}
