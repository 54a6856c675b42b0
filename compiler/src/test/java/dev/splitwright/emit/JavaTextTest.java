package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class JavaTextTest {

  @Test
  void floatLiteralsReadBackExactly() {
    // IEEE 754 binary32: every non-NaN bit pattern must survive Float.toString + parseFloat.
    SplittableRandom random = new SplittableRandom(3);
    for (int i = 0; i < 100_000; i++) {
      float f = Float.intBitsToFloat(random.nextInt());
      if (Float.isNaN(f) || Float.isInfinite(f)) {
        continue;
      }
      String literal = JavaText.floatLiteral(f);
      assertThat(literal).endsWith("f");
      float back = Float.parseFloat(literal.substring(0, literal.length() - 1));
      assertThat(Float.floatToRawIntBits(back)).isEqualTo(Float.floatToRawIntBits(f));
    }
  }

  @Test
  void infinitiesUseTheNamedConstantsAndNaNIsRejected() {
    assertThat(JavaText.floatLiteral(Float.NEGATIVE_INFINITY)).isEqualTo("Float.NEGATIVE_INFINITY");
    assertThat(JavaText.doubleLiteral(Double.POSITIVE_INFINITY))
        .isEqualTo("Double.POSITIVE_INFINITY");
    assertThatThrownBy(() -> JavaText.floatLiteral(Float.NaN))
        .isInstanceOf(IllegalArgumentException.class);
  }

  @Test
  void commentTextCannotCloseTheCommentOrFormAUnicodeEscape() {
    // JLS §3.3: a backslash-u is an escape only after an even number of backslashes.
    String safe = JavaText.comment("a */ b \\u000a c\nd");
    assertThat(safe).doesNotContain("*/").doesNotContain("\n").contains("\\\\u000a");
  }

  @Test
  void asciiOnlyEscapesEveryNonAsciiCharacter() {
    assertThat(JavaText.asciiOnly("caf\u00e9 \u00b0C")).isEqualTo("caf\\u00e9 \\u00b0C");
    assertThat(JavaText.asciiOnly("plain")).isEqualTo("plain");
  }
}
