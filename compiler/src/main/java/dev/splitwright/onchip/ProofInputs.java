package dev.splitwright.onchip;

import dev.splitwright.cgen.HarnessData;
import dev.splitwright.emit.InputKind;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The inputs an on-chip proof runs: float rows for a classifier emitted with float input, or int32
 * rows for int input, which the model sees converted to float (C99 6.3.1.4 and JLS 5.1.2 round the
 * same way, to nearest).
 *
 * @param kind {@link InputKind#FLOAT} or {@link InputKind#INT}
 * @param featureCount values per row
 * @param floats the rows of float input, empty for int input
 * @param ints the rows of int input, empty for float input
 */
public record ProofInputs(InputKind kind, int featureCount, List<float[]> floats,
    List<int[]> ints) {

  public ProofInputs {
    Objects.requireNonNull(kind, "kind");
    floats = copyFloats(Objects.requireNonNull(floats, "floats"), featureCount);
    ints = copyInts(Objects.requireNonNull(ints, "ints"), featureCount);
    if (kind == InputKind.DOUBLE) {
      throw new IllegalArgumentException("C input is float or int32, not double");
    }
    if (kind == InputKind.FLOAT ? !ints.isEmpty() : !floats.isEmpty()) {
      throw new IllegalArgumentException(kind + " inputs take only "
          + (kind == InputKind.FLOAT ? "float" : "int") + " rows");
    }
    if (featureCount <= 0) {
      throw new IllegalArgumentException("featureCount must be > 0, but it is " + featureCount);
    }
  }

  /** Float rows of {@code featureCount} values each; NaN payloads and signed zeros are kept. */
  public static ProofInputs ofFloats(int featureCount, List<float[]> rows) {
    return new ProofInputs(InputKind.FLOAT, featureCount, rows, List.of());
  }

  /** Int32 rows of {@code featureCount} values each. */
  public static ProofInputs ofInts(int featureCount, List<int[]> rows) {
    return new ProofInputs(InputKind.INT, featureCount, List.of(), rows);
  }

  /** How many rows. */
  public int size() {
    return kind == InputKind.FLOAT ? floats.size() : ints.size();
  }

  /** The input file of the harness ({@link HarnessData}'s layout). */
  public byte[] packed() {
    return kind == InputKind.FLOAT ? HarnessData.packFloats(floats, featureCount)
        : HarnessData.packInts(ints, featureCount);
  }

  /** Row {@code r} as the model sees it. */
  public float[] modelRow(int r) {
    if (kind == InputKind.FLOAT) {
      return floats.get(r).clone();
    }
    int[] x = ints.get(r);
    float[] v = new float[x.length];
    for (int f = 0; f < x.length; f++) {
      v[f] = x[f];
    }
    return v;
  }

  private static List<float[]> copyFloats(List<float[]> rows, int featureCount) {
    List<float[]> copy = new ArrayList<>(rows.size());
    for (float[] row : rows) {
      check(row.length, featureCount);
      copy.add(row.clone());
    }
    return List.copyOf(copy);
  }

  private static List<int[]> copyInts(List<int[]> rows, int featureCount) {
    List<int[]> copy = new ArrayList<>(rows.size());
    for (int[] row : rows) {
      check(row.length, featureCount);
      copy.add(row.clone());
    }
    return List.copyOf(copy);
  }

  private static void check(int length, int featureCount) {
    if (length != featureCount) {
      throw new IllegalArgumentException("a row has " + length + " values, expected "
          + featureCount);
    }
  }
}
