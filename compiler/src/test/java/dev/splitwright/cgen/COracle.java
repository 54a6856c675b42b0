package dev.splitwright.cgen;

import dev.splitwright.emit.InputKind;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Runs an emitted C classifier over inputs and compares it with the model: the class with {@link
 * DecisionTree#predict} and, with probabilities, the frequencies bit for bit with {@link
 * DecisionTree#probabilities} narrowed to float; unless bare, the label and feature-name bytes
 * with the UTF-8 of the schema's text.
 */
final class COracle {
  private COracle() {}

  /** Mismatches found: how many, and the first few described. */
  record Report(int inputs, int mismatches, List<String> first) {
    void add(String text) {
      if (first.size() < 5) {
        first.add(text);
      }
    }

    String describe() {
      return mismatches + " mismatches in " + inputs + " inputs: " + String.join("; ", first);
    }
  }

  /** Float input: {@code inputs} as they are. */
  static Report checkFloats(Path dir, DecisionTree tree, CEmitOptions options,
      List<float[]> inputs) throws IOException {
    requireKind(options, InputKind.FLOAT);
    byte[] packed = HarnessData.packFloats(inputs, tree.schema().featureCount());
    return compare(dir, tree, options, packed, inputs);
  }

  /** Int32 input: the model sees each value converted to float (C99 6.3.1.4, JLS 5.1.2 alike). */
  static Report checkInts(Path dir, DecisionTree tree, CEmitOptions options, List<int[]> inputs)
      throws IOException {
    requireKind(options, InputKind.INT);
    byte[] packed = HarnessData.packInts(inputs, tree.schema().featureCount());
    List<float[]> modelInputs = new ArrayList<>();
    for (int[] x : inputs) {
      float[] v = new float[x.length];
      for (int f = 0; f < x.length; f++) {
        v[f] = x[f];
      }
      modelInputs.add(v);
    }
    return compare(dir, tree, options, packed, modelInputs);
  }

  private static void requireKind(CEmitOptions options, InputKind kind) {
    if (options.inputKind() != kind) {
      throw new IllegalArgumentException("options take " + options.inputKind());
    }
  }

  private static Report compare(Path dir, DecisionTree tree, CEmitOptions options, byte[] packed,
      List<float[]> modelInputs) throws IOException {
    CSource source = CEmitter.emit(tree, options, dev.splitwright.emit.HeaderInfo.none());
    return compare(dir, tree, options, source, packed, modelInputs);
  }

  /** Runs {@code source} (possibly altered) on {@code packed} inputs. */
  static Report compare(Path dir, Classifier tree, CEmitOptions options, CSource source,
      byte[] packed, List<float[]> modelInputs) throws IOException {
    return report(tree, options, Gcc.buildAndRun(dir, source, options, packed), modelInputs);
  }

  /** Compares a harness output file with the model on {@code modelInputs}. */
  static Report report(Classifier tree, CEmitOptions options, byte[] raw,
      List<float[]> modelInputs) {
    int classes = tree.schema().classCount();
    int features = tree.schema().featureCount();
    HarnessData.Output out = HarnessData.readOutput(raw, modelInputs.size(), classes, features,
        options);
    Report report = new Report(modelInputs.size(), 0, new ArrayList<>());
    int mismatches = 0;
    for (int r = 0; r < modelInputs.size(); r++) {
      float[] x = modelInputs.get(r);
      int expected = tree.predict(x);
      if (out.classes()[r] != expected) {
        mismatches++;
        report.add("class " + out.classes()[r] + " for " + Arrays.toString(x) + ", model "
            + expected);
      }
      if (options.probabilities()) {
        float[] p = tree.floatProbabilities(x);
        for (int c = 0; c < classes; c++) {
          if (Float.floatToRawIntBits(out.probabilities()[r][c])
              != Float.floatToRawIntBits(p[c])) {
            mismatches++;
            report.add("p[" + c + "] " + out.probabilities()[r][c] + " for "
                + Arrays.toString(x) + ", model " + p[c]);
            break;
          }
        }
      }
    }
    if (!options.bare()) {
      mismatches += texts("label", tree.schema().classes(), out.labels(), report);
      mismatches += texts("feature name", tree.schema().featureNames(), out.featureNames(),
          report);
    }
    return new Report(report.inputs(), mismatches, report.first());
  }

  private static int texts(String what, List<String> expected, List<byte[]> actual,
      Report report) {
    List<byte[]> wanted = new ArrayList<>();
    for (String text : expected) {
      // A C string ends at its first NUL (C99 7.1.1): text with U+0000 reads up to there.
      int nul = text.indexOf('\u0000');
      wanted.add((nul < 0 ? text : text.substring(0, nul)).getBytes(StandardCharsets.UTF_8));
    }
    // Out of range, -1 and the count, give "".
    wanted.add(new byte[0]);
    wanted.add(new byte[0]);
    int bad = 0;
    for (int i = 0; i < wanted.size(); i++) {
      if (!Arrays.equals(wanted.get(i), actual.get(i))) {
        bad++;
        report.add(what + " " + i + " differs");
      }
    }
    return bad;
  }
}
