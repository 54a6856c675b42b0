package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Builds programs with the host {@code cc} and runs them on binary input. */
class NativeExecutableTest {

  private static final Duration LIMIT = Duration.ofSeconds(60);

  // Reads binary32 bit patterns from stdin, writes scale(x) the same way, exits with argc - 1.
  private static final String HARNESS =
      """
      #include <stdint.h>
      #include <stdio.h>
      #include <string.h>
      #include "scale.h"

      int main(int argc, char **argv) {
        uint32_t bits;
        (void) argv;
        while (fread(&bits, sizeof bits, 1, stdin) == 1) {
          float x;
          memcpy(&x, &bits, sizeof x);
          x = scale(x);
          memcpy(&bits, &x, sizeof bits);
          fwrite(&bits, sizeof bits, 1, stdout);
        }
        return argc - 1;
      }
      """;

  private static final Map<String, String> SCALE_PROGRAM =
      Map.of(
          "harness.c", HARNESS,
          "scale.h", "float scale(float x);\n",
          "scale.c", "#include \"scale.h\"\nfloat scale(float x) { return x * 0.75f; }\n");

  private static final float[] INPUTS = {
    0f, -0f, 1f, -3.5f, 1e-40f, Float.MIN_VALUE, Float.MAX_VALUE, Float.POSITIVE_INFINITY,
    0.1f, 16777217f, -Float.MIN_NORMAL
  };

  @TempDir Path dir;

  private static CCompiler cc() throws CCompilerNotFoundException {
    return CCompiler.find("cc", List.of("-std=c99", "-O2", "-Wall", "-Werror"), LIMIT);
  }

  @Test
  void harnessOutputMatchesJavaFloatArithmeticBitForBit() throws Exception {
    try (NativeExecutable program = cc().buildExecutable(SCALE_PROGRAM)) {
      NativeRun run = program.run(List.of("one", "two"), LittleEndian.packFloats(INPUTS), LIMIT);

      assertThat(run.exitCode()).isEqualTo(2);
      assertThat(run.stderr()).isEmpty();
      // IEEE 754 binary32 multiplication is correctly rounded in Java (JLS 15.17.1) and in C on
      // x86-64 SSE (C99 Annex F, FLT_EVAL_METHOD 0), so the bit patterns must agree exactly.
      int[] expected = new int[INPUTS.length];
      for (int i = 0; i < INPUTS.length; i++) {
        expected[i] = Float.floatToRawIntBits(INPUTS[i] * 0.75f);
      }
      assertThat(run.stdoutInt32s()).containsExactly(expected);
    }
  }

  @Test
  void readsStandardInputFromAFile() throws Exception {
    Path input = dir.resolve("input.bin");
    Files.write(input, LittleEndian.packFloats(2f, -8f));

    try (NativeExecutable program = cc().buildExecutable(SCALE_PROGRAM)) {
      NativeRun run = program.run(List.of(), input, LIMIT);

      assertThat(run.succeeded()).isTrue();
      assertThat(LittleEndian.unpackFloats(run.stdout())).containsExactly(1.5f, -6f);
    }
  }

  @Test
  void largeInputAndOutputOnAllThreePipesDoNotDeadlock() throws Exception {
    // Writes 1 MiB to stderr before reading anything, then copies stdin to stdout: a runner
    // that fed stdin and read the outputs one after another would wait forever.
    String echo =
        """
        #include <stdio.h>

        int main(void) {
          int c;
          for (long i = 0; i < 1048576L; i++) {
            fputc('e', stderr);
          }
          while ((c = getchar()) != EOF) {
            putchar(c);
          }
          return 0;
        }
        """;
    byte[] input = new byte[4 << 20];
    new Random(7).nextBytes(input);

    try (NativeExecutable program = cc().buildExecutable(Map.of("echo.c", echo))) {
      NativeRun run = program.run(List.of(), input, LIMIT);

      assertThat(run.exitCode()).isZero();
      assertThat(Arrays.equals(run.stdout(), input)).isTrue();
      assertThat(run.stderr()).hasSize(1 << 20);
    }
  }

  @Test
  void hangingProgramIsKilledAtItsTimeLimit() throws Exception {
    CCompiler cc = CCompiler.find("cc", List.of("-std=c99", "-O0"), LIMIT);
    try (NativeExecutable program =
        cc.buildExecutable(Map.of("spin.c", "int main(void) { for (;;) {} }\n"))) {
      long start = System.nanoTime();

      assertThatThrownBy(() -> program.run(List.of(), new byte[0], Duration.ofMillis(300)))
          .isInstanceOf(ProcessTimeoutException.class)
          .hasMessage(
              "\"program\" did not finish within 300 ms and was killed with the processes it"
                  + " started");
      assertThat(Duration.ofNanos(System.nanoTime() - start)).isLessThan(Duration.ofSeconds(10));
    }
  }

  @Test
  void crashReportsTheSignalInTheExitCode() throws Exception {
    String crash =
        """
        #include <signal.h>

        int main(void) {
          raise(SIGSEGV);
          return 0;
        }
        """;
    try (NativeExecutable program = cc().buildExecutable(Map.of("crash.c", crash))) {
      NativeRun run = program.run(List.of(), new byte[0], LIMIT);

      // Java reports death by signal N as 128 + N (from memory); SIGSEGV is 11 on Linux.
      assertThat(run.exitCode()).isEqualTo(128 + 11);
    }
  }

  @Test
  void closeDeletesTheProgramAndForbidsFurtherRuns() throws Exception {
    NativeExecutable program = cc().buildExecutable(SCALE_PROGRAM);
    Path path = program.path();
    assertThat(path).isExecutable();
    assertThat(program.elf().functions()).extracting(ElfSymbol::name).contains("main", "scale");

    program.close();

    assertThat(path.getParent()).doesNotExist();
    assertThatThrownBy(() -> program.run(List.of(), new byte[0], LIMIT))
        .isInstanceOf(IllegalStateException.class)
        .hasMessage("executable program was closed");
  }

  @Test
  void linkErrorIsACompileException() throws Exception {
    String source = "int missing(void);\nint main(void) { return missing(); }\n";

    assertThatThrownBy(() -> cc().buildExecutable(Map.of("main.c", source)))
        .isInstanceOfSatisfying(
            CCompileException.class,
            e -> assertThat(e.stderr()).contains("undefined reference to `missing'"));
  }
}
