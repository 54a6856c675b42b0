package dev.splitwright.check;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.Objects;

/**
 * Packs and unpacks arrays of 32-bit values as little-endian bytes, the layout a C harness on x86
 * or ARM Cortex-M reads and writes with {@code fread}/{@code fwrite} of {@code int32_t} or {@code
 * float}. Floats travel as their raw IEEE 754 binary32 bit patterns, never as text, so no value is
 * rounded on the way.
 */
public final class LittleEndian {

  private LittleEndian() {}

  /** Four bytes per value, least significant byte first. */
  public static byte[] packInts(int... values) {
    Objects.requireNonNull(values, "values");
    ByteBuffer out = buffer(values.length);
    out.asIntBuffer().put(values);
    return out.array();
  }

  /**
   * Four bytes per value: the raw bit pattern ({@link Float#floatToRawIntBits}), so every NaN
   * keeps its payload.
   */
  public static byte[] packFloats(float... values) {
    Objects.requireNonNull(values, "values");
    int[] bits = new int[values.length];
    for (int i = 0; i < values.length; i++) {
      bits[i] = Float.floatToRawIntBits(values[i]);
    }
    return packInts(bits);
  }

  /**
   * The 32-bit values in {@code bytes}.
   *
   * @throws IllegalArgumentException if the length is not a multiple of 4
   */
  public static int[] unpackInts(byte[] bytes) {
    Objects.requireNonNull(bytes, "bytes");
    if (bytes.length % 4 != 0) {
      throw new IllegalArgumentException(
          "byte count must be a multiple of 4, but it is " + bytes.length);
    }
    int[] values = new int[bytes.length / 4];
    ByteBuffer.wrap(bytes).order(ByteOrder.LITTLE_ENDIAN).asIntBuffer().get(values);
    return values;
  }

  /**
   * The binary32 values in {@code bytes}. Java may quiet a signalling NaN when it turns bits into a
   * float ({@link Float#intBitsToFloat}), so compare {@link #unpackInts} when every bit matters.
   *
   * @throws IllegalArgumentException if the length is not a multiple of 4
   */
  public static float[] unpackFloats(byte[] bytes) {
    int[] bits = unpackInts(bytes);
    float[] values = new float[bits.length];
    for (int i = 0; i < bits.length; i++) {
      values[i] = Float.intBitsToFloat(bits[i]);
    }
    return values;
  }

  private static ByteBuffer buffer(int count) {
    if (count > Integer.MAX_VALUE / 4) {
      throw new IllegalArgumentException("too many values to pack: " + count);
    }
    return ByteBuffer.allocate(count * 4).order(ByteOrder.LITTLE_ENDIAN);
  }
}
