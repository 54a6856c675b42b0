package dev.splitwright.data;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

class InputExceptionTest {

  @Test
  void rendersFileLineColumnAndHeader() {
    InputException e =
        new InputException(
            SourcePosition.ofCell("pump.csv", 12345, 3, "peak_accel_g"),
            "'x' is not a number",
            "fix the cell");

    assertThat(e)
        .hasMessage("pump.csv:12345:3: 'x' is not a number (column 'peak_accel_g'); fix the cell");
    assertThat(e.position()).contains(SourcePosition.ofCell("pump.csv", 12345, 3, "peak_accel_g"));
    assertThat(e.option()).isEmpty();
  }

  @Test
  void rendersLineWithoutColumn() {
    InputException e =
        new InputException(SourcePosition.ofLine("a.csv", 7), "row has 2 cells", "add cells");

    assertThat(e).hasMessage("a.csv:7: row has 2 cells; add cells");
    assertThat(e.position().orElseThrow().optionalColumn()).isEmpty();
    assertThat(e.position().orElseThrow().optionalHeader()).isEmpty();
  }

  @Test
  void rendersOptionError() {
    InputException e = new InputException("target", "no column 'x'", "use one of a, b");

    assertThat(e).hasMessage("option --target: no column 'x'; use one of a, b");
    assertThat(e.option()).contains("target");
    assertThat(e.position()).isEmpty();
  }

  @Test
  void keepsMessageOnOneLineWhenACellSpansLines() {
    InputException e =
        new InputException(
            SourcePosition.ofCell("a.csv", 2, 1, "h"),
            InputException.quote("two\nlines") + " is not a number",
            "fix it");

    assertThat(e).hasMessage("a.csv:2:1: 'two\\nlines' is not a number (column 'h'); fix it");
  }

  @Test
  void shortensLongQuotedValues() {
    assertThat(InputException.quote("x".repeat(100))).isEqualTo("'" + "x".repeat(37) + "...'");
  }

  @Test
  void writesLargeNumbersWithoutGrouping() {
    assertThat(SourcePosition.ofCell("f", 1_234_567_890_123L, 12_345, "h").render())
        .isEqualTo("f:1234567890123:12345");
  }

  @Test
  void rejectsColumnWithoutLine() {
    assertThatThrownBy(() -> new SourcePosition("f", 0, 3, "h"))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("a column needs a line");
  }

  @Test
  void rejectsDashedOptionName() {
    assertThatThrownBy(() -> new InputException("--target", "p", "r"))
        .isInstanceOf(IllegalArgumentException.class);
  }
}
