package dev.splitwright.samples;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

class UnifiedDiffTest {

  @Test
  void showsRemovedAndAddedLinesWithContext() {
    String diff = UnifiedDiff.of("a", "1\n2\n3\n4\n5\n", "b", "1\n2\nthree\n4\n5\n");

    assertThat(diff).isEqualTo("--- a\n+++ b\n@@ 1 @@\n 1\n 2\n-3\n+three\n 4\n 5\n");
  }

  @Test
  void equalTextsHaveOnlyTheHeader() {
    assertThat(UnifiedDiff.of("a", "x\ny\n", "b", "x\ny\n")).isEqualTo("--- a\n+++ b\n");
  }
}
