package dev.splitwright.text;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.function.Predicate;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * Our float and double text: exact round trip, shortest, a valid Java literal and JSON number, and
 * free of the JDK's own printing (whose digits changed in JDK 19).
 */
class DecimalTextTest {
  /**
   * A decimal floating-point literal without suffix, as our layout writes it: JLS §3.10.2
   * (DecimalFloatingPointLiteral: Digits . Digits ExponentPart), which is also a JSON number
   * (RFC 8259 §6: int frac exp, no leading zeros).
   */
  private static final Pattern LITERAL =
      Pattern.compile("-?(0|[1-9][0-9]*)\\.[0-9]+(E-?[1-9][0-9]*)?");

  /** 200,000 random bit patterns (as many as issue 11 compared across JDKs) and edge values. */
  @Test
  void randomFloatBitPatternsReadBackExactlyAndAreShortest() {
    SplittableRandom random = new SplittableRandom(20_261_202L);
    List<Float> values = new ArrayList<>(specialFloats());
    for (int i = 0; i < 200_000; i++) {
      values.add(Float.intBitsToFloat(random.nextInt()));
    }
    for (float v : values) {
      if (Float.isNaN(v) || Float.isInfinite(v)) {
        continue;
      }
      String text = DecimalText.shortest(v);
      assertThat(text).as("bits %08x", Float.floatToRawIntBits(v)).matches(LITERAL);
      // IEEE 754 round to nearest, as Float.parseFloat (JLS §3.10.2 literal value) applies it.
      assertEquals(Float.floatToRawIntBits(v), Float.floatToRawIntBits(Float.parseFloat(text)),
          text);
      assertEquals(Float.floatToRawIntBits(v),
          Float.floatToRawIntBits(Float.parseFloat(text + "f")), text);
      assertNoShorterDecimal(text, s -> Float.floatToRawIntBits(Float.parseFloat(s))
          == Float.floatToRawIntBits(v));
    }
  }

  @Test
  void randomDoubleBitPatternsReadBackExactlyAndAreShortest() {
    SplittableRandom random = new SplittableRandom(1_202L);
    List<Double> values = new ArrayList<>(specialDoubles());
    for (int i = 0; i < 20_000; i++) {
      values.add(Double.longBitsToDouble(random.nextLong()));
    }
    for (double v : values) {
      if (Double.isNaN(v) || Double.isInfinite(v)) {
        continue;
      }
      String text = DecimalText.shortest(v);
      assertThat(text).matches(LITERAL);
      assertEquals(Double.doubleToRawLongBits(v),
          Double.doubleToRawLongBits(Double.parseDouble(text)), text);
      assertNoShorterDecimal(text, s -> Double.doubleToRawLongBits(Double.parseDouble(s))
          == Double.doubleToRawLongBits(v));
    }
  }

  /**
   * No decimal with one significant digit fewer reads back: the nearest ones below and above the
   * printed value are tried (any other is farther from the value). Two digits are always allowed,
   * as the layout shows at least two ({@code 1.4E-45}: JDK 19+ javadoc picks the closer of the
   * one- and two-digit decimals).
   */
  private static void assertNoShorterDecimal(String text, Predicate<String> roundTrips) {
    BigDecimal printed = new BigDecimal(text).abs();
    int digits = printed.stripTrailingZeros().precision();
    if (digits <= 2) {
      return;
    }
    for (RoundingMode mode : List.of(RoundingMode.FLOOR, RoundingMode.CEILING)) {
      String shorter = (text.startsWith("-") ? "-" : "")
          + printed.round(new MathContext(digits - 1, mode)).toString();
      assertThat(roundTrips.test(shorter)).as("%s reads back like %s", shorter, text).isFalse();
    }
  }

  private static List<Float> specialFloats() {
    List<Float> v = new ArrayList<>(List.of(0f, -0f, Float.MIN_VALUE, -Float.MIN_VALUE,
        Float.MIN_NORMAL, Math.nextDown(Float.MIN_NORMAL), Float.MAX_VALUE, -Float.MAX_VALUE,
        Math.nextDown(Float.MAX_VALUE), 1f, 0.1f, 1e-3f, Math.nextDown(1e-3f), 1e7f,
        Math.nextDown(1e7f), 9_999_999f, 16_777_216f, 16_777_217f));
    for (int e = -149; e <= 127; e++) {
      float p = Math.scalb(1f, e);
      v.add(p);
      v.add(Math.nextUp(p));
      v.add(Math.nextDown(p));
    }
    for (int e = -45; e <= 38; e++) {
      v.add(Float.parseFloat("1e" + e));
    }
    return v;
  }

  private static List<Double> specialDoubles() {
    List<Double> v = new ArrayList<>(List.of(0d, -0d, Double.MIN_VALUE, Double.MIN_NORMAL,
        Math.nextDown(Double.MIN_NORMAL), Double.MAX_VALUE, -Double.MAX_VALUE, 0.1, 2e23, 1e23,
        1e-3, Math.nextDown(1e-3), 1e7, Math.nextDown(1e7)));
    for (int e = -1074; e <= 1023; e += 7) {
      v.add(Math.scalb(1d, e));
      v.add(Math.nextUp(Math.scalb(1d, e)));
    }
    return v;
  }

  @Test
  void documentedConstantsPrintAsTheJavadocWritesThem() {
    // java.lang.Float and java.lang.Double javadoc give MIN_VALUE and MAX_VALUE as these literals.
    assertThat(DecimalText.shortest(Float.MIN_VALUE)).isEqualTo("1.4E-45");
    assertThat(DecimalText.shortest(Float.MAX_VALUE)).isEqualTo("3.4028235E38");
    assertThat(DecimalText.shortest(Double.MIN_VALUE)).isEqualTo("4.9E-324");
    assertThat(DecimalText.shortest(Double.MAX_VALUE)).isEqualTo("1.7976931348623157E308");
  }

  @Test
  void layoutFollowsTheJdkToStringRulesWorkedByHand() {
    // Float.toString javadoc: plain from 10^-3 up to below 10^7, else d.dddE[-]n; worked by hand.
    assertThat(DecimalText.shortest(0.001f)).isEqualTo("0.001");
    assertThat(DecimalText.shortest(Math.nextDown(0.001f))).isEqualTo("9.999999E-4");
    assertThat(DecimalText.shortest(1.0E-4f)).isEqualTo("1.0E-4");
    assertThat(DecimalText.shortest(9_999_999f)).isEqualTo("9999999.0");
    assertThat(DecimalText.shortest(1.0E7f)).isEqualTo("1.0E7");
    assertThat(DecimalText.shortest(100f)).isEqualTo("100.0");
    assertThat(DecimalText.shortest(-2.5f)).isEqualTo("-2.5");
    assertThat(DecimalText.shortest(0.1f)).isEqualTo("0.1");
    assertThat(DecimalText.shortest(0f)).isEqualTo("0.0");
    assertThat(DecimalText.shortest(-0f)).isEqualTo("-0.0");
    assertThat(DecimalText.shortest(Float.NaN)).isEqualTo("NaN");
    assertThat(DecimalText.shortest(Double.NEGATIVE_INFINITY)).isEqualTo("-Infinity");
  }

  /**
   * Floats and doubles that JDK 17's {@code toString} prints with a digit too many (measured on
   * this machine: JDK 17.0.15 vs Temurin 25.0.3; 2e23 is the case of JDK bug 4511638). Our text is
   * the shortest whatever JDK runs this test, so it cannot come from {@code toString}.
   */
  @Test
  void doesNotInheritJdk17sLongerDigits() {
    assertThat(DecimalText.shortest(1.18846831E13f)).isEqualTo("1.1884683E13"); // 17: 1.18846831E13
    assertThat(DecimalText.shortest(-8.1109158E8f)).isEqualTo("-8.110916E8"); // 17: -8.1109158E8
    assertThat(DecimalText.shortest(5.09672554E11f)).isEqualTo("5.0967255E11");
    assertThat(DecimalText.shortest(2e23)).isEqualTo("2.0E23"); // 17: 1.9999999999999998E23
    assertThat(DecimalText.shortest(1e23)).isEqualTo("1.0E23"); // 17: 9.999999999999999E22
    assertThat(DecimalText.shortest(2.24132002032956928E18)).isEqualTo("2.2413200203295693E18");
  }

  @Test
  void fixedAndSignificantAgreeWithTheFormatterWhereTheJdkDigitsAreShortest() {
    // java.util.Formatter (%.nf, %.ng, Locale.ROOT) is the reference; it rounds the JDK's digits
    // half up, so values whose JDK digits are not shortest (JDK 17) are left out.
    SplittableRandom random = new SplittableRandom(42);
    int compared = 0;
    for (int i = 0; i < 20_000; i++) {
      double v = random.nextDouble() * Math.pow(10, random.nextInt(-8, 9));
      v = random.nextBoolean() ? -v : v;
      if (!Double.toString(v).equals(DecimalText.shortest(v))) {
        continue;
      }
      int decimals = random.nextInt(0, 7);
      int digits = random.nextInt(1, 9);
      assertThat(DecimalText.fixed(v, decimals))
          .isEqualTo(String.format(Locale.ROOT, "%." + decimals + "f", v));
      assertThat(DecimalText.significant(v, digits))
          .isEqualTo(String.format(Locale.ROOT, "%." + digits + "g", v));
      compared++;
    }
    assertThat(compared).isGreaterThan(19_000);
  }

  @Test
  void fixedAndSignificantWorkedByHand() {
    assertThat(DecimalText.fixed(0.125, 2)).isEqualTo("0.13"); // half up on 0.125
    assertThat(DecimalText.fixed(1.0005, 3)).isEqualTo("1.001"); // digits 1.0005, not the binary
    assertThat(DecimalText.fixed(-0.04, 1)).isEqualTo("-0.0"); // sign kept, as %.1f does
    assertThat(DecimalText.fixed(-0.0, 1)).isEqualTo("-0.0");
    assertThat(DecimalText.fixed(2.0, 0)).isEqualTo("2");
    assertThat(DecimalText.fixed(99.95, 1)).isEqualTo("100.0");
    assertThat(DecimalText.significant(1.23456e-5, 4)).isEqualTo("1.235e-05");
    assertThat(DecimalText.significant(0.000123456, 4)).isEqualTo("0.0001235");
    assertThat(DecimalText.significant(12_345.6, 4)).isEqualTo("1.235e+04");
    assertThat(DecimalText.significant(1234.5, 4)).isEqualTo("1235");
    assertThat(DecimalText.significant(9999.5, 4)).isEqualTo("1.000e+04");
    assertThat(DecimalText.significant(0.5, 4)).isEqualTo("0.5000");
  }

  @Test
  void aFloatPrintedAgainGetsItsOwnTextWhateverSharesItsCacheSlot() {
    // 4096 cache slots: these floats collide in some and alternate; each keeps its own text,
    // the one a fresh BigDecimal computation gives (checked by reading back, as above).
    SplittableRandom random = new SplittableRandom(4_096L);
    float[] values = new float[20_000];
    String[] first = new String[values.length];
    for (int i = 0; i < values.length; i++) {
      values[i] = Float.intBitsToFloat(random.nextInt() & 0x7f7fffff);
      first[i] = DecimalText.shortest(values[i]);
    }
    for (int i = values.length - 1; i >= 0; i--) {
      assertThat(DecimalText.shortest(values[i])).isEqualTo(first[i]);
      assertThat(Float.parseFloat(first[i])).isEqualTo(values[i]);
    }
  }
}
