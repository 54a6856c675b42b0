package dev.splitwright.job;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.cli.Main;
import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.InputKind;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Integer inputs end to end on real integer-valued measurements: the six whole-number columns of
 * Pima Indians Diabetes (pregnancies, glucose, blood pressure, skin fold, insulin, age; the
 * data sets README), with the rows that miss any of them dropped, because an int cannot be
 * missing. Mass and pedigree are left out: they are not whole numbers.
 */
class IntInputsPipelineTest {
  private static final List<String> INTEGRAL =
      List.of("pregnant", "glucose", "pressure", "triceps", "insulin", "age");

  @TempDir static Path dir;
  private static Path csv;
  private static int rows;

  @BeforeAll
  static void writeIntegralPima() throws Exception {
    Path pima = Path.of(IntInputsPipelineTest.class
        .getResource("/datasets/pima-indians-diabetes-2.csv").toURI());
    Dataset data = CsvLoader.load(pima).dataset();
    Schema schema = data.schema();
    StringBuilder out = new StringBuilder(String.join(",", INTEGRAL)).append(",diabetes\n");
    for (int r = 0; r < data.rows(); r++) {
      StringBuilder line = new StringBuilder();
      boolean complete = true;
      for (String name : INTEGRAL) {
        float v = data.value(r, schema.featureNames().indexOf(name));
        complete &= !Float.isNaN(v);
        line.append(String.format(Locale.ROOT, "%d,", (int) v));
      }
      if (complete) {
        out.append(line).append(schema.classes().get(data.label(r))).append('\n');
        rows++;
      }
    }
    csv = Files.writeString(dir.resolve("pima-integral.csv"), out, StandardCharsets.UTF_8);
  }

  @Test
  void keepsTheCompleteCasesOfTheIntegralColumns() {
    // Counted independently with awk: 393 data lines have all six of these cells non-empty.
    assertThat(rows).isEqualTo(393);
  }

  @Test
  void intClassifierAgreesWithModelOnEveryRowAndIntBoundaryProbe() throws Exception {
    CompileResult ints = compile(InputKind.INT);
    CompileResult floats = compile(InputKind.FLOAT);
    VerificationResult v = ints.verification();
    assertThat(v.passed()).as(v.verdict()).isTrue();
    assertThat(v.mismatches()).isZero();
    assertThat(ints.tree()).isEqualTo(floats.tree());

    // Same rows, boundary and random probes as for float inputs, plus six int probes a split
    // (threshold's n - 1, n, n + 1, Integer.MIN_VALUE, 0, Integer.MAX_VALUE).
    int splits = ints.tree().internalNodeCount();
    assertThat(splits).isGreaterThan(10);
    assertThat(v.inputsChecked() - floats.verification().inputsChecked())
        .isEqualTo(6L * splits);
    assertThat(v.inputsChecked()).isGreaterThan(rows + 6L * splits);

    // Every comparison is against a whole number: the largest int at or below the threshold.
    String source = ints.emission().files().get(0).text();
    assertThat(source).contains("public static int classify(int[] x)");
    Matcher m = Pattern.compile("x\\[(\\d)] <= (-?\\d+)\\)").matcher(source);
    int comparisons = 0;
    while (m.find()) {
      comparisons++;
    }
    assertThat(comparisons).isEqualTo(splits);
    for (Split split : ints.tree().splitsPreOrder()) {
      float t = ((NumericSplit) split).threshold();
      assertThat(source).contains("x[" + split.feature() + "] <= " + (long) Math.floor(t) + ")");
    }
  }

  @Test
  void cliWritesIntClassifierAndReportsZeroMismatches() throws Exception {
    Path out = dir.resolve("cli");
    StringWriter stdout = new StringWriter();
    StringWriter stderr = new StringWriter();
    int code = Main.run(new String[] {"compile", "--data", csv.toString(), "--int-inputs",
        "--max-depth", "6", "--class", "PimaCounts", "--out", out.toString()},
        new PrintWriter(stdout), new PrintWriter(stderr));
    assertThat(code).as(stderr.toString()).isZero();
    assertThat(stdout.toString()).containsPattern("verified: \\d+ inputs, 0 mismatches");
    // The options line of the class comment may wrap; joined again here.
    assertThat(Files.readString(out.resolve("PimaCounts.java")).replace("\n * ", " "))
        .contains("public static int classify(int[] x)")
        .contains("--input int");
  }

  private static CompileResult compile(InputKind kind) throws Exception {
    CompileRequest request = new CompileRequest(csv, Optional.empty(), Optional.empty(),
        LoadOptions.defaults(), new double[] {0.6, 0.2, 0.2}, 1,
        TrainingOptions.builder().maxDepth(6).build(),
        EmitOptions.builder("", "PimaCounts").inputKind(kind).build(),
        dir.resolve(kind.optionName()), Optional.empty(), "--input " + kind.optionName());
    return new CompileJob(Verifier.create()).run(request);
  }
}
