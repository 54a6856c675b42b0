package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.check.CompilationException;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.verify.Verifier;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class LongStringsTest {
  private static final InMemoryCompiler JAVAC = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);

  @Test
  void piecesStayWithinTheModifiedUtf8Limit() {
    // JVMS §4.4.7: NUL and U+0080-U+07FF take two bytes, U+0800 and up three, each surrogate too.
    assertThat(LongStrings.modifiedUtf8Bytes("a\u0000\u00e9\u20ac\ud83d\udd25")).isEqualTo(
        1 + 2 + 2 + 3 + 6);
    List<String> pieces = LongStrings.split("ab\u20acc", 4);
    assertThat(pieces).containsExactly("ab", "\u20acc");
    assertThat(LongStrings.split("", 10)).containsExactly("");
  }

  @Test
  void javacRefusesAConstantOf65535CharsButTakes65534() throws Exception {
    // The class file would allow 65,535 bytes (a u2 length, JVMS §4.4.7); javac stops one short.
    String fits = "package lim;\nclass Fits { static final String S = \""
        + "a".repeat(65_534) + "\"; }\n";
    JAVAC.compileOne("lim.Fits", fits);
    String over = fits.replace("Fits", "Over").replace("\"a", "\"aa");
    assertThatThrownBy(() -> JAVAC.compileOne("lim.Over", over))
        .isInstanceOf(CompilationException.class)
        .hasMessageContaining("constant string too long");
  }

  @Test
  void longTextOfAnyCharactersComesBackExactly() throws Exception {
    SplittableRandom random = new SplittableRandom(4);
    StringBuilder text = new StringBuilder();
    char[] sample = {'a', '"', '\\', '\n', '\r', '\u0000', '\u00e9', '\u2028', '\u20ac',
        '\ud83d', '\udd25', '*', '/', 'u'};
    for (int i = 0; i < 150_000; i++) {
      text.append(sample[random.nextInt(sample.length)]);
    }
    String source = "package lim;\npublic final class Text {\n  public static String get() {\n"
        + "    return " + LongStrings.expression(text.toString()) + ";\n  }\n}\n";

    Object back = JAVAC.compileOne("lim.Text", JavaText.asciiOnly(source)).load("lim.Text")
        .getMethod("get").invoke(null);

    assertThat(back).isEqualTo(text.toString());
    assertThat(source).contains(".concat(");
  }
}
