package dev.splitwright.cgen;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.emit.RandomTrees;
import dev.splitwright.model.DecisionTree;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The flat layout in C ({@link CFlat}), as {@link CRandomTreesTest} checks the others. Seeded
 * random trees (thresholds among subnormals, signed zeros, neighbouring floats, the largest
 * values, infinities and integers past 2^24 and 2^31) in random variants, each built with gcc and
 * compared with the model on verification's probes. Trees are built 25 to an executable, whose
 * {@code main} picks the tree's harness by name, because a compiler run's start-up and linking
 * dominate the time of a small build. Every fourth executable is built with the address and
 * undefined-behaviour sanitizers, which triple a build's time; the others with the plain strict
 * flags.
 */
class CFlatRandomTreesTest {
  /** More with {@code -Dcgen.randomTrees=N}. */
  private static final int TREES = Integer.getInteger("cgen.flatTrees", 300);
  private static final int PER_BUILD = 25;
  private static final int SANITIZED_EVERY = 4;
  private static final int RANDOM_PROBES = 100;

  @TempDir
  Path dir;

  @Test
  void randomTreesGiveTheModelsClassesAndFrequencies() throws IOException {
    assumeTrue(Gcc.available(), "gcc is needed to build emitted C");
    SplittableRandom random = new SplittableRandom(0xF1A7_C0DEL);
    int checked = 0;
    for (int start = 0; start < TREES; start += PER_BUILD) {
      List<CBatch.Case> cases = new ArrayList<>();
      for (int i = start; i < Math.min(TREES, start + PER_BUILD); i++) {
        cases.add(newCase("t" + i, random.split()));
      }
      checked += CBatch.run(dir, cases, (start / PER_BUILD) % SANITIZED_EVERY == 0);
    }
    assertThat(checked).isEqualTo(TREES);
  }

  private static CBatch.Case newCase(String base, SplittableRandom random) {
    RandomTrees.Shape drawn = RandomTrees.shape(random);
    // Up to depth 12 here, so 25 trees stay one quick build; FlatLayoutTest goes to 16 in Java.
    DecisionTree tree = RandomTrees.tree(random, new RandomTrees.Shape(
        Math.min(12, drawn.maxDepth()), drawn.maxNodes(), drawn.features(), drawn.classes()));
    CEmitOptions options = new CEmitOptions(base, Layout.FLAT,
        random.nextInt(3) == 0 ? InputKind.INT : InputKind.FLOAT,
        random.nextBoolean(), random.nextInt(4) == 0);
    return CBatch.withProbes(base, tree, options, random.nextLong(), RANDOM_PROBES);
  }

}
