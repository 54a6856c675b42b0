package dev.splitwright.cgen;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.emit.RandomTrees;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.verify.ProbeAccess;
import java.io.IOException;
import java.nio.file.Files;
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

  private record Case(String base, DecisionTree tree, CEmitOptions options, byte[] input,
      List<float[]> modelInputs) {}

  @Test
  void randomTreesGiveTheModelsClassesAndFrequencies() throws IOException {
    assumeTrue(Gcc.available(), "gcc is needed to build emitted C");
    SplittableRandom random = new SplittableRandom(0xF1A7_C0DEL);
    int checked = 0;
    for (int start = 0; start < TREES; start += PER_BUILD) {
      List<Case> cases = new ArrayList<>();
      for (int i = start; i < Math.min(TREES, start + PER_BUILD); i++) {
        cases.add(newCase("t" + i, random.split()));
      }
      checked += runBatch(cases, (start / PER_BUILD) % SANITIZED_EVERY == 0);
    }
    assertThat(checked).isEqualTo(TREES);
  }

  private static Case newCase(String base, SplittableRandom random) {
    RandomTrees.Shape drawn = RandomTrees.shape(random);
    // Up to depth 12 here, so 25 trees stay one quick build; FlatLayoutTest goes to 16 in Java.
    DecisionTree tree = RandomTrees.tree(random, new RandomTrees.Shape(
        Math.min(12, drawn.maxDepth()), drawn.maxNodes(), drawn.features(), drawn.classes()));
    CEmitOptions options = new CEmitOptions(base, Layout.FLAT,
        random.nextInt(3) == 0 ? InputKind.INT : InputKind.FLOAT,
        random.nextBoolean(), random.nextInt(4) == 0);
    int features = tree.schema().featureCount();
    List<float[]> floats = ProbeAccess.floatProbes(tree, random.nextLong(), RANDOM_PROBES);
    if (options.inputKind() == InputKind.FLOAT) {
      return new Case(base, tree, options, HarnessData.packFloats(floats, features), floats);
    }
    List<int[]> ints = new ArrayList<>(ProbeAccess.intProbes(tree));
    for (float[] x : floats) {
      int[] v = new int[x.length];
      for (int f = 0; f < v.length; f++) {
        v[f] = (int) x[f]; // JLS 5.1.3: NaN to 0, saturating at the int range.
      }
      ints.add(v);
    }
    List<float[]> model = new ArrayList<>();
    for (int[] x : ints) {
      float[] v = new float[x.length];
      for (int f = 0; f < v.length; f++) {
        v[f] = x[f];
      }
      model.add(v);
    }
    return new Case(base, tree, options, HarnessData.packInts(ints, features), model);
  }

  private int runBatch(List<Case> cases, boolean sanitized) throws IOException {
    List<String> files = new ArrayList<>();
    StringBuilder dispatch = new StringBuilder("#include <string.h>\n");
    for (Case c : cases) {
      CSource source = CEmitter.emit(c.tree(), c.options(), HeaderInfo.none());
      String harness = CHarness.source(c.options()).replace("int main(int argc, char **argv)",
          "int " + c.base() + "_main(int argc, char **argv)");
      Gcc.write(dir, source.headerName(), source.headerText(), source.sourceName(),
          source.sourceText(), CHarness.fileName(c.options()), harness);
      files.add(source.sourceName());
      files.add(CHarness.fileName(c.options()));
      dispatch.append("int ").append(c.base()).append("_main(int argc, char **argv);\n");
    }
    dispatch.append("int main(int argc, char **argv)\n{\n    if (argc < 2) {\n        return 2;\n"
        + "    }\n");
    for (Case c : cases) {
      dispatch.append("    if (strcmp(argv[1], \"").append(c.base()).append("\") == 0) {\n")
          .append("        return ").append(c.base()).append("_main(argc - 1, argv + 1);\n    }\n");
    }
    dispatch.append("    return 2;\n}\n");
    Gcc.write(dir, "dispatch.c", dispatch.toString());
    files.add("dispatch.c");
    List<String> flags = new ArrayList<>(Gcc.STRICT);
    if (sanitized) {
      flags.addAll(Gcc.SANITIZE);
    }
    Gcc.gcc(dir, flags, files, "batch").orFail("gcc of " + files);
    for (Case c : cases) {
      Path in = dir.resolve(c.base() + ".in");
      Path out = dir.resolve(c.base() + ".out");
      Files.write(in, c.input());
      Gcc.run(dir, List.of(dir.resolve("batch").toString(), c.base(), in.toString(),
          out.toString())).orFail("harness " + c.base());
      COracle.Report report = COracle.report(c.tree(), c.options(), Files.readAllBytes(out),
          c.modelInputs());
      assertThat(report.mismatches()).as(c.base() + " " + c.options() + ": " + report.describe())
          .isZero();
      Files.delete(in);
      Files.delete(out);
    }
    return cases.size();
  }
}
