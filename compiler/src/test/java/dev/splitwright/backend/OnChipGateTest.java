package dev.splitwright.backend;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CSource;
import dev.splitwright.cgen.CTextAccess;
import dev.splitwright.check.CCompiler;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.Layout;
import dev.splitwright.job.CompileJob;
import dev.splitwright.job.CompileRequest;
import dev.splitwright.job.CompileResult;
import dev.splitwright.onchip.OnChipFixtures;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Optional;
import java.util.function.UnaryOperator;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The on-chip proof is a gate like the host check: an image that answers differently from the
 * model fails the run and nothing is written. The difference is injected through {@link
 * OnChipStage}'s test seam, which builds the images from an altered source while the host check
 * sees the emitted one. Skipped where arm-none-eabi-gcc or qemu-system-arm is missing.
 */
class OnChipGateTest {
  /** The first comparison in the branches layout: the root's threshold, in C99 hex notation. */
  private static final Pattern HEX_FLOAT = Pattern.compile("0x[0-9a-f](\\.[0-9a-f]*)?p[-+]\\d+f");

  @TempDir Path out;

  private CompileResult run(UnaryOperator<CSource> chipSource) throws Exception {
    return run(chipSource, Duration.ofMinutes(5));
  }

  private CompileResult run(UnaryOperator<CSource> chipSource, Duration runLimit)
      throws Exception {
    CortexMToolchain arm = OnChipFixtures.arm();
    EmitOptions emit = EmitOptions.builder("", "PumpState").layout(Layout.BRANCHES).build();
    CompileRequest request = new CompileRequest(DemoFiles.pump(), Optional.empty(),
        Optional.empty(), LoadOptions.builder().target("state").build(),
        new double[] {0.6, 0.2, 0.2}, 1, TrainingOptions.builder().maxDepth(4).build(), emit,
        out, Optional.empty(), "test");
    OnChipStage stage = new OnChipStage(arm, List.of(CortexMProfile.CORTEX_M0PLUS),
        List.of("-Os"), runLimit, chipSource);
    CLanguage c = new CLanguage(CEmitOptions.of("pump_state"), false,
        CCompiler.find("cc", CLanguage.VERIFY_FLAGS, CLanguage.TIMEOUT),
        CCompiler.find("cc", List.of("-Os"), CLanguage.TIMEOUT), Optional.of(stage));
    return new CompileJob(Verifier.create(), c).run(request);
  }

  @Test
  void anImageWithAThresholdOneUlpOffFailsTheRunAndWritesNothing() throws Exception {
    CompileResult result = run(OnChipGateTest::moveFirstThresholdOneUlp);

    VerificationResult v = result.verification();
    assertThat(v.passed()).isFalse();
    assertThat(v.mismatches()).isPositive();
    assertThat(v.firstMismatches()).isNotEmpty()
        .allMatch(m -> m.startsWith("on cortex-m0plus (mps2-an385): row "));
    assertThat(v.verdict()).contains("disagree with the model");
    assertThat(result.written()).isEmpty();
    try (Stream<Path> files = Files.list(out)) {
      assertThat(files).isEmpty();
    }
  }

  @Test
  void theSeamIsTheOnlyDifference() throws Exception {
    CompileResult result = run(UnaryOperator.identity());

    assertThat(result.verification().passed()).as(result.verification().verdict()).isTrue();
    assertThat(result.report().verification().onChip()).hasSize(1);
    assertThat(result.report().verification().onChip().get(0).inputsChecked())
        .isEqualTo(result.verification().inputsChecked());
    assertThat(result.written()).isNotEmpty();
  }

  @Test
  void anImageThatNeverFinishesIsStoppedAndTheRunWritesNothing() {
    String head = "int pump_state_classify(const float x[PUMP_STATE_FEATURE_COUNT])\n{\n";
    UnaryOperator<CSource> spin = source -> {
      assertThat(source.sourceText()).contains(head);
      return new CSource(source.headerName(), source.headerText(), source.sourceName(),
          source.sourceText().replace(head, head + "    for (;;) {\n    }\n"));
    };

    assertThatThrownBy(() -> run(spin, Duration.ofSeconds(5)))
        .isInstanceOf(UnfinishedProofException.class)
        .hasMessageStartingWith("the proof on cortex-m0plus did not finish: ")
        .hasMessageContaining("within 5000 ms");
    assertThat(out).isEmptyDirectory();
  }

  /**
   * The same files with the first threshold moved up one ulp: the boundary probes hold each
   * threshold and its IEEE 754 neighbours, so the next float up now goes the other way.
   */
  static CSource moveFirstThresholdOneUlp(CSource source) {
    Matcher m = HEX_FLOAT.matcher(source.sourceText());
    assertThat(m.find()).as("a threshold in\n%s", source.sourceText()).isTrue();
    float threshold = Float.parseFloat(m.group());
    assertThat(CTextAccess.hexFloat(threshold)).isEqualTo(m.group());
    String moved = CTextAccess.hexFloat(Math.nextUp(threshold));
    String text = source.sourceText();
    return new CSource(source.headerName(), source.headerText(), source.sourceName(),
        text.substring(0, m.start()) + moved + text.substring(m.end()));
  }
}
