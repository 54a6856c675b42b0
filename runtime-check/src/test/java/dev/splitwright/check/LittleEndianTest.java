package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;

import org.junit.jupiter.api.Test;

class LittleEndianTest {

  @Test
  void packsLeastSignificantByteFirst() {
    // Worked by hand: 0x01020304 little-endian is 04 03 02 01; -2 is FE FF FF FF.
    assertThat(LittleEndian.packInts(0x01020304, -2))
        .containsExactly(0x04, 0x03, 0x02, 0x01, 0xFE, 0xFF, 0xFF, 0xFF);
  }

  @Test
  void packsFloatsAsTheirBinary32BitPatterns() {
    // IEEE 754 binary32: 1.0 is 0x3F800000, -0.0 is 0x80000000.
    assertThat(LittleEndian.packFloats(1f, -0f))
        .containsExactly(0x00, 0x00, 0x80, 0x3F, 0x00, 0x00, 0x00, 0x80);
  }

  @Test
  void keepsNaNPayloadsThroughPacking() {
    // A quiet NaN with payload 0x123 (IEEE 754: exponent all ones, quiet bit set).
    float payloadNaN = Float.intBitsToFloat(0x7FC00123);

    assertThat(LittleEndian.unpackInts(LittleEndian.packFloats(payloadNaN)))
        .containsExactly(0x7FC00123);
  }

  @Test
  void unpacksWhatItPacked() {
    int[] values = {0, 1, -1, Integer.MIN_VALUE, Integer.MAX_VALUE, 0x7F800000};

    assertThat(LittleEndian.unpackInts(LittleEndian.packInts(values))).containsExactly(values);
    assertThat(LittleEndian.unpackFloats(LittleEndian.packInts(0x3F800000, 0x7F800000)))
        .containsExactly(1f, Float.POSITIVE_INFINITY);
  }

  @Test
  void rejectsByteCountsThatAreNotAMultipleOfFour() {
    assertThatIllegalArgumentException()
        .isThrownBy(() -> LittleEndian.unpackInts(new byte[6]))
        .withMessage("byte count must be a multiple of 4, but it is 6");
  }
}
