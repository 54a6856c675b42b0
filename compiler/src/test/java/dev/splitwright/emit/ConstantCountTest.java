package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import dev.splitwright.check.ClassFileInfo;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.SourceFile;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.verify.Verifier;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * A class file holds at most 65,534 constants ({@code constant_pool_count} is a u2, JVMS §4.1).
 * The branches layout needs one per distinct threshold, so the emitter bounds the count first and
 * refuses with a pointer to the table layout, whose pool does not grow with the tree.
 */
class ConstantCountTest {
  private static final InMemoryCompiler JAVAC = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);

  @Test
  void boundIsNeverBelowTheConstantPoolJavacWrites() throws Exception {
    SplittableRandom random = new SplittableRandom(77);
    List<DecisionTree> trees = new ArrayList<>();
    List<EmitOptions> options = new ArrayList<>();
    List<SourceFile> sources = new ArrayList<>();
    for (int i = 0; i < 40; i++) {
      RandomTrees.Shape shape = RandomTrees.shape(random);
      DecisionTree tree = RandomTrees.tree(random, new RandomTrees.Shape(shape.maxDepth(),
          Math.min(shape.maxNodes(), 2000), shape.features(), shape.classes()));
      EmitOptions o = EmitOptions.builder("pool", "Tree" + i)
          .inputKind(InputKind.values()[i % 3])
          .probabilities(i % 4 == 0)
          .namedArgs(i % 5 == 0 && tree.schema().featureCount() <= EmitOptions.MAX_NAMED_ARGS)
          .maxMethodBytes(i % 2 == 0 ? 8000 : 400)
          .build();
      trees.add(tree);
      options.add(o);
      sources.add(new SourceFile(o.qualifiedName(),
          JavaEmitter.emit(tree, o, HeaderInfo.none()).source()));
    }
    CompiledClasses compiled = JAVAC.compile(sources);
    for (int i = 0; i < trees.size(); i++) {
      int actual = ClassFileInfo.parse(compiled.bytes(options.get(i).qualifiedName()))
          .constantPoolCount();
      assertThat(BranchesWriter.constantBound(trees.get(i), options.get(i)))
          .as("tree %d", i).isGreaterThanOrEqualTo(actual);
    }
  }

  @Test
  void branchesRefusesMoreDistinctThresholdsThanAClassFileHoldsAndTableTakesThem()
      throws Exception {
    // 65,535 splits, each with a threshold of its own: one float constant each.
    DecisionTree tree = RandomTrees.distinctThresholds(16);
    assertThat(tree.internalNodeCount()).isEqualTo(65_535);

    EmitOptions branches = EmitOptions.builder("pool", "Wide").build();
    assertThatThrownBy(() -> JavaEmitter.emit(tree, branches, HeaderInfo.none()))
        .isInstanceOfSatisfying(EmitLimitException.class, e -> {
          assertThat(e.option()).isEqualTo("layout");
          assertThat(e.problem()).contains("over the limit of 65535");
          assertThat(e.remedy()).contains("--layout table");
        });

    EmitOptions table = branches.toBuilder().layout(Layout.TABLE).build();
    EmittedSource source = JavaEmitter.emit(tree, table, HeaderInfo.none());
    CompiledClasses compiled = JAVAC.compileOne(source.qualifiedName(), source.source());
    ClassFileInfo info = ClassFileInfo.parse(compiled.bytes(source.qualifiedName()));
    assertThat(info.constantPoolCount()).isLessThan(200);
  }
}
