package dev.splitwright.bench;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.Dataset;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.List;
import org.junit.jupiter.api.Test;
import weka.core.Instance;
import weka.core.Instances;

class WekaDataTest {
  private static final Schema SCHEMA = new Schema(
      List.of(Feature.numeric("rms"), Feature.categorical("mode", List.of("auto", "manual"))),
      "state", List.of("bad", "good"));

  @Test
  void keepsColumnsInOrderWithTheClassLast() {
    Dataset d = Dataset.ofRows(SCHEMA, new float[][] {{1.5f, 1f}, {Float.NaN, 0f}},
        new int[] {1, 0});
    Instances w = WekaData.of(d, "t");

    assertThat(w.numAttributes()).isEqualTo(3);
    assertThat(w.classIndex()).isEqualTo(2);
    assertThat(w.attribute(0).isNumeric()).isTrue();
    assertThat(w.attribute(1).isNominal()).isTrue();
    assertThat(w.instance(0).value(0)).isEqualTo(1.5);
    assertThat(w.instance(0).stringValue(1)).isEqualTo("manual");
    assertThat(w.instance(0).stringValue(2)).isEqualTo("good");
    assertThat(w.instance(1).stringValue(2)).isEqualTo("bad");
  }

  @Test
  void nanBecomesWekasMissingValue() {
    Instances header = WekaData.header(SCHEMA, "t", 0);
    Instance row = WekaData.instance(header, new float[] {Float.NaN, 0f});
    assertThat(row.isMissing(0)).isTrue();
    assertThat(row.isMissing(1)).isFalse();
    assertThat(row.classIsMissing()).isTrue();
    assertThat(row.dataset()).isSameAs(header);
  }
}
