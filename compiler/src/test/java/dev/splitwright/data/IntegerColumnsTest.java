package dev.splitwright.data;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatCode;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class IntegerColumnsTest {
  @TempDir Path dir;

  private Path write(String content) throws IOException {
    return Files.write(dir.resolve("adc.csv"), content.getBytes(StandardCharsets.UTF_8));
  }

  private void assertRejected(String csv, LoadOptions options, String expectedAfterFileName)
      throws Exception {
    Path file = write(csv);
    LoadedData loaded = CsvLoader.load(file, options);
    assertThatThrownBy(() -> IntegerColumns.require(loaded, file, options))
        .isInstanceOf(InputException.class)
        .hasMessage(file + expectedAfterFileName);
  }

  @Test
  void acceptsWholeNumbersAndCategoriesWithMissingValues() throws Exception {
    Path file = write("adc,mode,state\n512,eco,ok\n-3,,fault\n1e3,boost,ok\n7.0,eco,ok\n");
    LoadedData loaded = CsvLoader.load(file);
    assertThat(loaded.dataset().schema().feature(1).isCategorical()).isTrue();
    assertThatCode(() -> IntegerColumns.require(loaded, file, LoadOptions.defaults()))
        .doesNotThrowAnyException();
  }

  @Test
  void rejectsFractionNamingLineColumnAndHeader() throws Exception {
    assertRejected("adc,temp,state\n512,20,ok\n513,20.5,fault\n",
        LoadOptions.defaults(),
        ":3:2: '20.5' is not a whole number, as --int-inputs needs in numeric columns (column"
            + " 'temp'); drop --int-inputs, or round or scale the column, or declare it with"
            + " --categorical");
  }

  @Test
  void reportsTheFirstOffendingCellInFileOrder() throws Exception {
    // Column 'b' goes wrong on an earlier line than column 'a' does.
    assertRejected("a,b,state\n1,2,ok\n1,2.5,ok\n1.5,2,fault\n",
        LoadOptions.defaults(),
        ":3:2: '2.5' is not a whole number, as --int-inputs needs in numeric columns (column"
            + " 'b'); drop --int-inputs, or round or scale the column, or declare it with"
            + " --categorical");
  }

  @Test
  void countsLinesOfQuotedCellsThatSpanLines() throws Exception {
    // The label of the first data row spans two lines, so the bad cell is on line 4, not 3.
    assertRejected("adc,state\n1,\"ok\nstill ok\"\n2.25,fault\n",
        LoadOptions.defaults(),
        ":4:1: '2.25' is not a whole number, as --int-inputs needs in numeric columns (column"
            + " 'adc'); drop --int-inputs, or round or scale the column, or declare it with"
            + " --categorical");
  }

  @Test
  void rejectsMissingNumericValueGivenAsToken() throws Exception {
    assertRejected("adc,state\n1,ok\nNA,fault\n",
        LoadOptions.builder().missingTokens(List.of("NA")).build(),
        ":3:1: missing value, which an int input cannot express (column 'adc'); drop"
            + " --int-inputs, or fill or remove the rows whose value is missing");
  }

  @Test
  void rejectsValueBeyondTheIntRange() throws Exception {
    assertRejected("adc,state\n1,ok\n3000000000,fault\n",
        LoadOptions.defaults(),
        ":3:1: '3000000000' is outside the int range (column 'adc'); drop --int-inputs, or"
            + " scale the column into -2147483648..2147483647");
  }

  @Test
  void fitsExactlyTheFloatsAnIntConvertsTo() {
    // JLS 5.1.2: (float) Integer.MAX_VALUE rounds up to 2^31, so 2^31 itself must fit.
    assertThat(IntegerColumns.fits((float) Integer.MAX_VALUE)).isTrue();
    assertThat(IntegerColumns.fits((float) Integer.MIN_VALUE)).isTrue();
    assertThat(IntegerColumns.fits(Math.nextUp(0x1p31f))).isFalse();
    assertThat(IntegerColumns.fits(Math.nextDown(-0x1p31f))).isFalse();
    assertThat(IntegerColumns.fits(-0.0f)).isTrue();
    assertThat(IntegerColumns.fits(0.5f)).isFalse();
    assertThat(IntegerColumns.fits(Float.NaN)).isFalse();
    assertThat(IntegerColumns.fits(Float.POSITIVE_INFINITY)).isFalse();
  }
}
