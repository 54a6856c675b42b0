package dev.splitwright.verify;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.InputKind;
import dev.splitwright.model.Classifier;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/**
 * Verifies a classifier that runs outside this JVM and answers a whole list of inputs at once,
 * such as an emitted C file built into a native program. The inputs are those {@link Verifier}
 * uses: every row, the boundary probes of every split, the seeded random inputs and, for int
 * input, every row and probe converted as Java converts float to int plus {@link IntProbes}.
 */
public final class BatchVerifier {
  private static final int REPORTED_MISMATCHES = 5;

  private BatchVerifier() {}

  /**
   * What the classifier answered, one entry per input in order.
   *
   * @param probabilities per input the class frequencies, or no rows without probabilities
   */
  public record Answers(int[] classes, float[][] probabilities) {

    public Answers {
      Objects.requireNonNull(classes, "classes");
      Objects.requireNonNull(probabilities, "probabilities");
    }
  }

  /** A classifier run over many inputs at once. */
  public interface BatchClassifier {

    /** Classifies float inputs (never called for int input). */
    Answers floats(List<float[]> inputs);

    /** Classifies int32 inputs (never called for float input). */
    Answers ints(List<int[]> inputs);
  }

  /**
   * The inputs {@link #check} hands to a classifier of {@code kind}, in that order, so that another
   * run of the same code (e.g. on an emulated core) checks exactly the same set.
   *
   * @param kind {@link InputKind#FLOAT} or {@link InputKind#INT}
   * @param rows the data whose every row is checked
   * @param seed the seed of the random inputs
   */
  public static Inputs inputs(Classifier tree, InputKind kind, List<Dataset> rows, long seed) {
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(rows, "rows");
    List<float[]> probes = Verifier.inputs(tree, rows, seed, Verifier.RANDOM_PROBES);
    if (kind == InputKind.FLOAT) {
      return new Inputs(kind, probes, List.of());
    }
    if (kind != InputKind.INT) {
      throw new IllegalArgumentException("a batch classifier takes float or int input");
    }
    List<int[]> ints = new ArrayList<>();
    for (float[] probe : probes) {
      ints.add(toInts(tree.schema(), probe));
    }
    ints.addAll(Trees.probes(tree, IntProbes::of));
    return new Inputs(kind, List.of(), ints);
  }

  /**
   * The inputs of one check: every row, the boundary probes of every split and the seeded random
   * inputs, as float rows for float input or, for int input, converted as Java converts float to
   * int and followed by {@link IntProbes}.
   *
   * @param floats the rows of float input, empty for int input
   * @param ints the rows of int input, empty for float input
   */
  public record Inputs(InputKind kind, List<float[]> floats, List<int[]> ints) {

    public Inputs {
      Objects.requireNonNull(kind, "kind");
      floats = List.copyOf(floats);
      ints = List.copyOf(ints);
    }

    /** How many inputs. */
    public int size() {
      return kind == InputKind.FLOAT ? floats.size() : ints.size();
    }
  }

  /**
   * Compares {@code classifier} with {@code tree}: the class of every input and, with {@code
   * probabilities}, every frequency bit for bit with {@link DecisionTree#probabilities} narrowed
   * to float, or an ensemble's {@link TreeEnsemble#probabilities}.
   *
   * @param kind {@link InputKind#FLOAT} or {@link InputKind#INT}
   */
  public static VerificationResult check(Classifier tree, InputKind kind,
      boolean probabilities, List<Dataset> rows, long seed, BatchClassifier classifier) {
    Objects.requireNonNull(tree, "tree");
    Objects.requireNonNull(classifier, "classifier");
    Inputs inputs = inputs(tree, kind, rows, seed);
    List<float[]> modelInputs = new ArrayList<>();
    Answers answers;
    if (kind == InputKind.FLOAT) {
      modelInputs.addAll(inputs.floats());
      answers = classifier.floats(inputs.floats());
    } else {
      for (int[] x : inputs.ints()) {
        modelInputs.add(EmittedClassifier.modelInput(x));
      }
      answers = classifier.ints(inputs.ints());
    }
    if (answers.classes().length != modelInputs.size()
        || (probabilities && answers.probabilities().length != modelInputs.size())) {
      throw new IllegalStateException("the classifier answered " + answers.classes().length
          + " of " + modelInputs.size() + " inputs");
    }
    Coverage coverage = new Coverage(tree);
    long mismatches = 0;
    List<String> first = new ArrayList<>();
    for (int i = 0; i < modelInputs.size(); i++) {
      float[] x = modelInputs.get(i);
      coverage.record(x);
      int expected = tree.predict(x);
      String problem = null;
      if (answers.classes()[i] != expected) {
        problem = "class " + answers.classes()[i] + ", model " + expected;
      } else if (probabilities) {
        float[] p = tree.floatProbabilities(x);
        for (int c = 0; c < p.length && problem == null; c++) {
          float got = answers.probabilities()[i][c];
          if (Float.floatToRawIntBits(got) != Float.floatToRawIntBits(p[c])) {
            problem = "probability of class " + c + " " + got + ", model " + p[c];
          }
        }
      }
      if (problem != null) {
        mismatches++;
        if (first.size() < REPORTED_MISMATCHES) {
          first.add("input " + Arrays.toString(x) + ": " + problem);
        }
      }
    }
    return new VerificationResult(modelInputs.size(), mismatches, first, coverage.splits(),
        coverage.covered(), 0, 0, 0, List.of(), 0, List.of());
  }

  /**
   * Java's float-to-int conversion (JLS §5.1.3), as the Java int classifier's check uses it: NaN
   * to 0, saturating at the int range; a missing category to -1, which int classifiers read as
   * missing.
   */
  static int[] toInts(Schema schema, float[] probe) {
    int[] x = new int[probe.length];
    for (int f = 0; f < x.length; f++) {
      x[f] = Float.isNaN(probe[f]) && schema.feature(f).isCategorical() ? -1 : (int) probe[f];
    }
    return x;
  }
}
