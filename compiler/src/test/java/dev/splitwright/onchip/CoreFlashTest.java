package dev.splitwright.onchip;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CEmitter;
import dev.splitwright.cgen.CSource;
import dev.splitwright.check.CCompiler;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.model.DecisionTree;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/** Flash of the pump sample's C classifier on Cortex-M cores. Skipped without the ARM tools. */
class CoreFlashTest {
  private static final String SIZE = "arm-none-eabi-size";
  // size -A (System V format): "section size addr", one section per line.
  private static final Pattern SIZE_ROW = Pattern.compile("(\\S+)\\s+(\\d+)\\s+(\\d+)");

  @TempDir
  static Path dir;

  private static CortexMToolchain arm;
  private static DecisionTree tree;

  @BeforeAll
  static void setUp() throws Exception {
    arm = OnChipFixtures.arm();
    tree = OnChipFixtures.pumpSample(dir);
  }

  /**
   * The object bytes equal what GNU binutils' {@code arm-none-eabi-size -A} prints for the same
   * object, summing the sections that go to flash: {@code .text*}, {@code .rodata*} and {@code
   * .data*} (initial values are copied from flash at start-up), not {@code .bss*}.
   */
  @ParameterizedTest
  @EnumSource(value = CortexMProfile.class, names = {"CORTEX_M0PLUS", "CORTEX_M4F"})
  void objectBytesEqualWhatArmSizePrints(CortexMProfile core) throws Exception {
    assumeTrue(runs(List.of(SIZE, "--version")), SIZE + " is needed: apt-get install "
        + "binutils-arm-none-eabi");
    CEmitOptions options = CEmitOptions.of("pump").withProbabilities(true);
    CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
    FlashCost cost = CoreFlash.measure(arm, source, options, core, List.of("-Os"),
        OnChipFixtures.BUILD_LIMIT);

    Map<String, String> files = new LinkedHashMap<>();
    files.put(source.headerName(), source.headerText());
    files.put(source.sourceName(), source.sourceText());
    byte[] object = CCompiler.find(CortexMToolchain.COMPILER, core.compilerFlags(List.of("-Os")),
        OnChipFixtures.BUILD_LIMIT).compileObjects(files).bytes(source.sourceName());
    Path file = dir.resolve(core.id() + ".o");
    Files.write(file, object);
    long flash = 0;
    for (String line : output(List.of(SIZE, "-A", "-d", file.toString()))) {
      Matcher m = SIZE_ROW.matcher(line.strip());
      if (m.matches() && (isUnder(m.group(1), ".text") || isUnder(m.group(1), ".rodata")
          || isUnder(m.group(1), ".data"))) {
        flash += Long.parseLong(m.group(2));
      }
    }

    assertThat(flash).isPositive();
    assertThat(cost.objectFlashBytes()).isEqualTo(flash);
    assertThat(cost.compilerFlags()).isEqualTo(core.compilerFlags(List.of("-Os")));
  }

  /**
   * Without FPU the float comparisons call libgcc's soft-float helpers (ARM run-time ABI, "the
   * floating-point helper functions", e.g. {@code __aeabi_fcmple}); with the M4F's FPU they are
   * instructions and no helper is linked.
   */
  @Test
  void theM0PlusPaysForSoftFloatHelpersAndTheM4FDoesNot() throws Exception {
    CEmitOptions options = CEmitOptions.of("pump").withBare(true);
    CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
    FlashCost m0 = CoreFlash.measure(arm, source, options, CortexMProfile.CORTEX_M0PLUS,
        List.of("-Os"), OnChipFixtures.BUILD_LIMIT);
    FlashCost m4 = CoreFlash.measure(arm, source, options, CortexMProfile.CORTEX_M4F,
        List.of("-Os"), OnChipFixtures.BUILD_LIMIT);

    assertThat(m0.helpers()).isNotEmpty().allMatch(name -> name.startsWith("__"))
        .anyMatch(name -> name.startsWith("__aeabi_fcmp"));
    assertThat(m0.helperBytes()).isPositive();
    assertThat(m0.linkedCost()).isGreaterThanOrEqualTo(m0.objectFlashBytes() + m0.helperBytes());
    assertThat(m4.helpers()).isEmpty();
    assertThat(m4.helperBytes()).isZero();
    assertThat(m4.linkedCost()).isGreaterThanOrEqualTo(m4.objectFlashBytes());
  }

  /** Int32 input compares integers: no float helper on the M0+ either. */
  @Test
  void intInputNeedsNoHelperOnTheM0Plus() throws Exception {
    CEmitOptions options = CEmitOptions.of("pump").withBare(true).withInputKind(InputKind.INT);
    FlashCost cost = CoreFlash.measure(arm, CEmitter.emit(tree, options, HeaderInfo.none()),
        options, CortexMProfile.CORTEX_M0PLUS, List.of("-Os"), OnChipFixtures.BUILD_LIMIT);
    assertThat(cost.helpers()).isEmpty();
    assertThat(cost.linkedCost()).isGreaterThanOrEqualTo(cost.objectFlashBytes());
  }

  private static boolean isUnder(String name, String base) {
    return name.equals(base) || name.startsWith(base + ".");
  }

  private static boolean runs(List<String> command) {
    try {
      output(command);
      return true;
    } catch (IOException e) {
      return false;
    }
  }

  private static List<String> output(List<String> command) throws IOException {
    Process process = new ProcessBuilder(command).redirectErrorStream(true).start();
    process.getOutputStream().close();
    String text = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    try {
      if (!process.waitFor(60, TimeUnit.SECONDS) || process.exitValue() != 0) {
        process.destroyForcibly();
        throw new IOException(command + " failed: " + text);
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IOException("interrupted", e);
    }
    return text.lines().toList();
  }
}
