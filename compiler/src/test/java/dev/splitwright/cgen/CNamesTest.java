package dev.splitwright.cgen;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

class CNamesTest {
  @Test
  void baseNameIsTheSnakeCaseOfTheClass() {
    // The example.
    assertThat(CNames.baseName("PumpStateClassifier")).isEqualTo("pump_state_classifier");
    assertThat(CNames.baseName("HTTPServer2")).isEqualTo("http_server2");
    assertThat(CNames.baseName("Pump2Model")).isEqualTo("pump2_model");
    assertThat(CNames.baseName("pump$Model__x")).isEqualTo("pump_model_x");
    assertThat(CNames.baseName("ABC")).isEqualTo("abc");
    assertThatThrownBy(() -> CNames.baseName("$")).isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> CNames.baseName("_1a")).isInstanceOf(IllegalArgumentException.class);
  }

  @Test
  void macrosAreUniqueUpperCaseAndAvoidStdintNames() {
    CNames names = new CNames();
    names.reserve("P_CLASS_COUNT");
    assertThat(names.macro("P_CLASS_", "count", "0")).isEqualTo("P_CLASS_COUNT_2");
    assertThat(names.macro("P_CLASS_", "a-b", "1")).isEqualTo("P_CLASS_A_B");
    assertThat(names.macro("P_CLASS_", "A b", "2")).isEqualTo("P_CLASS_A_B_2");
    assertThat(names.macro("P_CLASS_", "\u6e29", "3")).isEqualTo("P_CLASS_3");
    // C99 7.26.8 reserves INT and UINT names ending in _MAX, _MIN or _C.
    assertThat(names.macro("INT_P_", "max", "4")).isEqualTo("INT_P_MAX_2");
    assertThat(names.macro("UINT_P_", "c", "5")).isEqualTo("UINT_P_C_2");
  }
}
