package dev.splitwright.cgen;

import dev.splitwright.emit.FlatTree;
import dev.splitwright.emit.InputKind;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The {@code flat} layout in C: the tree padded to a complete tree ({@link FlatTree}) as {@code
 * static const} arrays, walked in exactly depth steps that add the comparison's outcome to the
 * index. The comparisons are integer arithmetic on order keys, so the walk has no branch on them
 * and no float operation (bar the code check of a categorical split).
 *
 * <p>C keys are unsigned: a float's bits with the sign bit flipped when it is clear and every bit
 * flipped when it is set (as {@link CFloatKeys}), an int32's bits with the sign bit flipped; both
 * are {@link FlatTree}'s signed keys with the sign bit flipped.
 */
final class CFlat {
  /** The unsigned key just above +infinity's: a NaN-left slot's left run starts there. */
  private static final int LOW_NAN_LEFT = 0xff800001;
  /** -infinity's unsigned key: a NaN-right slot's left run starts there. */
  private static final int LOW_NAN_RIGHT = 0x007fffff;

  private CFlat() {}

  /** The arrays and a function with {@code signature} that returns the leaf payload of x. */
  static String function(FlatTree flat, InputKind kind, String prefix, String signature) {
    StringBuilder out = new StringBuilder();
    String node = prefix + "_flat_node";
    String key = prefix + "_flat_key";
    String leaf = prefix + "_flat_leaf";
    String setAt = prefix + "_flat_set_at";
    String sets = prefix + "_flat_sets";
    int d = flat.depth();
    List<Long> leaves = new ArrayList<>();
    for (int j = 0; j < 1 << d; j++) {
      leaves.add((long) flat.leaf(j));
    }
    out.append("/*\n * The tree padded to a complete tree of depth ").append(d)
        .append(": split slot i has children 2i + 1\n * and 2i + 2; leaf slot j is slot ")
        .append((1 << d) - 1).append(" + j.\n */\n");
    if (d == 0) {
      CArrays.writeUnsigned(out, leaf, leaves);
      out.append(signature).append("\n{\n    (void)x;\n    return (int)").append(leaf)
          .append("[0];\n}\n\n");
      return out.toString();
    }
    List<Long> nodes = new ArrayList<>();
    List<String> keys = new ArrayList<>();
    List<Long> setStarts = new ArrayList<>();
    List<String> setWords = new ArrayList<>();
    for (int i = 0; i < flat.splitSlots(); i++) {
      nodes.add(Integer.toUnsignedLong(flat.node(i)));
      if ((flat.node(i) & FlatTree.CATEGORICAL) != 0) {
        keys.add(flat.key(i) + "u");
        setStarts.add((long) setWords.size());
        for (int word : flat.rightCodes(i)) {
          setWords.add(String.format(Locale.ROOT, "0x%08xu", word));
        }
      } else {
        // Float: the threshold's key less the low end of the slot's left run (see below).
        int low = kind == InputKind.INT ? 0 : (flat.node(i) & FlatTree.NAN_RIGHT) != 0
            ? LOW_NAN_RIGHT : LOW_NAN_LEFT;
        keys.add(String.format(Locale.ROOT, "0x%08xu", ((int) flat.key(i) ^ 0x80000000) - low));
        setStarts.add(0L);
      }
    }
    out.append("/*\n * Per split slot: feature * 4 + 2 if categorical + 1 if a missing value goes"
        + "\n * right. Padding slots below a leaf compare anything: every leaf slot below it\n"
        + " * holds its result.\n */\n");
    CArrays.writeUnsigned(out, node, nodes);
    out.append("/* Per split slot: x goes right when its key is above this; k if categorical. */"
        + "\n");
    CArrays.write(out, "uint32_t", key, keys, 6);
    CArrays.writeUnsigned(out, leaf, leaves);
    if (flat.hasCategorical()) {
      out.append("/* Per categorical slot: where its right-going code bits start in sets. */\n");
      CArrays.writeUnsigned(out, setAt, setStarts);
      out.append("/* Bit c of a set: code c goes right; bit k: a missing or unknown code. */\n");
      CArrays.write(out, "uint32_t", sets, setWords, 6);
    }
    out.append(signature).append("\n{\n")
        .append("    uint32_t i = 0u;\n")
        .append("    unsigned level;\n")
        .append("    for (level = 0u; level < ").append(d).append("u; level++) {\n")
        .append("        const uint32_t w = ").append(node).append("[i];\n")
        .append("        uint32_t key;\n")
        .append("        uint32_t right;\n");
    if (kind == InputKind.INT) {
      out.append("        key = (uint32_t)x[w >> 2] ^ 0x80000000u;\n")
          .append("        /* 1 when key > t: the 64-bit difference wraps below zero. */\n")
          .append("        right = (uint32_t)(((uint64_t)").append(key)
          .append("[i] - key) >> 63);\n");
    } else {
      out.append("        union {\n            float value;\n            uint32_t bits;\n"
              + "        } u;\n")
          .append("        uint32_t low;\n")
          .append("        u.value = x[w >> 2];\n")
          .append("        key = u.bits ^ ((0u - (u.bits >> 31)) | 0x80000000u);\n")
          .append("        /*\n         * The keys that go left are one run counted round the"
              + " circle from low:\n         * from -infinity's key if NaN goes right, else from"
              + " just above\n         * +infinity's, through every NaN. The slot holds t - low."
              + "\n         */\n")
          .append(String.format(Locale.ROOT, "        low = 0x%08xu ^ ((0u - (w & 1u)) & 0x%08xu);"
              + "\n", LOW_NAN_LEFT, LOW_NAN_LEFT ^ LOW_NAN_RIGHT))
          .append("        /* 1 when key - low > t - low: the 64-bit difference wraps. */\n")
          .append("        right = (uint32_t)(((uint64_t)").append(key)
          .append("[i] - (uint32_t)(key - low)) >> 63);\n");
    }
    if (flat.hasCategorical()) {
      out.append("        {\n")
          .append("            /* A numeric slot masks k to 0 and reads a bit it then drops. */\n")
          .append("            const uint32_t cat = 0u - ((w >> 1) & 1u);\n")
          .append("            const uint32_t k = ").append(key).append("[i] & cat;\n")
          .append("            uint32_t code;\n");
      if (kind == InputKind.INT) {
        out.append("            const uint32_t c = (uint32_t)x[w >> 2];\n")
            .append("            const uint32_t valid = (uint32_t)(((uint64_t)c - k) >> 63);\n")
            .append("            code = (c & (0u - valid)) | (k & (valid - 1u));\n");
      } else {
        out.append("            union {\n                float value;\n"
                + "                uint32_t bits;\n            } kf, vc, cf;\n")
            .append("            uint32_t bad;\n")
            .append("            uint32_t whole;\n")
            .append("            int32_t c;\n")
            .append("            kf.value = (float)k;\n")
            .append("            /* Below -0 (or a negative NaN), or k and above (or NaN). */\n")
            .append("            bad = (uint32_t)(((uint64_t)key - 0x7fffffffu) >> 63)\n"
                + "                | (1u ^ (uint32_t)(((uint64_t)key - (kf.bits | 0x80000000u))"
                + " >> 63));\n")
            .append("            /* 0.0f when out of range, so the conversion is defined. */\n")
            .append("            vc.bits = u.bits & (bad - 1u);\n")
            .append("            c = (int32_t)vc.value;\n")
            .append("            cf.value = (float)c;\n")
            .append("            /* + 0.0f turns -0 into +0 (IEEE 754-2008 6.3): code 0. */\n")
            .append("            vc.value = vc.value + 0.0f;\n")
            .append("            whole = cf.bits ^ vc.bits;\n")
            .append("            bad |= (whole | (0u - whole)) >> 31;\n")
            .append("            code = ((uint32_t)c & (bad - 1u)) | (k & (0u - bad));\n");
      }
      out.append("            right = (right & ~cat) | ((").append(sets).append("[")
          .append(setAt)
          .append("[i] + (code >> 5)]\n                >> (code & 31u)) & cat & 1u);\n")
          .append("        }\n");
    }
    out.append("        i = 2u * i + 1u + right;\n")
        .append("    }\n")
        .append("    return (int)").append(leaf).append("[i - ").append((1 << d) - 1)
        .append("u];\n}\n\n");
    return out.toString();
  }
}
