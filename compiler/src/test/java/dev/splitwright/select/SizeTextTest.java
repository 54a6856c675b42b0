package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.data.InputException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class SizeTextTest {

  @ParameterizedTest(name = "''{0}'' is {1} bytes")
  @CsvSource(delimiter = '|', value = {
      // Plain bytes and every unit; KB = 1000 and KiB = 1024 (IEC 80000-13 prefixes).
      "1500|1500",
      "1500B|1500",
      "1KB|1000",
      "1KiB|1024",
      "1MB|1000000",
      "1MiB|1048576",
      "4KiB|4096",
      "16KiB|16384",
      // Decimals, worked by hand: 2.5 * 1000 = 2500; 2.5 * 1024 = 2560; 0.5 * 1048576 = 524288.
      "2.5KB|2500",
      "2.5KiB|2560",
      "0.5MiB|524288",
      // A fraction of a byte is dropped, never rounded up past what was written:
      // 1.1 * 1024 = 1126.4 -> 1126 (worked by hand).
      "1.1KiB|1126",
      "1.9|1",
      // Units in any case, blanks around and between number and unit.
      "4kib|4096",
      "4KIB|4096",
      "4kb|4000",
      "'  4 KiB  '|4096",
      "'4\tKiB'|4096",
      "2047999999B|2047999999",
      "2147483647|2147483647"})
  void parsesSizes(String text, int bytes) throws InputException {
    assertThat(SizeText.parse("budget", text)).isEqualTo(bytes);
  }

  @Test
  void rejectsNegativeSize() {
    assertThatThrownBy(() -> SizeText.parse("budget", "-1"))
        .isInstanceOf(InputException.class)
        .hasMessage("option --budget: '-1' is not a size; write a positive number of bytes with "
            + "an optional unit B, KB, KiB, MB or MiB, e.g. 4KiB");
  }

  @ParameterizedTest
  @ValueSource(strings = {"abc", "", "  ", "KiB", "4.KiB", ".5KiB", "1e3", "+4", "4 4KiB", "4,5KB",
      "0x10", "4 Ki B"})
  void rejectsTextThatIsNoSize(String text) {
    assertThatThrownBy(() -> SizeText.parse("budget", text))
        .isInstanceOf(InputException.class)
        .hasMessageStartingWith("option --budget: '" + text.replace("\t", "\\t") + "' is not a "
            + "size; ");
  }

  @Test
  void rejectsUnknownUnitNamingTheUnits() {
    assertThatThrownBy(() -> SizeText.parse("budget", "4 XB"))
        .isInstanceOf(InputException.class)
        .hasMessage("option --budget: unknown unit 'XB' in '4 XB'; use B, KB, KiB, MB or MiB");
    assertThatThrownBy(() -> SizeText.parse("budget", "4kbit"))
        .hasMessage("option --budget: unknown unit 'kbit' in '4kbit'; use B, KB, KiB, MB or MiB");
  }

  @ParameterizedTest
  @ValueSource(strings = {"2147483648", "2048MiB", "3000MB", "99999999999999999999999999",
      "2097152KiB"})
  void rejectsSizesBeyondTheIntRange(String text) {
    // 2^31 - 1 = 2147483647 bytes is the most; 2048 MiB = 2^31 and 2097152 KiB = 2^31 are one over.
    assertThatThrownBy(() -> SizeText.parse("budget", text))
        .isInstanceOf(InputException.class)
        .hasMessage("option --budget: '" + text + "' is too large; the most is 2147483647 bytes");
  }

  @ParameterizedTest
  @ValueSource(strings = {"0", "0KiB", "0.0005KB", "0.9"})
  void rejectsSizesBelowOneByte(String text) {
    assertThatThrownBy(() -> SizeText.parse("budget", text))
        .isInstanceOf(InputException.class)
        .hasMessage("option --budget: '" + text + "' is less than one byte; give a positive size");
  }

  @Test
  void describesSizesWithBinaryUnits() {
    assertThat(SizeText.describe(900)).isEqualTo("900 B");
    assertThat(SizeText.describe(2048)).isEqualTo("2048 B (2.00 KiB)");
    assertThat(SizeText.describe(3 * 1024 * 1024)).isEqualTo("3145728 B (3.00 MiB)");
  }
}
