package dev.splitwright.data;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class FieldLogTest {
  private static final Schema SCHEMA = new Schema(List.of(Feature.numeric("temp"),
      Feature.categorical("mode", List.of("auto", "manual")),
      Feature.categorical("site", List.of("a", "b"))), "state", List.of("fault", "ok"));

  @TempDir Path dir;

  @Test
  void countsRowsWithUnseenCategoriesAndRowsWithMissingCellsOnceEach() throws Exception {
    Path csv = Files.writeString(dir.resolve("log.csv"), String.join("\n",
        "temp,mode,site,state",
        "1,auto,a,ok",          // clean
        "2,turbo,c,ok",         // two unseen categories: one row
        ",manual,-,fault",      // two missing cells: one row
        "4,turbo,,fault",       // unseen and missing: counts in both
        "5,Auto,b,ok",          // categories are case-sensitive: unseen
        ""));

    FieldLog log = CsvLoader.loadFieldLog(csv, SCHEMA, LoadOptions.builder()
        .missingTokens(List.of("-")).build());

    // Worked by hand from the comments above.
    assertThat(log.unseenCategoryRows()).isEqualTo(3);
    assertThat(log.missingValueRows()).isEqualTo(2);
    assertThat(log.loaded().dataRows()).isEqualTo(5);
    // Unseen and missing load alike, as NaN: the model cannot tell them apart.
    assertThat(log.loaded().dataset().value(1, 1)).isNaN();
    assertThat(log.loaded().dataset().value(2, 2)).isNaN();
    // The same rows load exactly as loadWithSchema loads them.
    Dataset plain = CsvLoader.loadWithSchema(csv, SCHEMA, LoadOptions.builder()
        .missingTokens(List.of("-")).build()).dataset();
    for (int f = 0; f < SCHEMA.featureCount(); f++) {
      assertThat(log.loaded().dataset().column(f)).isEqualTo(plain.column(f));
    }
  }

  @Test
  void anUnknownClassLabelIsStillAnError() throws IOException {
    Path csv = Files.writeString(dir.resolve("log.csv"), "temp,mode,site,state\n1,auto,a,broken\n");

    assertThatThrownBy(() -> CsvLoader.loadFieldLog(csv, SCHEMA, LoadOptions.defaults()))
        .isInstanceOf(InputException.class)
        .hasMessageContaining("log.csv:2:4")
        .hasMessageContaining("unknown class label 'broken'");
  }
}
