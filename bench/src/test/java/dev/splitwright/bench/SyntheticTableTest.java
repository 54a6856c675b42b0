package dev.splitwright.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.data.Dataset;
import org.junit.jupiter.api.Test;

class SyntheticTableTest {

  @Test
  void sameSeedGivesTheSameTable() {
    Dataset a = SyntheticTable.generate(2_000, 16, 5);
    Dataset b = SyntheticTable.generate(2_000, 16, 5);
    for (int f = 0; f < 16; f++) {
      assertThat(a.column(f)).containsExactly(b.column(f));
    }
    assertThat(a.labels()).containsExactly(b.labels());
  }

  @Test
  void differentSeedsGiveDifferentTables() {
    assertThat(SyntheticTable.generate(500, 16, 5).column(0))
        .isNotEqualTo(SyntheticTable.generate(500, 16, 6).column(0));
  }

  @Test
  void everyClassIsCommonEnoughToMatter() {
    int[] counts = SyntheticTable.generate(20_000, 16, 1).classCounts();
    assertThat(counts).hasSize(SyntheticTable.CLASSES);
    for (int count : counts) {
      // Four classes: a quarter each would be 5,000; a lopsided table would grow a shallow tree.
      assertThat(count).isBetween(3_000, 7_000);
    }
  }

  @Test
  void uniformFeaturesStayInTheirRange() {
    Dataset d = SyntheticTable.generate(5_000, 20, 2);
    for (int f = 2; f < 20; f += 4) {
      for (float v : d.column(f)) {
        assertThat(v).isBetween(0f, 100f);
      }
    }
  }

  @Test
  void namesFeaturesInColumnOrder() {
    assertThat(SyntheticTable.schema(10).featureNames())
        .containsExactly("s00", "s01", "s02", "s03", "s04", "s05", "s06", "s07", "s08", "s09");
  }

  @Test
  void rejectsTooFewFeatures() {
    assertThatThrownBy(() -> SyntheticTable.generate(10, 7, 1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("features must be at least 8, but it is 7");
  }
}
