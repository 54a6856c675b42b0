package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;

import com.palantir.javapoet.JavaFile;
import com.palantir.javapoet.TypeSpec;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.verify.Verifier;
import java.lang.reflect.Method;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import javax.lang.model.element.Modifier;
import org.junit.jupiter.api.Test;

class PackedIntsTest {

  @Test
  void symbolsArePrintableAsciiWithoutQuoteOrBackslash() {
    StringBuilder all = new StringBuilder();
    for (int digit = 0; digit < 2 * PackedInts.BASE; digit++) {
      all.append(PackedInts.symbol(digit));
    }
    assertThat(all.chars().distinct().count()).isEqualTo(90);
    assertThat(all.toString()).doesNotContain("\\").doesNotContain("\"")
        .startsWith("#$%").endsWith("{|}");
    assertThat(all.chars()).allMatch(c -> c > 0x20 && c < 0x7f);
  }

  @Test
  void digitBoundariesTakeTheExpectedNumberOfSymbols() {
    // Worked by hand: 45 single-digit values, 45 * 45 = 2,025 two-digit ones, 45^5 < 2^32 < 45^6.
    assertThat(new PackedInts().add(44).text()).hasSize(1);
    assertThat(new PackedInts().add(45).text()).hasSize(2);
    assertThat(new PackedInts().add(2024).text()).hasSize(2);
    assertThat(new PackedInts().add(2025).text()).hasSize(3);
    assertThat(new PackedInts().add(-1).text()).hasSize(6);
    assertThat(new PackedInts().add(0).add(0).count()).isEqualTo(2);
  }

  @Test
  void theEmittedDecoderReadsBackEveryNumber() throws Exception {
    List<Integer> values = new ArrayList<>(List.of(0, 1, 44, 45, 46, 2024, 2025, 91124, 91125,
        Integer.MAX_VALUE, Integer.MIN_VALUE, -1, -45, Float.floatToRawIntBits(2.5f),
        Float.floatToRawIntBits(-0.0f), Float.floatToRawIntBits(Float.NaN)));
    SplittableRandom random = new SplittableRandom(8);
    for (int i = 0; i < 5000; i++) {
      values.add(random.nextInt() >> random.nextInt(32));
    }
    PackedInts packed = new PackedInts();
    values.forEach(packed::add);
    packed.addSigned(-7).addSigned(7).addDouble(-0.1);

    int[] decoded = decode(packed);

    int n = values.size();
    assertThat(decoded).hasSize(n + 4);
    for (int i = 0; i < n; i++) {
      assertThat(decoded[i]).isEqualTo(values.get(i));
    }
    // Zigzag: 13 and 14 stand for -7 and 7 (worked by hand).
    assertThat(decoded[n]).isEqualTo(13);
    assertThat(decoded[n + 1]).isEqualTo(14);
    long bits = ((long) decoded[n + 2] << 32) | (decoded[n + 3] & 0xffffffffL);
    assertThat(Double.longBitsToDouble(bits)).isEqualTo(-0.1);
  }

  /** Compiles the emitted {@code unpack} into a class and runs it on the packed text. */
  private static int[] decode(PackedInts packed) throws Exception {
    TypeSpec type = TypeSpec.classBuilder("Unpack").addModifiers(Modifier.PUBLIC)
        .addMethod(PackedInts.unpackMethod())
        .build();
    String source = JavaFile.builder("packed", type).build().toString();
    InMemoryCompiler javac = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);
    Method method = javac.compileOne("packed.Unpack", source).load("packed.Unpack")
        .getDeclaredMethod("unpack", String.class, int.class);
    method.setAccessible(true);
    return (int[]) method.invoke(null, packed.text(), packed.count());
  }
}
