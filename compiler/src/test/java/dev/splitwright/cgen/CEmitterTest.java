package dev.splitwright.cgen;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import dev.splitwright.verify.ProbeAccess;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.MethodSource;

/** Emitted C built with the host's gcc and run against the model. */
class CEmitterTest {
  @TempDir
  Path dir;

  @BeforeAll
  static void needsGcc() {
    assumeTrue(Gcc.available(), "gcc and g++ are needed to build emitted C");
  }

  static Stream<Arguments> variants() {
    List<Arguments> out = new ArrayList<>();
    for (int tree = 0; tree < HandTrees.all().size(); tree++) {
      for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
        for (InputKind kind : List.of(InputKind.FLOAT, InputKind.INT)) {
          for (int extras = 0; extras < 4; extras++) {
            out.add(Arguments.of(tree, layout, kind, (extras & 1) != 0, (extras & 2) != 0));
          }
        }
      }
    }
    return out.stream();
  }

  @ParameterizedTest(name = "tree {0} {1} {2} probabilities={3} bare={4}")
  @MethodSource("variants")
  void handBuiltTreesGiveTheModelsClassesAndFrequencies(int treeIndex, Layout layout,
      InputKind kind, boolean probabilities, boolean bare) throws IOException {
    DecisionTree tree = HandTrees.all().get(treeIndex);
    CEmitOptions options = CEmitOptions.of("pump_state_classifier").withLayout(layout)
        .withInputKind(kind).withProbabilities(probabilities).withBare(bare);
    COracle.Report report;
    if (kind == InputKind.FLOAT) {
      List<float[]> inputs = new ArrayList<>(HandTrees.floatInputs(tree));
      inputs.addAll(ProbeAccess.floatProbes(tree, 7, 500));
      report = COracle.checkFloats(dir, tree, options, inputs);
    } else {
      List<int[]> inputs = new ArrayList<>(HandTrees.intInputs(tree));
      inputs.addAll(ProbeAccess.intProbes(tree));
      report = COracle.checkInts(dir, tree, options, inputs);
    }
    assertThat(report.inputs()).isGreaterThan(treeIndex == 0 ? 10_000 : 10);
    assertThat(report.mismatches()).as(report.describe()).isZero();
  }

  /**
   * The proof can fail: the threshold 0.1f moved up by one ulp in the emitted source sends x =
   * nextUp(0.1f) left where the model sends it right.
   */
  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE"})
  void thresholdMovedByOneUlpIsCaught(Layout layout) throws IOException {
    DecisionTree tree = HandTrees.mixed();
    CEmitOptions options = CEmitOptions.of("moved").withLayout(layout);
    CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
    float t = 0.1f;
    String exact = CText.hexFloat(t);
    String moved = CText.hexFloat(Math.nextUp(t));
    assertThat(source.sourceText()).contains(exact + " ");
    CSource altered = new CSource(source.headerName(), source.headerText(), source.sourceName(),
        source.sourceText().replace(exact + " ", moved + " "));
    List<float[]> inputs = HandTrees.floatInputs(tree);
    COracle.Report report = COracle.compare(dir, tree, options, altered,
        HarnessData.packFloats(inputs, 4), inputs);
    assertThat(report.mismatches()).isPositive();
    COracle.Report intact = COracle.compare(dir, tree, options, source,
        HarnessData.packFloats(inputs, 4), inputs);
    assertThat(intact.mismatches()).as(intact.describe()).isZero();
  }

  /**
   * -ffast-math and -ffinite-math-only let gcc assume no NaN (gcc manual, "Optimize Options"), so
   * the source refuses them; a plain build of the same file passes.
   */
  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE"})
  void fastMathStopsTheBuild(Layout layout) throws IOException {
    CSource source = CEmitter.emit(HandTrees.mixed(), CEmitOptions.of("guarded")
        .withLayout(layout), HeaderInfo.none());
    Gcc.write(dir, source.headerName(), source.headerText(), source.sourceName(),
        source.sourceText());
    for (String flag : List.of("-ffast-math", "-ffinite-math-only", "-Ofast")) {
      List<String> flags = new ArrayList<>(Gcc.STRICT);
      flags.add(flag);
      Gcc.Result result = Gcc.gcc(dir, flags, List.of(source.sourceName()), "guarded.o");
      assertThat(result.exit()).as(flag).isNotZero();
      assertThat(result.output()).as(flag).contains("#error").contains("-ffast-math");
    }
    Gcc.gcc(dir, Gcc.STRICT, List.of(source.sourceName()), "guarded.o").orFail("plain build");
  }

  /** The header compiles as C++11 and a C++ caller links with the C object and gets classes. */
  @Test
  void headerCompilesAsCppAndLinks() throws IOException {
    DecisionTree tree = HandTrees.mixed();
    CEmitOptions options = CEmitOptions.of("pump_state_classifier").withProbabilities(true);
    CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
    String cpp = """
        #include "pump_state_classifier.h"
        #include <cstdio>
        int main() {
            const float x[PUMP_STATE_CLASSIFIER_FEATURE_COUNT] = {1, 0, 0, 33};
            float p[PUMP_STATE_CLASSIFIER_CLASS_COUNT];
            pump_state_classifier_probabilities(x, p);
            std::printf("%d %s %s %d\\n", pump_state_classifier_classify(x),
                pump_state_classifier_label(PUMP_STATE_CLASSIFIER_CLASS_WORN),
                pump_state_classifier_feature_name(PUMP_STATE_CLASSIFIER_FEATURE_ZONE),
                PUMP_STATE_CLASSIFIER_FEATURE_COUNT);
            return 0;
        }
        """;
    Gcc.write(dir, source.headerName(), source.headerText(), source.sourceName(),
        source.sourceText(), "caller.cpp", cpp);
    Gcc.gcc(dir, Gcc.STRICT, List.of(source.sourceName()), "classifier.o").orFail("gcc");
    Gcc.run(dir, List.of("g++", "-std=c++11", "-Wall", "-Wextra", "-Wpedantic", "-Werror",
        "caller.cpp", "classifier.o", "-o", "caller")).orFail("g++");
    Gcc.Result run = Gcc.run(dir, List.of(dir.resolve("caller").toString())).orFail("caller");
    int expected = tree.predict(new float[] {1, 0, 0, 33});
    assertThat(run.output()).isEqualTo(expected + " worn zone 4\n");
  }

  /**
   * The object holds no writable data (.data and .bss empty: tables are static const) and, with
   * the optimizer on, references no symbol it does not define: no libc call (gcc may turn loops
   * into memset calls, so this is checked on the object, not the text).
   */
  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE"})
  void objectHasNoWritableDataAndNoExternalCalls(Layout layout) throws IOException {
    for (InputKind kind : List.of(InputKind.FLOAT, InputKind.INT)) {
      CEmitOptions options = CEmitOptions.of("plain").withLayout(layout).withInputKind(kind)
          .withProbabilities(true);
      CSource source = CEmitter.emit(HandTrees.mixed(), options, HeaderInfo.none());
      Gcc.write(dir, source.headerName(), source.headerText(), source.sourceName(),
          source.sourceText());
      Gcc.gcc(dir, Gcc.STRICT, List.of(source.sourceName()), "plain.o").orFail("gcc");
      assertThat(Gcc.run(dir, List.of("nm", "-u", "plain.o")).orFail("nm").output()).isEmpty();
      String sections = Gcc.run(dir, List.of("size", "-A", "plain.o")).orFail("size").output();
      // .data.rel.ro holds the label pointers: written once by the loader, read-only after.
      assertThat(sections.lines().map(l -> l.trim().split("\\s+"))
          .filter(l -> l[0].equals(".data") || l[0].equals(".bss")).map(l -> l[1]))
          .allMatch("0"::equals);
    }
  }

  /** What the issue asks of the text: includes, comments, names, no float in the header. */
  @Test
  void textKeepsToTheRules() {
    for (DecisionTree tree : HandTrees.all()) {
      for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
        CEmitOptions options = CEmitOptions.of("pump_state_classifier").withLayout(layout)
            .withProbabilities(true);
        CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
        assertThat(source.headerName()).isEqualTo("pump_state_classifier.h");
        assertThat(source.sourceName()).isEqualTo("pump_state_classifier.c");
        String all = source.headerText() + source.sourceText();
        assertThat(all.chars()).allMatch(c -> c == '\n' || (c >= 0x20 && c < 0x7f));
        assertThat(all).doesNotContain("//");
        assertThat(all.lines().filter(l -> l.startsWith("#include")))
            .containsExactly("#include <stdint.h>", "#include \"pump_state_classifier.h\"");
        String headerCode = source.headerText().replaceAll("(?s)/\\*.*?\\*/", "");
        assertThat(headerCode).doesNotContainPattern("[0-9]\\.|0x[0-9a-f.]*p");
        assertThat(headerCode).contains("extern \"C\"");
        assertThat(source.headerText()).contains("PUMP_STATE_CLASSIFIER_FEATURE_COUNT ",
            "PUMP_STATE_CLASSIFIER_CLASS_COUNT 3", "pump_state_classifier_classify(",
            "pump_state_classifier_probabilities(", "pump_state_classifier_label(",
            "pump_state_classifier_feature_name(", "-ffast-math", "safety analysis");
        assertThat(source.sourceText()).doesNotContain("static float", "static int32_t",
            "static uint");
        assertThat(CEmitter.emit(tree, options, HeaderInfo.none())).isEqualTo(source);
      }
    }
    CSource mixed = CEmitter.emit(HandTrees.mixed(), CEmitOptions.of("pump"), HeaderInfo.none());
    assertThat(mixed.headerText()).contains("#define PUMP_FEATURE_SPEED 0",
        "#define PUMP_FEATURE_ZONE 3", "#define PUMP_CLASS_NORMAL 0", "#define PUMP_CLASS_BROKEN 2",
        "2: mode (categorical codes: 0 = auto, 1 = boost");
    // 0.1f beside its exact spelling: 0x1.99999ap-4 is 13421773 * 2^-27 (worked by hand).
    assertThat(mixed.sourceText()).contains("0x1.99999ap-4f /* 0.1 */");
    assertThat(mixed.sourceText()).doesNotContain("0.1f");
    for (Split split : HandTrees.mixed().splitsPreOrder()) {
      if (split instanceof NumericSplit n && Float.isFinite(n.threshold())) {
        assertThat(mixed.sourceText()).contains(CText.hexFloat(n.threshold()));
      }
    }
  }

  /**
   * Cortex-M builds where a cross gcc is installed: freestanding, the strict flags at -Os. With
   * the FPU (Cortex-M4F) the object references nothing; without it (Cortex-M0) only the float
   * helpers of libgcc, whose names the ARM run-time ABI fixes (RTABI: __aeabi_fcmp*, __aeabi_f2uiz,
   * __aeabi_ui2f). Neither has writable data.
   */
  @Test
  void buildsForCortexMWithoutLibc() throws IOException {
    assumeTrue(toolExists("arm-none-eabi-gcc"), "arm-none-eabi-gcc is not installed");
    List<List<String>> cpus = List.of(
        List.of("-mcpu=cortex-m4", "-mthumb", "-mfloat-abi=hard", "-mfpu=fpv4-sp-d16"),
        List.of("-mcpu=cortex-m0", "-mthumb"));
    for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
      CSource source = CEmitter.emit(HandTrees.mixed(), CEmitOptions.of("pump")
          .withLayout(layout).withProbabilities(true), HeaderInfo.none());
      Gcc.write(dir, source.headerName(), source.headerText(), source.sourceName(),
          source.sourceText());
      for (List<String> cpu : cpus) {
        List<String> command = new ArrayList<>(List.of("arm-none-eabi-gcc"));
        command.addAll(cpu);
        command.add("-ffreestanding");
        command.addAll(Gcc.STRICT.stream().map(f -> f.equals("-O2") ? "-Os" : f).toList());
        command.addAll(List.of("-c", source.sourceName(), "-o", "pump.o"));
        Gcc.run(dir, command).orFail(String.join(" ", command));
        List<String> undefined = Gcc.run(dir, List.of("arm-none-eabi-nm", "-u", "pump.o"))
            .orFail("nm").output().lines().map(l -> l.trim().substring(2)).toList();
        if (cpu.contains("-mfloat-abi=hard")) {
          assertThat(undefined).isEmpty();
        } else {
          assertThat(undefined).allMatch(name -> name.startsWith("__aeabi_f")
              || name.startsWith("__aeabi_ui2f"));
        }
        String sections = Gcc.run(dir, List.of("arm-none-eabi-size", "-A", "pump.o"))
            .orFail("size").output();
        assertThat(sections.lines().map(l -> l.trim().split("\\s+"))
            .filter(l -> l[0].equals(".data") || l[0].equals(".bss")).map(l -> l[1]))
            .allMatch("0"::equals);
      }
    }
  }

  private static boolean toolExists(String tool) {
    try {
      return Gcc.run(Path.of("."), List.of(tool, "--version")).exit() == 0;
    } catch (IOException e) {
      return false;
    }
  }
}
