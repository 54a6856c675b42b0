package dev.splitwright.cgen;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/** Packs input files for {@link CHarness} and reads its output files. */
public final class HarnessData {
  private HarnessData() {}

  /** What a harness run wrote: one class per row, frequencies, and the label and name bytes. */
  public record Output(int[] classes, float[][] probabilities, List<byte[]> labels,
      List<byte[]> featureNames) {
    public Output {
      Objects.requireNonNull(classes, "classes");
      Objects.requireNonNull(probabilities, "probabilities");
      labels = List.copyOf(labels);
      featureNames = List.copyOf(featureNames);
    }
  }

  /** An input file of float rows, each value as its raw float32 bits (NaN payloads kept). */
  public static byte[] packFloats(List<float[]> rows, int featureCount) {
    ByteBuffer buffer = start(rows.size(), featureCount);
    for (float[] row : rows) {
      check(row.length, featureCount);
      for (float v : row) {
        buffer.putInt(Float.floatToRawIntBits(v));
      }
    }
    return buffer.array();
  }

  /** An input file of int32 rows. */
  public static byte[] packInts(List<int[]> rows, int featureCount) {
    ByteBuffer buffer = start(rows.size(), featureCount);
    for (int[] row : rows) {
      check(row.length, featureCount);
      for (int v : row) {
        buffer.putInt(v);
      }
    }
    return buffer.array();
  }

  private static ByteBuffer start(int rows, int featureCount) {
    ByteBuffer buffer = ByteBuffer.allocate(Math.multiplyExact(Math.addExact(
        Math.multiplyExact(rows, featureCount), 2), 4)).order(ByteOrder.LITTLE_ENDIAN);
    return buffer.putInt(rows).putInt(featureCount);
  }

  private static void check(int length, int featureCount) {
    if (length != featureCount) {
      throw new IllegalArgumentException("row has " + length + " values, expected "
          + featureCount);
    }
  }

  /**
   * Reads an output file of {@code rows} rows written by the harness of a classifier with {@code
   * classCount} classes and {@code featureCount} features emitted with {@code options}. The label
   * and name lists end with the two out-of-range calls (-1 and the count).
   *
   * @throws IllegalArgumentException if the file is shorter or longer than that
   */
  public static Output readOutput(byte[] data, int rows, int classCount, int featureCount,
      CEmitOptions options) {
    ByteBuffer in = ByteBuffer.wrap(data).order(ByteOrder.LITTLE_ENDIAN);
    try {
      int[] classes = new int[rows];
      float[][] probabilities = new float[options.probabilities() ? rows : 0][];
      for (int r = 0; r < rows; r++) {
        classes[r] = in.getInt();
        if (options.probabilities()) {
          probabilities[r] = new float[classCount];
          for (int c = 0; c < classCount; c++) {
            probabilities[r][c] = Float.intBitsToFloat(in.getInt());
          }
        }
      }
      List<byte[]> labels = new ArrayList<>();
      List<byte[]> names = new ArrayList<>();
      if (!options.bare()) {
        texts(in, classCount + 2, labels);
        texts(in, featureCount + 2, names);
      }
      if (in.hasRemaining()) {
        throw new IllegalArgumentException(in.remaining() + " bytes past the expected end");
      }
      return new Output(classes, probabilities, labels, names);
    } catch (java.nio.BufferUnderflowException e) {
      throw new IllegalArgumentException("harness output ends early (" + data.length + " bytes)",
          e);
    }
  }

  private static void texts(ByteBuffer in, int count, List<byte[]> out) {
    for (int i = 0; i < count; i++) {
      byte[] bytes = new byte[in.getInt()];
      in.get(bytes);
      out.add(bytes);
    }
  }
}
