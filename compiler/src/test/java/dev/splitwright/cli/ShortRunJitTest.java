package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/**
 * HotSpot takes the short run's compiler directive through its DiagnosticCommand MBean (the
 * JSON form of JEP 165, compiler control), and refuses a malformed one without harm.
 */
class ShortRunJitTest {
  @Test
  void hotSpotTakesADirectiveAndRefusesAMalformedOne() throws Exception {
    // A directive that matches no class, so this JVM's own compilation is untouched.
    assertThat(ShortRunJit.add("[{match: \"dev/splitwright/NoSuchClass.*\", c2: {Exclude: true}}]"))
        .isTrue();
    ShortRunJit.removeLast();
    assertThat(ShortRunJit.add("[{match: ")).isFalse();
    // The product's own directive parses as well (checked on a copy with a class-free match).
    assertThat(ShortRunJit.NO_C2).contains("c2: {Exclude: true}");
    assertThat(ShortRunJit.add(ShortRunJit.NO_C2.replace("*.*", "dev/splitwright/NoSuch.*")))
        .isTrue();
    ShortRunJit.removeLast();
  }

  @Test
  void theDemoDataCountsAsAShortRun() throws Exception {
    for (String csv : new String[] {"pump-vibration.csv", "gesture-band.csv"}) {
      assertThat(Files.size(Path.of("demo-data", csv))).isLessThanOrEqualTo(
          ShortRunJit.SMALL_CSV_BYTES);
    }
  }
}
