package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.Dataset;
import org.junit.jupiter.api.Test;

class JitPrimerTest {
  @Test
  void theSampleIsSpreadEvenlyOverTheRowsInOrder() {
    Dataset data = SyntheticData.generate(12_345, 3, 1, 4, 3, 0.05, 5);
    Dataset sample = JitPrimer.sample(data);
    assertThat(sample.rows()).isEqualTo(JitPrimer.SAMPLE_ROWS);
    assertThat(sample.schema()).isEqualTo(data.schema());
    // Row i of the sample is row floor(i * 12345 / 5000) of the data.
    for (int i : new int[] {0, 1, 2, 2500, 4999}) {
      int row = (int) ((long) i * data.rows() / JitPrimer.SAMPLE_ROWS);
      assertThat(sample.row(i)).isEqualTo(data.row(row));
      assertThat(sample.label(i)).isEqualTo(data.label(row));
    }
  }

  @Test
  void aSmallTableIsItsOwnSample() {
    Dataset data = SyntheticData.generate(700, 3, 1, 4, 3, 0.05, 6);
    Dataset sample = JitPrimer.sample(data);
    assertThat(sample.rows()).isEqualTo(700);
    for (int r = 0; r < 700; r += 99) {
      assertThat(sample.row(r)).isEqualTo(data.row(r));
    }
  }
}
