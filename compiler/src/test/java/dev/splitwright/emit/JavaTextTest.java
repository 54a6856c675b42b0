package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.time.Duration;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class JavaTextTest {

  @Test
  void wrapsAMegabyteWordInLinearTime() {
    // A 2 MB field from a CSV (the fuzzer's case) once took minutes: each line re-measured the
    // whole rest. Now each line looks at one line's worth of text.
    String word = "ab".repeat(1 << 20);
    List<String> lines = assertTimeoutPreemptively(Duration.ofSeconds(5),
        () -> SourceLines.wrap(word, 80));

    assertThat(lines).hasSize((word.length() + 79) / 80)
        .allMatch(line -> line.length() <= 80);
    assertThat(String.join("", lines)).isEqualTo(word);
  }

  @Test
  void floatLiteralsReadBackExactly() {
    // IEEE 754 binary32: every non-NaN bit pattern must survive the literal + parseFloat.
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

  // Built from code units: this file's own unicode escapes would meet the javac quirk tested here.
  private static final String HIGH = String.valueOf((char) 0xd83d);
  private static final String LOW = String.valueOf((char) 0xdd25);
  private static final String BACKSLASH = String.valueOf((char) 0x5c);

  @Test
  void loneSurrogatesAreSpelledOutInCommentsAndPairsKept() {
    assertThat(JavaText.comment("a" + HIGH + BACKSLASH + "u000a b" + HIGH + LOW))
        .isEqualTo("a[U+D83D]" + BACKSLASH + BACKSLASH + "u000a b" + HIGH + LOW);
  }

  @Test
  void stringLiteralsAreAsciiAndEscapeBackslashesAfterAHighSurrogateInOctal() {
    // JLS §3.10.6: octal escape 134 is the backslash; javac 17 miscounts backslashes right after
    // the escape of a lone high surrogate (measured), so that backslash is written in octal.
    assertThat(JavaText.stringLiteral("q\"b" + BACKSLASH + "\n" + HIGH + BACKSLASH + "u"))
        .isEqualTo("\"q" + BACKSLASH + "\"b" + BACKSLASH + BACKSLASH + BACKSLASH + "n"
            + BACKSLASH + "ud83d" + BACKSLASH + "134u\"");
  }

  @Test
  void asciiOnlyRefusesALoneHighSurrogateBeforeABackslash() {
    assertThatThrownBy(() -> JavaText.asciiOnly("// " + HIGH + BACKSLASH + BACKSLASH + "u000a"))
        .isInstanceOf(IllegalStateException.class);
    assertThat(JavaText.asciiOnly(HIGH + LOW + BACKSLASH))
        .isEqualTo(BACKSLASH + "ud83d" + BACKSLASH + "udd25" + BACKSLASH);
  }
}
