package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.catchThrowable;

import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Modifier;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.zip.Adler32;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Runs D8 for real and checks its output against the AOSP page "Dalvik executable format"
 * (source.android.com/docs/core/runtime/dex-format), read here without {@link DexFile} where the
 * check is about the bytes themselves.
 */
class DexerTest {

  private static final String PUMP =
      """
      package demo;

      public final class Pump {
        private Pump() {}

        public static int classify(float[] x) {
          if (x[0] <= 1.5f) {
            return x[1] <= 0.25f ? 0 : 1;
          }
          return x[2] <= 7.0f ? 2 : 0;
        }
      }
      """;

  private static InMemoryCompiler release17;

  @BeforeAll
  static void openCompiler() {
    release17 = InMemoryCompiler.create(List.of("--release", "17"));
  }

  @AfterAll
  static void closeCompiler() {
    release17.close();
  }

  @Test
  void dexesOneClassIntoAFileTheFormatDescribes() throws Exception {
    CompiledClasses pump = release17.compileOne("demo.Pump", PUMP);
    byte[] dex = Dexer.forMinApi(21).dex(pump).bytes("Ldemo/Pump;");
    ByteBuffer header = ByteBuffer.wrap(dex).order(ByteOrder.LITTLE_ENDIAN);

    // Dalvik executable format, "DEX_FILE_MAGIC": "dex\n", three version digits, "\0".
    assertThat(new String(dex, 0, 5, StandardCharsets.US_ASCII)).isEqualTo("dex\n0");
    assertThat(dex[5]).isEqualTo((byte) '3');
    assertThat(dex[7]).isZero();
    // header_item: file_size at 0x20 is the whole file; header_size 0x70; endian_tag 0x12345678.
    assertThat(header.getInt(0x20)).isEqualTo(dex.length);
    assertThat(header.getInt(0x24)).isEqualTo(0x70);
    assertThat(header.getInt(0x28)).isEqualTo(0x12345678);
    // header_item: checksum at 8 is Adler-32 of the rest of the file after it (from offset 12).
    Adler32 adler = new Adler32();
    adler.update(dex, 12, dex.length - 12);
    assertThat(Integer.toUnsignedLong(header.getInt(8))).isEqualTo(adler.getValue());
    // header_item: signature at 12 is the SHA-1 of the rest of the file after it (from offset 32).
    MessageDigest sha1 = MessageDigest.getInstance("SHA-1");
    sha1.update(dex, 32, dex.length - 32);
    assertThat(Arrays.copyOfRange(dex, 12, 32)).isEqualTo(sha1.digest());
    // header_item: class_defs_size at 0x60; one class in, one class out.
    assertThat(header.getInt(0x60)).isEqualTo(1);

    DexFile parsed = DexFile.parse(dex);
    assertThat(parsed.classDescriptors()).containsExactly("Ldemo/Pump;");
    assertThat(parsed.verifyChecksum()).isTrue();
    assertThat(parsed.verifySignature()).isTrue();
    assertThat(parsed.fileSize()).isEqualTo(dex.length);
  }

  /**
   * The DEX version follows the minimum API level. Dalvik executable format, "DEX_FILE_MAGIC"
   * notes: 037 from Android 7.0 (API 24), 038 from Android 8.0 (API 26), 039 from Android 9.0
   * (API 28); older devices read only 035.
   */
  @ParameterizedTest
  @CsvSource({"1, 35", "21, 35", "24, 37", "26, 38", "28, 39", "35, 39"})
  void writesTheVersionTheMinimumApiLevelAllows(int minApi, int version) throws Exception {
    DexedClasses dexed = Dexer.forMinApi(minApi).dex(release17.compileOne("demo.Pump", PUMP));

    assertThat(dexed.parse("Ldemo/Pump;").version()).isEqualTo(version);
  }

  @Test
  void twentyClassesInOneRunGiveTheSameFilesAsTwentyRuns() throws Exception {
    List<SourceFile> sources = new ArrayList<>();
    for (int i = 0; i < 20; i++) {
      sources.add(new SourceFile("demo.Unit" + i, unit(i)));
    }
    CompiledClasses classes = release17.compile(sources);
    Dexer dexer = Dexer.forMinApi(26);

    DexedClasses batch = dexer.dex(classes);

    assertThat(batch.descriptors()).hasSize(20);
    for (int i = 0; i < 20; i++) {
      String name = "demo.Unit" + i;
      String descriptor = DexedClasses.descriptorOf(name);
      CompiledClasses one = CompiledClasses.of(Map.of(name, classes.bytes(name)));
      byte[] alone = dexer.dex(one).bytes(descriptor);
      assertThat(batch.bytes(descriptor)).as(descriptor).isEqualTo(alone);
      assertThat(batch.parse(descriptor).classDescriptors()).containsExactly(descriptor);
    }
    // Sizes differ with the number of branches, so a mix-up of files would show.
    assertThat(batch.size("Ldemo/Unit19;")).isGreaterThan(batch.size("Ldemo/Unit0;"));
    DexedClasses again = dexer.dex(classes);
    for (String descriptor : batch.descriptors()) {
      assertThat(again.bytes(descriptor)).as(descriptor).isEqualTo(batch.bytes(descriptor));
    }
  }

  @Test
  void nestedClassesGetFilesOfTheirOwn() throws Exception {
    String source =
        """
        package demo;

        public final class Outer {
          static final class Leaf {
            final int label = 3;
          }
        }
        """;

    DexedClasses dexed = Dexer.forMinApi(21).dex(release17.compileOne("demo.Outer", source));

    assertThat(dexed.descriptors()).containsExactly("Ldemo/Outer$Leaf;", "Ldemo/Outer;");
  }

  @Test
  void emptyClassCostsLessThanAClassWithCode() throws Exception {
    Dexer dexer = Dexer.forMinApi(21);

    int empty = dexer.emptyClassSize("demo.Pump");
    int pump = dexer.dex(release17.compileOne("demo.Pump", PUMP)).size("Ldemo/Pump;");

    // At least the 0x70-byte header_item (Dalvik executable format).
    assertThat(empty).isGreaterThan(0x70).isLessThan(pump);
    // A longer name is stored once more in string_data, so it costs its extra length or more.
    assertThat(dexer.emptyClassSize("demo.PumpWithALongerName")).isGreaterThanOrEqualTo(empty + 15);
  }

  @Test
  void emptyClassFileIsOneTheJvmAccepts() {
    Class<?> loaded =
        CompiledClasses.of(Map.of("demo.Empty", EmptyClassFile.of("demo.Empty")))
            .load("demo.Empty");

    assertThat(loaded.getName()).isEqualTo("demo.Empty");
    assertThat(loaded.getDeclaredMethods()).isEmpty();
    assertThat(loaded.getDeclaredConstructors()).isEmpty();
    assertThat(Modifier.isFinal(loaded.getModifiers())).isTrue();
  }

  @ParameterizedTest
  @ValueSource(ints = {Integer.MIN_VALUE, -1, 0, 36, 10000})
  void rejectsMinimumApiLevelsD8DoesNotSupport(int minApi) {
    assertThatIllegalArgumentException()
        .isThrownBy(() -> Dexer.forMinApi(minApi))
        .withMessageContaining(Integer.toString(minApi))
        .withMessageContaining("1 to 35");
  }

  @Test
  void acceptsTheEndsOfTheRange() {
    assertThat(Dexer.forMinApi(Dexer.LOWEST_MIN_API).minApi()).isEqualTo(1);
    assertThat(Dexer.forMinApi(Dexer.HIGHEST_MIN_API).minApi()).isEqualTo(35);
  }

  @Test
  void rejectsAClassFileD8CannotRead() {
    byte[] broken = Arrays.copyOf(EmptyClassFile.of("demo.Broken"), 20);
    CompiledClasses classes = CompiledClasses.of(Map.of("demo.Broken", broken));

    assertThatIllegalArgumentException()
        .isThrownBy(() -> Dexer.forMinApi(21).dex(classes))
        .withMessageContaining("demo.Broken");
  }

  /** The issue asks that a run without DEX sizes never load D8's large jar. */
  @Test
  void loadsD8OnlyWhenAskedToDex() throws Exception {
    URL ours = Dexer.class.getProtectionDomain().getCodeSource().getLocation();
    URL r8 = com.android.tools.r8.D8.class.getProtectionDomain().getCodeSource().getLocation();
    List<String> requested = Collections.synchronizedList(new ArrayList<>());
    try (URLClassLoader loader =
        new URLClassLoader(new URL[] {ours, r8}, ClassLoader.getPlatformClassLoader()) {
          @Override
          protected Class<?> loadClass(String name, boolean resolve) throws ClassNotFoundException {
            requested.add(name);
            return super.loadClass(name, resolve);
          }
        }) {
      Class<?> dexer = Class.forName(Dexer.class.getName(), true, loader);
      Object instance = dexer.getMethod("forMinApi", int.class).invoke(null, 21);
      dexer.getMethod("minApi").invoke(instance);

      assertThat(requested).contains(Dexer.class.getName());
      assertThat(requested).noneMatch(name -> name.startsWith("com.android.tools."));

      // The same probe sees D8 once it is used, so the check above can fail.
      dexer.getMethod("emptyClassSize", String.class).invoke(instance, "demo.Empty");
      assertThat(requested).anyMatch(name -> name.startsWith("com.android.tools.r8."));
    }
  }

  /** The CLI's jar may leave D8 out; then dexing must say what is missing. */
  @Test
  void namesTheMissingJarWhenD8IsAbsent() throws Exception {
    URL ours = Dexer.class.getProtectionDomain().getCodeSource().getLocation();
    try (URLClassLoader loader =
        new URLClassLoader(new URL[] {ours}, ClassLoader.getPlatformClassLoader())) {
      Class<?> dexer = Class.forName(Dexer.class.getName(), true, loader);
      Object instance = dexer.getMethod("forMinApi", int.class).invoke(null, 21);

      Throwable thrown =
          catchThrowable(
              () -> dexer.getMethod("emptyClassSize", String.class).invoke(instance, "demo.E"));

      assertThat(thrown).isInstanceOf(InvocationTargetException.class);
      assertThat(thrown.getCause())
          .isInstanceOf(IllegalStateException.class)
          .hasMessageContaining("com.android.tools:r8");
    }
  }

  /** A class with {@code i + 1} comparisons, so each of the batch has its own size. */
  private static String unit(int i) {
    StringBuilder body = new StringBuilder();
    for (int k = 0; k <= i; k++) {
      body.append(
          String.format(
              Locale.ROOT, "    if (x[%d] <= %d.5f) {%n      return %d;%n    }%n", k % 4, k, k));
    }
    return String.format(
        Locale.ROOT,
        "package demo;%n%npublic final class Unit%d {%n  private Unit%d() {}%n%n"
            + "  public static int classify(float[] x) {%n%s    return -1;%n  }%n}%n",
        i,
        i,
        body);
  }
}
