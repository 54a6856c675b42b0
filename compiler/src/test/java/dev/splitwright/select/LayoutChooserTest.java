package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.check.CompilationException;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.Layout;
import dev.splitwright.emit.RandomTrees;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.verify.HotSpotJitTest;
import dev.splitwright.verify.Verifier;
import java.util.List;
import org.junit.jupiter.api.Test;

class LayoutChooserTest {
  private static final InMemoryCompiler JAVAC = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);

  @Test
  void smallestKeepsBranchesForASmallTreeAndTableForADeepOne() throws Exception {
    EmitOptions options = EmitOptions.builder("choose", "Pick").layout(Layout.SMALLEST).build();

    LayoutChoice small = LayoutChooser.resolve(HotSpotJitTest.levelTree(3, 1), options,
        HeaderInfo.none(), JAVAC);
    LayoutChoice deep = LayoutChooser.resolve(HotSpotJitTest.levelTree(11, 1), options,
        HeaderInfo.none(), JAVAC);

    // The table's decoder and loop cost about a kilobyte; nested ifs cost bytes per split.
    assertThat(small.options().layout()).isEqualTo(Layout.BRANCHES);
    assertThat(small.classFileBytes().get(Layout.BRANCHES))
        .isLessThanOrEqualTo(small.classFileBytes().get(Layout.TABLE));
    assertThat(deep.options().layout()).isEqualTo(Layout.TABLE);
    assertThat(deep.classFileBytes().get(Layout.TABLE))
        .isLessThan(deep.classFileBytes().get(Layout.BRANCHES));
    for (LayoutChoice choice : List.of(small, deep)) {
      assertThat(choice.classes().size("choose.Pick"))
          .isEqualTo(choice.classFileBytes().get(choice.options().layout()));
      assertThat(choice.source().layout()).isEqualTo(choice.options().layout());
    }
    assertThat(deep.describe()).matches("table: \\d+ bytes \\(branches \\d+ bytes\\)");
  }

  @Test
  void aTreeTooBigForBranchesIsAnOptionErrorAndSmallestFallsBackToTable() throws Exception {
    DecisionTree tree = RandomTrees.distinctThresholds(16);
    EmitOptions branches = EmitOptions.builder("choose", "Big").build();

    assertThatThrownBy(() -> LayoutChooser.resolve(tree, branches, HeaderInfo.none(), JAVAC))
        .isInstanceOf(InputException.class)
        .hasMessageStartingWith("option --layout: the branches layout of this tree needs up to ")
        .hasMessageEndingWith("; use --layout table, whose constants do not grow with the tree");

    LayoutChoice choice = LayoutChooser.resolve(tree,
        branches.toBuilder().layout(Layout.SMALLEST).build(), HeaderInfo.none(), JAVAC);
    assertThat(choice.options().layout()).isEqualTo(Layout.TABLE);
    assertThat(choice.describe()).contains("branches not possible");
  }

  @Test
  void javacReportsTooManyConstantsPastTheClassFileLimit() {
    // 33,000 int constants past sipush range, each a CONSTANT_Integer plus its field name: about
    // 66,000 entries, over the 65,535 a u2 constant_pool_count allows (JVMS §4.1).
    StringBuilder source = new StringBuilder("package pool;\n\npublic final class Full {\n");
    for (int i = 0; i < 33_000; i++) {
      source.append("  public static final int C").append(i).append(" = ")
          .append(100_000 + i).append(";\n");
    }
    source.append("}\n");

    assertThatThrownBy(() -> JAVAC.compileOne("pool.Full", source.toString()))
        .isInstanceOfSatisfying(CompilationException.class,
            e -> assertThat(LayoutChooser.tooManyConstants(e)).as(e.getMessage()).isTrue());
  }
}
