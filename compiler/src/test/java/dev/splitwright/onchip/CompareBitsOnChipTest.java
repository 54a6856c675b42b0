package dev.splitwright.onchip;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CEmitter;
import dev.splitwright.cgen.CSource;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.data.Dataset;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The pump sample with float input compared as bit patterns, on the emulated Cortex-M0+: proved
 * equal to the model with no soft-float helper linked. Skipped without the ARM tools.
 */
class CompareBitsOnChipTest {
  @TempDir
  static Path dir;

  private static CortexMToolchain arm;
  private static DecisionTree tree;
  private static Dataset data;

  @BeforeAll
  static void setUp() throws Exception {
    arm = OnChipFixtures.arm();
    tree = OnChipFixtures.pumpSample(dir);
    data = OnChipFixtures.load(DemoFiles.pump(), "state");
  }

  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE"})
  void provedOnTheM0PlusWithoutSoftFloatHelpers(Layout layout) throws Exception {
    CEmitOptions bits = CEmitOptions.of("pump").withLayout(layout).withBare(true)
        .withCompareBits(true);
    CSource source = CEmitter.emit(tree, bits, HeaderInfo.none());
    ProofInputs inputs = OnChipFixtures.floatInputs(tree, data);

    OnChipProof proof = new OnChipProver(arm, OnChipFixtures.RUN_LIMIT).prove(tree, source, bits,
        inputs, CortexMProfile.CORTEX_M0PLUS, OnChipFixtures.STRICT, false);
    assertThat(proof.mismatches()).as(proof.verdict()).isZero();
    assertThat(proof.inputsChecked()).isEqualTo(inputs.size()).isGreaterThan(5000);

    FlashCost withBits = CoreFlash.measure(arm, source, bits, CortexMProfile.CORTEX_M0PLUS,
        List.of("-Os"), OnChipFixtures.BUILD_LIMIT);
    CEmitOptions floats = bits.withCompareBits(false);
    FlashCost withFloats = CoreFlash.measure(arm, CEmitter.emit(tree, floats,
        HeaderInfo.none()), floats, CortexMProfile.CORTEX_M0PLUS, List.of("-Os"),
        OnChipFixtures.BUILD_LIMIT);
    assertThat(withBits.helpers()).isEmpty();
    assertThat(withFloats.helpers()).isNotEmpty();
    assertThat(withBits.linkedCost()).isLessThan(withFloats.linkedCost());
  }

  /**
   * Without the NaN test, a NaN's bits read as a key: with the sign clear it lies above +Infinity
   * and goes right, with the sign set below -Infinity and goes left, whatever the split learned.
   */
  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE"})
  void withoutTheNanTestTheProofFails(Layout layout) throws Exception {
    CEmitOptions bits = CEmitOptions.of("pump").withLayout(layout).withCompareBits(true);
    CSource source = CEmitter.emit(tree, bits, HeaderInfo.none());
    String nanTest = "    if ((u.bits & 0x7fffffffu) > 0x7f800000u) {\n"
        + "        return missing_left;\n    }\n";
    assertThat(source.sourceText()).contains(nanTest);
    CSource altered = new CSource(source.headerName(), source.headerText(), source.sourceName(),
        source.sourceText().replace(nanTest, "    (void)missing_left;\n"));

    OnChipProof proof = new OnChipProver(arm, OnChipFixtures.RUN_LIMIT).prove(tree, altered,
        bits, OnChipFixtures.floatInputs(tree, data), CortexMProfile.CORTEX_M0PLUS,
        OnChipFixtures.STRICT, false);
    assertThat(proof.mismatches()).as(proof.verdict()).isPositive();
    assertThat(proof.firstMismatches()).anyMatch(text -> text.contains("NaN"));
  }
}
