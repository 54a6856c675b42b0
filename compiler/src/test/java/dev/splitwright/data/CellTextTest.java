package dev.splitwright.data;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.CellText.Kind;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class CellTextTest {

  @ParameterizedTest
  @ValueSource(strings = {"0", "-0", "+1", "12.5", ".5", "5.", "-3.1e-4", "1E10", "007", "1e+3"})
  void acceptsPlainDecimals(String cell) {
    assertThat(CellText.classify(cell)).isEqualTo(Kind.NUMBER);
  }

  // Each of these is accepted by Double.parseDouble (java.lang.Double#valueOf(String) grammar).
  @ParameterizedTest
  @ValueSource(strings = {"0x1p3", "-0X1.8P1", "1.5f", "2d", "3.0D", "1e5F"})
  void flagsJavaOnlyNumberSyntax(String cell) {
    assertThat(CellText.classify(cell)).isEqualTo(Kind.NOT_PLAIN);
  }

  @ParameterizedTest
  @ValueSource(strings = {"NaN", "nan", "Infinity", "-Infinity", "+inf", "-INF"})
  void flagsNonFiniteMarkers(String cell) {
    assertThat(CellText.classify(cell)).isEqualTo(Kind.NOT_FINITE);
  }

  @ParameterizedTest
  @ValueSource(strings = {"abc", "1,5", "1.2.3", "e5", ".", "-", "1e", "12 kg", "0x", "١٢", "f"})
  void callsEverythingElseText(String cell) {
    assertThat(CellText.classify(cell)).isEqualTo(Kind.TEXT);
  }

  // Largest float32 is (2 - 2^-23) * 2^127 = 3.40282346638528859811704183484516925440e38; values
  // from
  // the midpoint to 2^128, 3.4028235677973366e38, round to infinity (IEEE 754 round to nearest).
  @ParameterizedTest
  @CsvSource({
    "3.4028235e38, NUMBER",
    "3.40282356e38, NUMBER",
    "3.4028236e38, OVERFLOW",
    "-1e39, OVERFLOW",
    "1e-50, NUMBER"
  })
  void flagsFloat32OverflowAtTheRoundingMidpoint(String cell, Kind expected) {
    assertThat(CellText.classify(cell)).isEqualTo(expected);
  }

  @ParameterizedTest
  @CsvSource({
    // Just below the midpoint 1 + 3 * 2^-24 = 1.000000178813934326171875 between the floats
    // 1 + 2^-23 and 1 + 2^-22: correct rounding gives the lower one. Via double, the decimal first
    // rounds to the midpoint itself, then ties-to-even picks the upper one (worked by hand).
    "1.00000017881393432617187499, 1.00000011920928955078125",
    "0.1, 0.100000001490116119384765625",
    "-0, -0.0"
  })
  void parsesToTheNearestFloat32(String cell, double expected) {
    // Bit patterns, so that -0.0 and 0.0 differ.
    assertThat(Float.floatToIntBits(CellText.parse(cell)))
        .isEqualTo(Float.floatToIntBits((float) expected));
  }
}
