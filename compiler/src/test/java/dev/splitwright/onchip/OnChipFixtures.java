package dev.splitwright.onchip;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.check.ArmToolNotFoundException;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.cli.Main;
import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.persist.ModelFile;
import dev.splitwright.verify.ProbeAccess;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;

/** The ARM tools, the pump sample's tree and the inputs verification uses, for on-chip tests. */
public final class OnChipFixtures {
  static final Duration BUILD_LIMIT = Duration.ofSeconds(300);
  static final Duration RUN_LIMIT = Duration.ofSeconds(300);
  /** The emitted-C warning set of the style guide, at -Os as for a device. */
  static final List<String> STRICT = List.of("-std=c99", "-Os", "-Wall", "-Wextra", "-Wpedantic",
      "-Wconversion", "-Wshadow", "-Werror");
  /** The seed and random probe count of the Verifier's defaults. */
  static final long SEED = 7;
  static final int RANDOM_PROBES = 2000;

  private OnChipFixtures() {}

  /** The ARM cross compiler and qemu, or the test is skipped with the packages to install. */
  public static CortexMToolchain arm() {
    try {
      return CortexMToolchain.find(BUILD_LIMIT);
    } catch (ArmToolNotFoundException e) {
      assumeTrue(false, e.getMessage());
      throw new AssertionError(e);
    }
  }

  /**
   * The tree of the shipped pump sample: the CLI run with the sample's recorded arguments
   * (generated-samples/commands/pump-monitor.args) and {@code --save-model}.
   */
  static DecisionTree pumpSample(Path dir) throws IOException, InputException {
    return sample(dir, "pump-monitor");
  }

  /** The tree a sample's recorded command line trains. */
  static DecisionTree sample(Path dir, String sample) throws IOException, InputException {
    Path argsFile = Path.of("..", "generated-samples", "commands", sample + ".args");
    List<String> args = new ArrayList<>();
    for (String line : Files.readAllLines(argsFile, StandardCharsets.UTF_8)) {
      String arg = line.strip();
      if (!arg.isEmpty() && !arg.startsWith("#")) {
        args.add(arg.replace("${splitwright.demoData}", DemoFiles.dir().toString()));
      }
    }
    Path model = dir.resolve(sample + ".model.json");
    args.addAll(List.of("--out", dir.resolve(sample).toString(), "--save-model",
        model.toString(), "--quiet"));
    StringWriter err = new StringWriter();
    int code = Main.run(args.toArray(new String[0]), new PrintWriter(new StringWriter()),
        new PrintWriter(err));
    assertThat(code).as("splitwright %s: %s", args, err).isZero();
    return ModelFile.read(model);
  }

  static Dataset load(Path csv, String target) throws InputException {
    return CsvLoader.load(csv, LoadOptions.builder().target(target).build()).dataset();
  }

  /** Every data row, the boundary probes and the random probes, as verification runs them. */
  static ProofInputs floatInputs(DecisionTree tree, Dataset data) {
    return ProofInputs.ofFloats(tree.schema().featureCount(),
        ProbeAccess.verificationInputs(tree, List.of(data), SEED, RANDOM_PROBES));
  }

  /** The int boundary probes, then every data row rounded to int. */
  static ProofInputs intInputs(DecisionTree tree, Dataset data) {
    List<int[]> rows = new ArrayList<>(ProbeAccess.intProbes(tree));
    for (int r = 0; r < data.rows(); r++) {
      float[] x = data.row(r);
      int[] v = new int[x.length];
      for (int f = 0; f < x.length; f++) {
        v[f] = Float.isNaN(x[f]) ? 0 : Math.round(x[f]);
      }
      rows.add(v);
    }
    return ProofInputs.ofInts(tree.schema().featureCount(), rows);
  }
}
