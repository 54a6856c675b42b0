package dev.splitwright.demo;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;

class DemoCsvTest {

  @Test
  void quotesOnlyWhereCsvNeedsIt() {
    // RFC 4180 §2: a field holding a comma or a double quote is enclosed in double quotes, and a
    // double quote inside is doubled; plain decimals and empty cells stay as they are.
    List<DemoRow> rows = List.of(
        new DemoRow(List.of("-0.125", ""), "a", "a"),
        new DemoRow(List.of("1,5", "say \"hi\""), "b", "b"));

    String csv = DemoCsv.csv(List.of("x", "y"), "label", rows);

    assertThat(csv).isEqualTo("x,y,label\n-0.125,,a\n\"1,5\",\"say \"\"hi\"\"\",b\n");
  }
}
