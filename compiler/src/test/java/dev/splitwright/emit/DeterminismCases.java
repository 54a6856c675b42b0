package dev.splitwright.emit;

import dev.splitwright.model.DecisionTree;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * Seeded trees emitted with every layout and input option; {@link #main} writes them to a
 * directory so that a fresh JVM's output can be compared with this one's.
 */
public final class DeterminismCases {
  private DeterminismCases() {}

  /** Seeded random trees, categorical features and probabilities included. */
  static List<DecisionTree> trees() {
    List<DecisionTree> trees = new ArrayList<>();
    for (int seed = 1; seed <= 4; seed++) {
      SplittableRandom random = new SplittableRandom(seed);
      trees.add(RandomTrees.tree(random, RandomTrees.schema(random, 20, 4), 12, 1500));
    }
    return trees;
  }

  /** File name to source, in a fixed order. */
  static Map<String, String> emitAll(List<DecisionTree> trees) {
    Map<String, String> out = new LinkedHashMap<>();
    for (int t = 0; t < trees.size(); t++) {
      for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
        for (InputKind input : InputKind.values()) {
          EmitOptions options = EmitOptions.builder("det", "Tree" + t).layout(layout)
              .inputKind(input).namedArgs(input != InputKind.FLOAT)
              .probabilities(input != InputKind.INT).maxMethodBytes(1000).build();
          String name = "Tree" + t + "-" + layout.optionName() + "-" + input.optionName();
          out.put(name, JavaEmitter.emit(trees.get(t), options, HeaderInfo.none()).source());
        }
      }
    }
    return out;
  }

  /** Writes every case to {@code args[0]}, one file each. */
  public static void main(String[] args) throws IOException {
    Path dir = Path.of(args[0]);
    for (Map.Entry<String, String> e : emitAll(trees()).entrySet()) {
      Files.writeString(dir.resolve(e.getKey() + ".java"), e.getValue(), StandardCharsets.UTF_8);
    }
  }
}
