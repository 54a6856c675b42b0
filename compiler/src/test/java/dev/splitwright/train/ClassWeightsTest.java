package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ClassWeightsTest {
  private static final Schema SCHEMA =
      new Schema(List.of(Feature.numeric("x")), "state", List.of("fault", "normal", "worn"));

  @Test
  void parsesKeywordsInAnyCase() {
    assertThat(ClassWeights.parse("inverse-frequency"))
        .isEqualTo(ClassWeights.inverseFrequency());
    assertThat(ClassWeights.parse(" Inverse-Frequency "))
        .isEqualTo(ClassWeights.inverseFrequency());
    assertThat(ClassWeights.parse("NONE")).isEqualTo(ClassWeights.none());
  }

  @Test
  void parsesLabelWeightPairsTrimmingSpaces() {
    ClassWeights w = ClassWeights.parse("fault=5, normal = 1,worn=0.25");
    assertThat(w).isEqualTo(ClassWeights.of(Map.of("fault", 5.0, "normal", 1.0, "worn", 0.25)));
    assertThat(w.resolve(SCHEMA, new int[] {1, 1, 1})).containsExactly(5.0, 1.0, 0.25);
  }

  @Test
  void optionTextParsesBackToTheSameWeights() {
    for (String text : List.of("none", "inverse-frequency", "worn=2,fault=5.5")) {
      ClassWeights w = ClassWeights.parse(text);
      assertThat(ClassWeights.parse(w.optionText())).isEqualTo(w);
    }
    assertThat(ClassWeights.parse("worn=2,fault=5.5").optionText()).isEqualTo("fault=5.5,worn=2.0");
  }

  @Test
  void refusesAnotherToolsWordForInverseFrequencyNamingOurs() {
    // The word another library uses for these weights is not ours; it must not pass silently.
    assertThatThrownBy(() -> ClassWeights.parse(" Balanced "))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage("'Balanced' is not a value of ours; for weights inverse to class frequency "
            + "write inverse-frequency");
  }

  @Test
  void inverseFrequencyGivesEveryPresentClassTheSameTotalWeight() {
    // Worked by hand: 6 + 2 rows, 2 classes present, mean 4 rows per class; fault weighs 4/6,
    // normal 4/2, absent worn 1.
    assertThat(ClassWeights.inverseFrequency().resolve(SCHEMA, new int[] {6, 2, 0}))
        .containsExactly(4.0 / 6, 2.0, 1.0);
    assertThat(ClassWeights.inverseFrequency().optionText()).isEqualTo("inverse-frequency");
  }

  @ParameterizedTest
  @CsvSource(
      delimiter = '|',
      value = {
        "fault                | expected inverse-frequency, none or label=weight pairs such as "
            + "fault=5,normal=1, but found 'fault'",
        "fault=5,             | expected inverse-frequency, none or label=weight pairs such as "
            + "fault=5,normal=1, but found ''",
        "fault=1=2            | expected inverse-frequency, none or label=weight pairs such as "
            + "fault=5,normal=1, but found 'fault=1=2'",
        "=5                   | class label missing before '=5'",
        "fault=-1             | weight of class 'fault' must be a positive decimal number, "
            + "but it is '-1'",
        "fault=NaN            | weight of class 'fault' must be a positive decimal number, "
            + "but it is 'NaN'",
        "fault=5f             | weight of class 'fault' must be a positive decimal number, "
            + "but it is '5f'",
        "fault=0              | weight of class 'fault' must be positive and finite, "
            + "but it is 0.0",
        "fault=1e999          | weight of class 'fault' must be positive and finite, "
            + "but it is Infinity",
        "fault=1,fault=2      | class 'fault' is given a weight twice",
      })
  void rejectsMalformedTextNamingThePart(String text, String message) {
    assertThatThrownBy(() -> ClassWeights.parse(text))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessage(message);
  }

  @Test
  void listsLabelsTheClassesLackInLabelOrder() {
    ClassWeights w = ClassWeights.parse("zap=1,fault=2,broken=3");
    assertThat(w.unknownLabels(SCHEMA.classes())).containsExactly("broken", "zap");
    assertThat(ClassWeights.inverseFrequency().unknownLabels(SCHEMA.classes())).isEmpty();
    assertThat(ClassWeights.none().unknownLabels(List.of())).isEmpty();
  }
}
