package dev.splitwright.onchip;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CEmitter;
import dev.splitwright.cgen.CSource;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.data.Dataset;
import dev.splitwright.demo.DemoFiles;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The README's Cortex-M table: flash, instructions per classification and proof counts of the
 * pump sample's tree and a depth-8 gesture tree, on the M0+ and the M4F at -Os. A measurement,
 * not part of the normal build: run with {@code -Donchip.measure=true}; every proof must pass.
 */
class OnChipMeasurement {
  @TempDir
  Path dir;

  @Test
  void measure() throws Exception {
    assumeTrue(Boolean.getBoolean("onchip.measure"), "run with -Donchip.measure=true");
    CortexMToolchain arm = OnChipFixtures.arm();
    DecisionTree pump = OnChipFixtures.pumpSample(dir);
    Dataset pumpData = OnChipFixtures.load(DemoFiles.pump(), "state");
    Dataset gestureData = OnChipFixtures.load(DemoFiles.of("gesture-band"), "gesture");
    DecisionTree gesture = CartTrainer.train(gestureData,
        TrainingOptions.builder().maxDepth(8).build());
    OnChipProver prover = new OnChipProver(arm, OnChipFixtures.RUN_LIMIT);
    StringBuilder table = new StringBuilder(
        "| tree | core | layout | input | object B | B/leaf | with strings B | linked B "
            + "| helpers B | instr worst | instr mean | inputs proved | mismatches | qemu s |\n"
            + "|---|---|---|---|---|---|---|---|---|---|---|---|---|---|\n");
    for (Object[] t : new Object[][] {{"pump sample", pump, pumpData},
        {"gesture depth 8", gesture, gestureData}}) {
      DecisionTree tree = (DecisionTree) t[1];
      Dataset data = (Dataset) t[2];
      table.append("<!-- ").append(t[0]).append(": depth ").append(tree.depth())
          .append(", leaves ").append(tree.leafCount()).append(" -->\n");
      for (CortexMProfile core : List.of(CortexMProfile.CORTEX_M0PLUS,
          CortexMProfile.CORTEX_M4F)) {
        for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
          for (String input : List.of("float", "float bits", "int32")) {
            InputKind kind = input.equals("int32") ? InputKind.INT : InputKind.FLOAT;
            CEmitOptions bare = CEmitOptions.of("clf").withLayout(layout).withInputKind(kind)
                .withBare(true).withCompareBits(input.equals("float bits"));
            CSource source = CEmitter.emit(tree, bare, HeaderInfo.none());
            FlashCost cost = CoreFlash.measure(arm, source, bare, core, List.of("-Os"),
                OnChipFixtures.BUILD_LIMIT);
            CEmitOptions full = bare.withBare(false);
            FlashCost withStrings = CoreFlash.measure(arm,
                CEmitter.emit(tree, full, HeaderInfo.none()), full, core, List.of("-Os"),
                OnChipFixtures.BUILD_LIMIT);
            ProofInputs inputs = kind == InputKind.FLOAT ? OnChipFixtures.floatInputs(tree, data)
                : OnChipFixtures.intInputs(tree, data);
            OnChipProof proof = prover.prove(tree, source, bare, inputs, core,
                OnChipFixtures.STRICT, true);
            assertThat(proof.mismatches()).as(proof.verdict()).isZero();
            InstructionCounts n = proof.instructions().orElseThrow();
            table.append(String.format(Locale.ROOT,
                "| %s | %s | %s | %s | %d | %.1f | %d | %d | %d | %d | %.1f | %d | %d | %.1f |%n",
                t[0], core.id(), layout.name().toLowerCase(Locale.ROOT),
                input, cost.objectFlashBytes(),
                (double) cost.objectFlashBytes() / tree.leafCount(),
                withStrings.objectFlashBytes(), cost.linkedCost(), cost.helperBytes(),
                n.worst(), n.mean(), proof.inputsChecked(), proof.mismatches(),
                proof.emulatorTime().toMillis() / 1000.0));
            if (!cost.helpers().isEmpty()) {
              table.append("<!-- helpers: ").append(String.join(" ", cost.helpers()))
                  .append(" -->\n");
            }
          }
        }
      }
    }
    table.append("<!-- ").append(OnChipFixtures.STRICT).append("; ")
        .append(prover.prove(pump, CEmitter.emit(pump, CEmitOptions.of("clf"),
            HeaderInfo.none()), CEmitOptions.of("clf"), OnChipFixtures.floatInputs(pump,
            pumpData), CortexMProfile.CORTEX_M0PLUS, OnChipFixtures.STRICT, false)
            .emulatorVersion()).append(" -->\n");
    System.out.println(table);
  }
}
