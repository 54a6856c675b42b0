package dev.splitwright.cgen;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class CTextTest {
  /**
   * Hexadecimal constants read back exactly: checked with Java's parser of hexadecimal floating
   * literals (JLS 3.10.2, the same grammar as C99 6.4.4.2 with a {@code f} suffix), over the
   * IEEE 754 binary32 specials, subnormals and random bit patterns.
   */
  @Test
  void hexFloatDenotesExactlyTheFloat() {
    float[] specials = {0f, -0f, Float.MIN_VALUE, -Float.MIN_VALUE, Float.MIN_NORMAL,
        Math.nextDown(Float.MIN_NORMAL), Float.MAX_VALUE, -Float.MAX_VALUE, 1f, 0.1f, 3e9f,
        16777218f};
    for (float v : specials) {
      assertThat(Float.floatToRawIntBits(Float.parseFloat(CText.hexFloat(v))))
          .as(CText.hexFloat(v)).isEqualTo(Float.floatToRawIntBits(v));
    }
    SplittableRandom random = new SplittableRandom(3);
    for (int i = 0; i < 100_000; i++) {
      float v = Float.intBitsToFloat(random.nextInt());
      if (Float.isFinite(v)) {
        assertThat(Float.floatToRawIntBits(Float.parseFloat(CText.hexFloat(v))))
            .isEqualTo(Float.floatToRawIntBits(v));
      }
    }
    // Worked by hand: 1 = 0x1p+0, 0.5 = 0x1p-1, 3 = 1.5 * 2 = 0x1.8p+1, 2^-149 the least subnormal.
    assertThat(CText.hexFloat(1f)).isEqualTo("0x1p+0f");
    assertThat(CText.hexFloat(0.5f)).isEqualTo("0x1p-1f");
    assertThat(CText.hexFloat(-3f)).isEqualTo("-0x1.8p+1f");
    assertThat(CText.hexFloat(Float.MIN_VALUE)).isEqualTo("0x1p-149f");
    assertThat(CText.hexFloat(-0f)).isEqualTo("-0x0p+0f");
    assertThat(CText.hexFloat(Float.MAX_VALUE)).isEqualTo("0x1.fffffep+127f");
    assertThatThrownBy(() -> CText.hexFloat(Float.POSITIVE_INFINITY))
        .isInstanceOf(IllegalArgumentException.class);
  }

  /** C99 6.4.4.4 escapes; 5.2.1.1 trigraphs; octal escapes always three digits. */
  @Test
  void stringLiteralEscapesEveryDangerousByte() {
    assertThat(CText.stringLiteral("a\"b\\c")).isEqualTo("\"a\\\"b\\\\c\"");
    assertThat(CText.stringLiteral("??/")).isEqualTo("\"\\?\\?/\"");
    assertThat(CText.stringLiteral("\n1")).isEqualTo("\"\\0121\"");
    assertThat(CText.stringLiteral("\u00fc")).isEqualTo("\"\\303\\274\"");
    assertThat(CText.stringLiteral("\u0000")).isEqualTo("\"\\000\"");
  }

  @Test
  void commentTextCannotCloseOpenOrSplice() {
    assertThat(CText.comment("a*/b")).isEqualTo("a*\\/b");
    assertThat(CText.comment("a/*b")).isEqualTo("a/\\*b");
    assertThat(CText.comment("*/*/")).doesNotContain("*/").doesNotContain("/*");
    assertThat(CText.comment("??/")).isEqualTo("?\\?/");
    assertThat(CText.comment("one\ntwo\u2028")).isEqualTo("one[U+000A]two[U+2028]");
  }

  @Test
  void int32SpellsTheMinimumAsAnExpression() {
    assertThat(CText.int32(Integer.MIN_VALUE)).isEqualTo("(-2147483647 - 1)");
    assertThat(CText.int32(-5)).isEqualTo("-5");
  }
}
