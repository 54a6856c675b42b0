package dev.splitwright.emit;

import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.Leaf;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Numbers leaves by their class and float32 class frequencies, so that leaves alike share one
 * number and one row of the emitted frequency tables, whatever the output language. Numbers are
 * given in the order leaves are first seen, so equal trees get equal numbers.
 */
public final class LeafNumbers {
  private final Map<String, Integer> numbers = new LinkedHashMap<>();
  private final List<Leaf> distinct = new ArrayList<>();

  /** The number of {@code leaf}: that of the first leaf seen with its class and frequencies. */
  public int numberOf(Leaf leaf) {
    StringBuilder key = new StringBuilder().append(leaf.prediction());
    for (float v : frequencies(leaf.counts())) {
      key.append(',').append(Float.floatToRawIntBits(v));
    }
    return numbers.computeIfAbsent(key.toString(), k -> {
      distinct.add(leaf);
      return distinct.size() - 1;
    });
  }

  /** One leaf per number, in number order. */
  public List<Leaf> distinct() {
    return List.copyOf(distinct);
  }

  /**
   * The frequencies as {@code DecisionTree.probabilities} gives them, {@code count / (double)
   * total}, narrowed to float: computed here so that the emitted code needs no arithmetic.
   */
  public static float[] frequencies(ClassCounts counts) {
    double total = counts.total();
    float[] p = new float[counts.classCount()];
    for (int c = 0; c < p.length; c++) {
      p[c] = (float) (total == 0 ? 0 : counts.get(c) / total);
    }
    return p;
  }
}
