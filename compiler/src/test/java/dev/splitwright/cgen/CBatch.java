package dev.splitwright.cgen;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.model.Classifier;
import dev.splitwright.verify.ProbeAccess;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Emitted C classifiers built many to one executable, whose {@code main} picks a classifier's
 * harness by name (a compiler run's start-up and linking dominate a small build), each run on its
 * verification probes and compared with its model by {@link COracle}.
 */
final class CBatch {
  private CBatch() {}

  /** One classifier, its options, its probes as the harness reads them and as the model does. */
  record Case(String base, Classifier model, CEmitOptions options, byte[] input,
      List<float[]> modelInputs) {}

  /**
   * {@code model} with the verifier's probes seeded with {@code seed}: float rows, or for int
   * input those rows converted as Java converts float to int, followed by the int probes.
   */
  static Case withProbes(String base, Classifier model, CEmitOptions options, long seed,
      int randomProbes) {
    int features = model.schema().featureCount();
    List<float[]> floats = ProbeAccess.floatProbes(model, seed, randomProbes);
    if (options.inputKind() == InputKind.FLOAT) {
      return new Case(base, model, options, HarnessData.packFloats(floats, features), floats);
    }
    List<int[]> ints = new ArrayList<>(ProbeAccess.intProbes(model));
    for (float[] x : floats) {
      int[] v = new int[x.length];
      for (int f = 0; f < v.length; f++) {
        v[f] = (int) x[f]; // JLS 5.1.3: NaN to 0, saturating at the int range.
      }
      ints.add(v);
    }
    List<float[]> inputs = new ArrayList<>();
    for (int[] x : ints) {
      float[] v = new float[x.length];
      for (int f = 0; f < v.length; f++) {
        v[f] = x[f];
      }
      inputs.add(v);
    }
    return new Case(base, model, options, HarnessData.packInts(ints, features), inputs);
  }

  /**
   * Builds {@code cases} into one executable in {@code dir} with {@link Gcc#STRICT} (and the
   * sanitizers when {@code sanitized}), runs each and asserts it matches its model.
   *
   * @return how many cases were checked
   */
  static int run(Path dir, List<Case> cases, boolean sanitized) throws IOException {
    List<String> files = new ArrayList<>();
    StringBuilder dispatch = new StringBuilder("#include <string.h>\n");
    for (Case c : cases) {
      CSource source = CEmitter.emit(c.model(), c.options(), HeaderInfo.none());
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
      COracle.Report report = COracle.report(c.model(), c.options(), Files.readAllBytes(out),
          c.modelInputs());
      assertThat(report.mismatches()).as(c.base() + " " + c.options() + ": " + report.describe())
          .isZero();
      Files.delete(in);
      Files.delete(out);
    }
    return cases.size();
  }
}
