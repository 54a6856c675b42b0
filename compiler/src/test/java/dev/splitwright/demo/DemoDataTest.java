package dev.splitwright.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class DemoDataTest {

  /** Rewrite the committed samples with {@code -Dgolden.update=true}; review the diff. */
  private static final boolean UPDATE = Boolean.getBoolean("golden.update");

  @TempDir Path dir;

  @ParameterizedTest
  @CsvSource({"pump-vibration, 3000, 7", "gesture-band, 2500, 11"})
  void committedSampleMatchesTheGenerator(String scenario, int rows, long seed) throws IOException {
    Path committed = DemoFiles.of(scenario);
    Path fresh = dir.resolve(scenario + ".csv");
    DemoData.write(scenario, fresh, rows, seed);
    if (UPDATE) {
      Files.createDirectories(committed.getParent());
      Files.copy(fresh, committed, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
    }

    assertThat(Files.readString(committed, StandardCharsets.UTF_8))
        .isEqualTo(Files.readString(fresh, StandardCharsets.UTF_8));
    assertThat(DemoData.defaultRows(scenario)).isEqualTo(rows);
  }

  @Test
  void listsScenariosSorted() {
    assertThat(DemoData.scenarios()).containsExactly("gesture-band", "pump-vibration").isSorted();
  }

  @Test
  void rejectsUnknownScenarioListingTheKnownOnes() {
    assertThatThrownBy(() -> DemoData.write("flowers", dir.resolve("x.csv"), 10, 1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("unknown scenario 'flowers'; use one of gesture-band, pump-vibration");
  }
}
