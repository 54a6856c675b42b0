package dev.splitwright.onchip;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.ElfSymbol;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Helper sizes counted once per byte, whatever names a body has. */
class CoveredBytesTest {
  private static ElfSymbol function(String name, long value, long size) {
    return new ElfSymbol(name, value, size, ElfSymbol.STT_FUNC, 1, 1);
  }

  @Test
  void aliasesAndOverlapsCountOnceAndTheThumbBitIsIgnored() {
    // Worked by hand: [0x100, 0x140) once although named twice, [0x120, 0x150) adds 0x10,
    // [0x200, 0x208) adds 8: 0x40 + 0x10 + 8 = 88.
    List<ElfSymbol> helpers = List.of(
        function("__aeabi_fcmple", 0x101, 0x40),
        function("__lesf2", 0x101, 0x40),
        function("__inner", 0x121, 0x30),
        function("__aeabi_f2iz", 0x201, 8));
    assertThat(CoreFlash.coveredBytes(helpers)).isEqualTo(88);
    assertThat(CoreFlash.coveredBytes(List.of())).isZero();
  }
}
