package dev.splitwright.onchip;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CEmitter;
import dev.splitwright.cgen.CSource;
import dev.splitwright.cgen.CTextAccess;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.data.Dataset;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import dev.splitwright.model.Split;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The pump sample's C classifier built for emulated Cortex-M cores and run on qemu over the inputs
 * verification uses. Skipped where arm-none-eabi-gcc or qemu-system-arm is missing.
 */
class OnChipProverTest {
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

  private static OnChipProver prover() {
    return new OnChipProver(arm, OnChipFixtures.RUN_LIMIT);
  }

  @ParameterizedTest
  @EnumSource(value = CortexMProfile.class, names = {"CORTEX_M0PLUS", "CORTEX_M4F"})
  void pumpClassifierIsProvedOnTheEmulatedCore(CortexMProfile core) throws Exception {
    CEmitOptions options = CEmitOptions.of("pump").withProbabilities(true);
    CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
    ProofInputs inputs = OnChipFixtures.floatInputs(tree, data);
    // 3,000 data rows, the boundary probes, 2,000 random probes.
    assertThat(inputs.size()).isGreaterThan(3000 + 2000 + tree.leafCount());

    OnChipProof proof = prover().prove(tree, source, options, inputs, core,
        OnChipFixtures.STRICT, true);

    assertThat(proof.mismatches()).as(proof.verdict()).isZero();
    assertThat(proof.inputsChecked()).isEqualTo(inputs.size());
    assertThat(proof.core()).isEqualTo(core.id());
    assertThat(proof.board()).isEqualTo(core.machine());
    assertThat(proof.compilerFlags()).containsSubsequence(core.targetFlags())
        .endsWith(OnChipFixtures.STRICT.toArray(new String[0]));
    assertThat(proof.emulatorVersion()).startsWith("QEMU emulator version");
    InstructionCounts counts = proof.instructions().orElseThrow();
    assertThat(counts.calls()).isEqualTo(inputs.size());
    // At least one comparison per level of the deepest path plus call and return.
    assertThat(counts.worst()).isGreaterThan(tree.depth());
    assertThat(counts.mean()).isBetween((double) counts.best(), (double) counts.worst());
  }

  @Test
  void intInputClassifierIsProvedOnCortexM0Plus() throws Exception {
    CEmitOptions options = CEmitOptions.of("pump").withInputKind(InputKind.INT)
        .withLayout(Layout.TABLE);
    CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
    ProofInputs inputs = OnChipFixtures.intInputs(tree, data);
    OnChipProof proof = prover().prove(tree, source, options, inputs,
        CortexMProfile.CORTEX_M0PLUS, OnChipFixtures.STRICT, false);
    assertThat(proof.mismatches()).as(proof.verdict()).isZero();
    assertThat(proof.inputsChecked()).isEqualTo(inputs.size()).isGreaterThan(3000);
    assertThat(proof.instructions()).isEmpty();
  }

  /**
   * One threshold moved up by one ulp: the boundary probes hold the threshold and its neighbours,
   * so the image answers differently from the model on the next float up.
   */
  @Test
  void aThresholdOneUlpOffFailsTheProof() throws Exception {
    CEmitOptions options = CEmitOptions.of("pump");
    CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
    NumericSplit root = (NumericSplit) tree.root();
    String exact = hexFloat(root.threshold());
    String moved = hexFloat(Math.nextUp(root.threshold()));
    assertThat(source.sourceText()).contains(exact + " ");
    CSource altered = new CSource(source.headerName(), source.headerText(), source.sourceName(),
        source.sourceText().replace(exact + " ", moved + " "));

    OnChipProof proof = prover().prove(tree, altered, options,
        OnChipFixtures.floatInputs(tree, data), CortexMProfile.CORTEX_M0PLUS,
        OnChipFixtures.STRICT, false);

    assertThat(proof.passed()).isFalse();
    assertThat(proof.mismatches()).isPositive();
    assertThat(proof.firstMismatches()).hasSize(Math.min(proof.mismatches(), 5));
    assertThat(proof.verdict()).contains("class");
  }

  /**
   * A split that sends NaN left must be written {@code !(x > t)}: {@code x <= t} is false for NaN
   * (IEEE 754-2008 5.11, every ordered comparison with NaN is false), so the rewritten source sends
   * NaN right. The M0+ compares through libgcc's soft-float helpers, and the proof's NaN probes
   * must see it.
   */
  @Test
  void aNanRoutedTheWrongWayFailsTheProofOnCortexM0Plus() throws Exception {
    CEmitOptions options = CEmitOptions.of("pump");
    CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
    assertThat(missingLeftSplits(tree.root())).isPositive();
    Matcher m = Pattern.compile("!\\((x\\[\\d+\\]) > ([^)]*\\*/)\\)").matcher(source.sourceText());
    assertThat(m.find()).as("a missing-left comparison in\n%s", source.sourceText()).isTrue();
    String rewritten = m.replaceFirst(Matcher.quoteReplacement(m.group(1) + " <= " + m.group(2)));
    CSource altered = new CSource(source.headerName(), source.headerText(), source.sourceName(),
        rewritten);

    OnChipProof proof = prover().prove(tree, altered, options,
        OnChipFixtures.floatInputs(tree, data), CortexMProfile.CORTEX_M0PLUS,
        OnChipFixtures.STRICT, false);

    assertThat(proof.mismatches()).as(proof.verdict()).isPositive();
    assertThat(proof.firstMismatches()).anyMatch(text -> text.contains("NaN"));
  }

  @Test
  void anImageThatNeverFinishesIsStoppedAtTheTimeLimit() throws Exception {
    CEmitOptions options = CEmitOptions.of("pump");
    CSource source = CEmitter.emit(tree, options, HeaderInfo.none());
    String head = "int pump_classify(const float x[PUMP_FEATURE_COUNT])\n{\n";
    assertThat(source.sourceText()).contains(head);
    CSource spinning = new CSource(source.headerName(), source.headerText(), source.sourceName(),
        source.sourceText().replace(head, head + "    for (;;) {\n    }\n"));
    OnChipProver quick = new OnChipProver(arm, Duration.ofSeconds(5));
    ProofInputs inputs = ProofInputs.ofFloats(tree.schema().featureCount(),
        List.of(new float[tree.schema().featureCount()]));

    assertThatThrownBy(() -> quick.prove(tree, spinning, options, inputs,
        CortexMProfile.CORTEX_M0PLUS, List.of("-Os"), false))
        .isInstanceOf(OnChipProofException.class)
        .hasMessageContaining("did not finish")
        .hasMessageContaining("5000 ms")
        .hasMessageContaining("cortex-m0plus");
  }

  private static int missingLeftSplits(Node node) {
    if (!(node instanceof Split split)) {
      return 0;
    }
    return (split instanceof NumericSplit && split.missingLeft() ? 1 : 0)
        + missingLeftSplits(split.left()) + missingLeftSplits(split.right());
  }

  private static String hexFloat(float value) {
    return CTextAccess.hexFloat(value);
  }
}
