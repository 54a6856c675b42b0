package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Builds bare-metal images with {@code arm-none-eabi-gcc} and runs them on qemu's emulated MPS2
 * boards. Skipped where the ARM tools are not installed.
 */
class CortexMToolchainTest {

  private static final Duration BUILD_LIMIT = Duration.ofSeconds(120);
  private static final Duration RUN_LIMIT = Duration.ofSeconds(60);

  // The emitted-C warning set of the style guide: the harness must build cleanly under it too.
  private static final List<String> STRICT =
      List.of("-std=c99", "-Wall", "-Wextra", "-Wpedantic", "-Wconversion", "-Werror", "-Os");

  /** Per float: x <= 0.5f, !(x > 0.5f), bits of x + 0.1f, bits of x + x. */
  private static final String FLOAT_PROGRAM =
      """
      #include "sw_io.h"
      #define CHUNK 256u
      static float in[CHUNK];
      static unsigned out[CHUNK * 4u];
      __attribute__((noinline)) static unsigned at_most_half(float x) { return x <= 0.5f; }
      __attribute__((noinline)) static unsigned not_above_half(float x) { return !(x > 0.5f); }
      static unsigned bits(float f) {
        union { float f; unsigned u; } c;
        c.f = f;
        return c.u;
      }
      int main(void) {
        int src = sw_open_read(SW_INPUT);
        int dst = sw_open_write(SW_OUTPUT);
        if (src < 0 || dst < 0) {
          return 3;
        }
        for (;;) {
          int n = sw_read(src, in, sizeof in);
          unsigned count;
          unsigned i;
          if (n < 0) {
            return 4;
          }
          if (n == 0) {
            break;
          }
          count = (unsigned)n / 4u;
          for (i = 0; i < count; i++) {
            float x = in[i];
            out[4u * i] = at_most_half(x);
            out[4u * i + 1u] = not_above_half(x);
            out[4u * i + 2u] = bits(x + 0.1f);
            out[4u * i + 3u] = bits(x + x);
          }
          if (sw_write(dst, out, count * 16u) != 0) {
            return 5;
          }
        }
        return sw_close(src) | sw_close(dst);
      }
      """;

  @ParameterizedTest
  @EnumSource(CortexMProfile.class)
  void floatComparisonsAndAddsAreBitExactWithJavaOnEveryProfile(CortexMProfile profile)
      throws Exception {
    float[] inputs = floatInputs(10_000);
    try (BareMetalImage image =
        toolchain().build(profile, STRICT, Map.of("floats.c", FLOAT_PROGRAM))) {
      List<String> functions = image.elf().functions().stream().map(ElfSymbol::name).toList();
      if (profile.hasFpu()) {
        assertThat(functions).noneMatch(name -> name.startsWith("__aeabi_f"));
      } else {
        // Without FPU every comparison and add is a call into libgcc's soft-float code, so this
        // test checks how those helpers treat NaN, zeros, infinities and subnormals.
        assertThat(functions).contains("__aeabi_fcmple", "__aeabi_fcmpgt", "__aeabi_fadd");
      }

      BareMetalRun run = image.run(LittleEndian.packFloats(inputs), RUN_LIMIT);

      assertThat(run.exitStatus()).as(run.console()).isZero();
      int[] out = run.outputInts();
      assertThat(out).hasSize(4 * inputs.length);
      for (int i = 0; i < inputs.length; i++) {
        float x = inputs[i];
        String what = String.format(Locale.ROOT, "x = %s (0x%08x)", x, Float.floatToRawIntBits(x));
        // IEEE 754-2008 5.11: every comparison with NaN is unordered, so <= and > are both
        // false; Java's float operators follow IEEE 754 (JLS 15.20.1, 15.18.2, strict since 17).
        assertThat(out[4 * i]).as("%s <= 0.5f", what).isEqualTo(x <= 0.5f ? 1 : 0);
        assertThat(out[4 * i + 1]).as("!(%s > 0.5f)", what).isEqualTo(!(x > 0.5f) ? 1 : 0);
        assertSameFloat(out[4 * i + 2], x + 0.1f, what + " + 0.1f");
        // Exact for subnormals, so a core that flushes them to zero fails here.
        assertSameFloat(out[4 * i + 3], x + x, what + " + itself");
      }
      System.out.printf(
          Locale.ROOT,
          "%s on %s: %d floats in %d ms (qemu process, boot included)%n",
          profile.id(),
          profile.machine(),
          inputs.length,
          run.elapsed().toMillis());
    }
  }

  @Test
  void largeInputIsReadAndWrittenInChunks() throws Exception {
    String program =
        """
        #include "sw_io.h"
        static unsigned char buffer[1000];
        int main(void) {
          int src = sw_open_read(SW_INPUT);
          int dst = sw_open_write(SW_OUTPUT);
          int n;
          while ((n = sw_read(src, buffer, sizeof buffer)) > 0) {
            int i;
            for (i = 0; i < n; i++) {
              buffer[i] = (unsigned char)(buffer[i] ^ 0xA5u);
            }
            if (sw_write(dst, buffer, (unsigned)n) != 0) {
              return 5;
            }
          }
          return n < 0 ? 4 : 0;
        }
        """;
    byte[] input = new byte[200_003];
    new Random(14).nextBytes(input);
    try (BareMetalImage image =
        toolchain().build(CortexMProfile.CORTEX_M0PLUS, STRICT, Map.of("xor.c", program))) {
      BareMetalRun run = image.run(input, RUN_LIMIT);

      assertThat(run.exitStatus()).as(run.console()).isZero();
      byte[] expected = input.clone();
      for (int i = 0; i < expected.length; i++) {
        expected[i] ^= (byte) 0xA5;
      }
      assertThat(run.output()).isEqualTo(expected);
    }
  }

  @Test
  void exitStatusConsoleAndDataSectionsComeThrough() throws Exception {
    String program =
        """
        #include "sw_io.h"
        static volatile int initialised = 40;
        static volatile int zeroed;
        int main(void) {
          sw_log("from the board");
          return initialised + zeroed + 2;
        }
        """;
    try (BareMetalImage image =
        toolchain().build(CortexMProfile.CORTEX_M3, STRICT, Map.of("status.c", program))) {
      // volatile keeps the 40 in .data, whose initial value the start-up copies from flash.
      assertThat(image.elf().sectionSizes()).containsEntry(".data", 4L);
      assertThat(image.elf().objects())
          .extracting(ElfSymbol::name)
          .contains("initialised", "zeroed");
      BareMetalRun run = image.run(new byte[0], RUN_LIMIT);

      assertThat(run.exitStatus()).isEqualTo(42);
      assertThat(run.console()).isEqualTo("from the board\n");
      assertThat(run.output()).isEmpty();
    }
  }

  @ParameterizedTest
  @EnumSource(
      value = CortexMProfile.class,
      names = {"CORTEX_M0PLUS", "CORTEX_M7"})
  void faultEndsTheRunWithTheFaultStatus(CortexMProfile profile) throws Exception {
    // An undefined instruction: HardFault on ARMv6-M, UsageFault escalated to HardFault on ARMv7-M.
    String program = "int main(void) {\n  __builtin_trap();\n}\n";
    try (BareMetalImage image =
        toolchain().build(profile, List.of("-Os"), Map.of("trap.c", program))) {
      BareMetalRun run = image.run(new byte[0], RUN_LIMIT);

      assertThat(run.faulted()).as(run.console()).isTrue();
      assertThat(run.exitStatus()).isEqualTo(BareMetalRun.FAULT_STATUS);
      assertThat(run.console()).contains("sw: the core took a fault");
    }
  }

  @Test
  void hangingImageIsKilledAtItsTimeLimit() throws Exception {
    String program =
        """
        static volatile unsigned spins;
        int main(void) {
          for (;;) {
            spins++;
          }
        }
        """;
    try (BareMetalImage image =
        toolchain().build(CortexMProfile.CORTEX_M3, List.of("-Os"), Map.of("hang.c", program))) {
      long start = System.nanoTime();
      assertThatThrownBy(() -> image.run(new byte[0], Duration.ofMillis(1500)))
          .isInstanceOf(ProcessTimeoutException.class)
          .hasMessage(
              "\"qemu-system-arm -M mps2-an385 -nographic -monitor none -serial none"
                  + " -semihosting-config enable=on,target=native -icount shift=3 -kernel program\""
                  + " did not finish within 1500 ms and was killed with the processes it started");
      assertThat(Duration.ofNanos(System.nanoTime() - start)).isLessThan(Duration.ofSeconds(20));
      assertThat(ProcessHandle.current().children().filter(ProcessHandle::isAlive))
          .as("processes this test started")
          .isEmpty();
    }
  }

  @Test
  void instructionCountOfKnownLoopsIsExactToATickAcrossSysTickWrapArounds() throws Exception {
    // Each iteration runs two instructions, subs and bne (worked by hand from the loop below).
    String program =
        """
        #include "sw_io.h"
        static void spin(unsigned n) {
          __asm__ volatile(".syntax unified\\n1: subs %0, %0, #1\\n bne 1b\\n" : "+l"(n) : : "cc");
        }
        int main(void) {
          unsigned long long counts[4];
          int dst;
          sw_count_start();
          spin(1000u);
          counts[0] = sw_count_instructions();
          spin(100000u);
          counts[1] = sw_count_instructions();
          spin(300000u);
          counts[2] = sw_count_instructions();
          spin(45000000u);
          counts[3] = sw_count_instructions();
          dst = sw_open_write(SW_OUTPUT);
          return sw_write(dst, counts, sizeof counts) | sw_close(dst);
        }
        """;
    try (BareMetalImage image =
        toolchain().build(CortexMProfile.CORTEX_M0PLUS, STRICT, Map.of("count.c", program))) {
      BareMetalRun first = image.run(new byte[0], RUN_LIMIT);
      BareMetalRun second = image.run(new byte[0], RUN_LIMIT);

      assertThat(first.exitStatus()).as(first.console()).isZero();
      int[] words = first.outputInts();
      long[] counts = new long[4];
      for (int i = 0; i < counts.length; i++) {
        counts[i] = (words[2 * i] & 0xFFFF_FFFFL) | ((long) words[2 * i + 1] << 32);
      }
      long small = counts[1] - counts[0];
      long medium = counts[2] - counts[1];
      long large = counts[3] - counts[2];
      int tick = BareMetalImage.INSTRUCTIONS_PER_TICK;
      // Each difference also holds the same few dozen instructions of the counter itself, which
      // the differences of differences cancel.
      assertThat(small).isBetween(200_000L, 200_200L);
      assertThat(medium - small).isBetween(400_000L - 2 * tick, 400_000L + 2 * tick);
      // 90 million instructions are 18 million ticks, more than SysTick's 2^24: the wrap
      // interrupt is counted, and its handler adds a few instructions.
      assertThat(large - small).isBetween(89_800_000L - 2 * tick, 89_800_000L + 100);
      // Virtual time follows instructions, not the host: a second run counts the same.
      assertThat(second.output()).isEqualTo(first.output());
    }
  }

  @Test
  void flashCostOfAFloatComparisonIncludesTheSoftFloatHelpers() throws Exception {
    String base =
        """
        #include "sw_io.h"
        int main(void) {
          return 0;
        }
        """;
    String withCompare =
        """
        #include "sw_io.h"
        static volatile float x = 0.25f;
        int main(void) {
          return x <= 0.5f ? 0 : 1;
        }
        """;
    CortexMToolchain arm = toolchain();
    long m4Base = arm.linkedFlashBytes(CortexMProfile.CORTEX_M4F, STRICT, Map.of("a.c", base));
    long m0Base;
    try (BareMetalImage bare =
        arm.build(CortexMProfile.CORTEX_M0PLUS, STRICT, Map.of("a.c", base))) {
      // The harness alone needs no libgcc helper, so every helper in a bigger image is the
      // caller's.
      assertThat(bare.elf().functions()).noneMatch(f -> f.name().startsWith("__aeabi_"));
      m0Base = bare.flashBytes();
    }
    try (BareMetalImage m0 =
            arm.build(CortexMProfile.CORTEX_M0PLUS, STRICT, Map.of("a.c", withCompare));
        BareMetalImage m4 =
            arm.build(CortexMProfile.CORTEX_M4F, STRICT, Map.of("a.c", withCompare))) {
      assertThat(m0.run(new byte[0], RUN_LIMIT).exitStatus()).isZero();
      assertThat(m4.run(new byte[0], RUN_LIMIT).exitStatus()).isZero();
      long helpers =
          m0.elf().functions().stream()
              .filter(f -> f.name().startsWith("__aeabi_"))
              .mapToLong(ElfSymbol::size)
              .sum();
      assertThat(m0.elf().functions()).extracting(ElfSymbol::name).contains("__aeabi_fcmple");
      assertThat(m4.elf().functions()).extracting(ElfSymbol::name).doesNotContain("__aeabi_fcmple");
      // The soft-float comparison brings its libgcc helpers; the FPU compares inline.
      assertThat(helpers).isPositive();
      assertThat(m0.flashBytes() - m0Base).isGreaterThanOrEqualTo(helpers);
      assertThat(m4.flashBytes() - m4Base).isLessThan(helpers);
    }
  }

  @Test
  void cortexM0PlusImageHoldsOnlyArmV6MCodeThoughItRunsOnTheCortexM3Board() throws Exception {
    String program = FLOAT_PROGRAM;
    try (BareMetalImage image =
        toolchain().build(CortexMProfile.CORTEX_M0PLUS, STRICT, Map.of("floats.c", program))) {
      // GNU binutils' readelf reads the build attributes the compiler and libgcc's ARMv6-M
      // multilib recorded (ARM "Addenda to the ABI", Tag_CPU_arch 12 is v6S-M).
      List<String> attributes = Binutils.readelfAttributes("arm-none-eabi-readelf", image.path());
      assertThat(attributes)
          .contains("Tag_CPU_arch: v6S-M", "Tag_CPU_arch_profile: Microcontroller")
          .contains("Tag_THUMB_ISA_use: Thumb-1");
      assertThat(image.profile().machine()).isEqualTo("mps2-an385");
    }
  }

  @Test
  void rejectsSourcesNamedLikeAHarnessFile() throws Exception {
    CortexMToolchain arm = toolchain();
    assertThatIllegalArgumentException()
        .isThrownBy(
            () ->
                arm.build(
                    CortexMProfile.CORTEX_M3,
                    List.of("-Os"),
                    Map.of("main.c", "int main(void) { return 0; }\n", "sw_io.h", "")))
        .withMessage(
            "source file name \"sw_io.h\" is taken by the harness; harness files are"
                + " [sw_io.h, sw_runtime.c, sw_image.ld]");
  }

  @Test
  void missingToolsNameTheDebianPackageToInstall() {
    assertThatThrownBy(
            () -> CortexMToolchain.find("splitwright-no-such-gcc", "sh", BUILD_LIMIT))
        .isInstanceOfSatisfying(
            ArmToolNotFoundException.class,
            e -> {
              assertThat(e.tool()).isEqualTo("splitwright-no-such-gcc");
              assertThat(e.debianPackages())
                  .containsExactly("gcc-arm-none-eabi", "binutils-arm-none-eabi");
            })
        .hasMessage(
            "\"splitwright-no-such-gcc\" not found: no executable of that name on PATH; install"
                + " the Debian packages gcc-arm-none-eabi and binutils-arm-none-eabi");
    // The compiler exists (any executable will do for the lookup); the emulator does not.
    assertThatThrownBy(
            () -> CortexMToolchain.find("/bin/sh", "/nonexistent/qemu-system-arm", BUILD_LIMIT))
        .isInstanceOf(ArmToolNotFoundException.class)
        .hasMessage(
            "\"/nonexistent/qemu-system-arm\" not found: no executable file at that path; install"
                + " the Debian package qemu-system-arm");
  }

  @Test
  void profilesPutTargetThenImageThenCallerFlags() {
    assertThat(CortexMProfile.CORTEX_M4F.compilerFlags(List.of("-std=c99", "-O2")))
        .containsExactly(
            "-mcpu=cortex-m4",
            "-mthumb",
            "-mfloat-abi=hard",
            "-mfpu=fpv4-sp-d16",
            "-ffreestanding",
            "-ffunction-sections",
            "-fdata-sections",
            "-std=c99",
            "-O2");
    assertThat(CortexMProfile.CORTEX_M0PLUS.machine()).isEqualTo("mps2-an385");
    assertThat(CortexMProfile.fromId("cortex-m7")).isEqualTo(CortexMProfile.CORTEX_M7);
    for (List<String> flags :
        List.of(List.of("-std=c99"), List.of("-O2", "-Os"), List.of("-Ofast"))) {
      assertThatIllegalArgumentException()
          .isThrownBy(() -> CortexMProfile.CORTEX_M3.compilerFlags(flags))
          .withMessage(
              "codeFlags must contain exactly one of -O0 -O1 -O2 -O3 -Os -Oz -Og -O, but they are "
                  + flags);
    }
    assertThatIllegalArgumentException()
        .isThrownBy(() -> CortexMProfile.fromId("cortex-m0"))
        .withMessage(
            "unknown Cortex-M profile \"cortex-m0\"; valid are"
                + " [cortex-m0plus, cortex-m3, cortex-m4f, cortex-m7]");
  }

  private static void assertSameFloat(int actualBits, float expected, String what) {
    if (Float.isNaN(expected)) {
      // IEEE 754-2008 6.2.3 only recommends which NaN payload an operation passes on, and Java
      // leaves it open too (JLS 4.2.3), so any NaN is right.
      assertThat(Float.isNaN(Float.intBitsToFloat(actualBits))).as(what).isTrue();
    } else {
      assertThat(actualBits)
          .as("%s = %s", what, expected)
          .isEqualTo(Float.floatToRawIntBits(expected));
    }
  }

  /** Special values of IEEE 754 binary32 and their neighbours, then seeded random ones. */
  private static float[] floatInputs(int count) {
    List<Float> values = new ArrayList<>();
    float[] specials = {
      0.5f, Math.nextUp(0.5f), Math.nextDown(0.5f), -0.5f, 0.0f, -0.0f,
      Float.POSITIVE_INFINITY, Float.NEGATIVE_INFINITY, Float.NaN,
      Float.MIN_VALUE, -Float.MIN_VALUE, Float.MIN_NORMAL, Math.nextDown(Float.MIN_NORMAL),
      -Math.nextDown(Float.MIN_NORMAL), Float.MAX_VALUE, -Float.MAX_VALUE, 0.4f, 0.6f, 1.0f, -1.0f,
    };
    for (float f : specials) {
      values.add(f);
    }
    // NaNs with sign bit and payloads, quiet and signalling (IEEE 754-2008 6.2.1).
    for (int bits : new int[] {0xffc00000, 0x7f800001, 0xff800001, 0x7fc00001, 0x7fffffff}) {
      values.add(Float.intBitsToFloat(bits));
    }
    Random random = new Random(20_261_202L);
    while (values.size() < count) {
      switch (values.size() % 3) {
        case 0 -> values.add(Float.intBitsToFloat(random.nextInt()));
        case 1 -> values.add(0.5f + (random.nextFloat() - 0.5f) * 1e-6f);
        default -> values.add(Float.intBitsToFloat(random.nextInt(0x0100_0000) - 0x0080_0000));
      }
    }
    float[] result = new float[values.size()];
    for (int i = 0; i < result.length; i++) {
      result[i] = values.get(i);
    }
    return result;
  }

  private static CortexMToolchain toolchain() {
    try {
      return CortexMToolchain.find(BUILD_LIMIT);
    } catch (ArmToolNotFoundException e) {
      return Assumptions.abort(e.getMessage());
    }
  }
}
