package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.SourceFile;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.emit.RandomEnsembles;
import dev.splitwright.model.TreeEnsemble;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Random ensembles (both kinds, every layout, flat for every other one, float, double and int
 * input, named arguments, probabilities, categorical features with missing codes, small method
 * caps) emitted as Java must
 * agree with {@link TreeEnsemble} on every input the verifier makes: boundary probes of every
 * split of every tree, random inputs, int probes; with probabilities bit for bit. The reference is
 * IEEE 754 binary32 addition and division (JLS 15.4, JEP 306: Java float arithmetic is strict).
 */
class EnsemblePropertyTest {
  static final int ENSEMBLES = Integer.getInteger("splitwright.propertyEnsembles", 300);
  private static final int PER_BATCH = 20;
  private static final long SEED = 0xE45E_3B1EL;

  private record Case(TreeEnsemble ensemble, EmitOptions options, EmittedSource source,
      long seed) {}

  static EmitOptions options(SplittableRandom random, TreeEnsemble ensemble, String name,
      Layout layout) {
    int kind = random.nextInt(10);
    return EmitOptions.builder("ens", name)
        .layout(layout)
        .inputKind(kind < 6 ? InputKind.FLOAT : kind < 8 ? InputKind.DOUBLE : InputKind.INT)
        .namedArgs(random.nextInt(4) == 0)
        .probabilities(random.nextInt(3) > 0)
        .bare(random.nextInt(4) == 0)
        .maxMethodBytes(random.nextInt(4) == 0 ? 256 + random.nextInt(512) : 8000)
        .build();
  }

  @Test
  void randomEnsemblesAgreeWithTheirModelInEveryLayout() throws Exception {
    InMemoryCompiler compiler = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);
    // Every fifth batch also runs javac's Javadoc checks, down to private members.
    List<String> doclintOptions = new ArrayList<>(Verifier.JAVAC_OPTIONS);
    doclintOptions.add("-Xdoclint:all");
    InMemoryCompiler doclint = InMemoryCompiler.create(doclintOptions);
    Verifier verifier = new Verifier(compiler).withRandomProbes(200);
    SplittableRandom random = new SplittableRandom(SEED);
    List<String> failures = new ArrayList<>();
    long inputs = 0;
    int classes = 0;
    int[] kinds = new int[2];
    int withProbabilities = 0;
    for (int first = 0; first < ENSEMBLES; first += PER_BATCH) {
      List<Case> batch = new ArrayList<>();
      for (int i = first; i < Math.min(ENSEMBLES, first + PER_BATCH); i++) {
        TreeEnsemble ensemble = RandomEnsembles.ensemble(random);
        kinds[ensemble.kind().ordinal()]++;
        // Branches and table for every ensemble; flat for every other one, to keep the time.
        List<Layout> layouts = i % 2 == 0 ? List.of(Layout.BRANCHES, Layout.TABLE, Layout.FLAT)
            : List.of(Layout.BRANCHES, Layout.TABLE);
        for (Layout layout : layouts) {
          EmitOptions o = options(random, ensemble, "Ensemble" + i + "_" + layout.optionName(),
              layout);
          withProbabilities += o.probabilities() ? 1 : 0;
          batch.add(new Case(ensemble, o, JavaEmitter.emit(ensemble, o, HeaderInfo.none()), i));
        }
      }
      boolean checkDocs = first % (5 * PER_BATCH) == 0;
      CompiledClasses compiled = (checkDocs ? doclint : compiler).compile(batch.stream()
          .map(c -> new SourceFile(c.source().qualifiedName(), c.source().source()))
          .toList());
      for (Case c : batch) {
        VerificationResult result = verifier.check(c.ensemble(), compiled, c.source(),
            c.options(), List.of(), c.seed());
        inputs += result.inputsChecked();
        classes++;
        if (!result.passed()) {
          failures.add(c.source().qualifiedName() + " (" + describe(c) + "): "
              + result.verdict());
        }
      }
    }
    System.out.printf(Locale.ROOT, "EnsemblePropertyTest: %d ensembles (%d forests, %d boosted), "
        + "%d classes (%d with probabilities), %d inputs%n", ENSEMBLES, kinds[0], kinds[1],
        classes, withProbabilities, inputs);
    assertThat(failures).isEmpty();
    // Two layouts for each ensemble, flat too for the even-numbered ones.
    assertThat(classes).isEqualTo(2 * ENSEMBLES + (ENSEMBLES + 1) / 2);
    assertThat(kinds[0]).isPositive();
    assertThat(kinds[1]).isPositive();
  }

  private static String describe(Case c) {
    EmitOptions o = c.options();
    return String.format(Locale.ROOT, "%s, %s, %s input%s%s, cap %d, %d trees",
        c.ensemble().kind().fileName(), o.layout().optionName(), o.inputKind().optionName(),
        o.namedArgs() ? ", named" : "", o.probabilities() ? ", probabilities" : "",
        o.maxMethodBytes(), c.ensemble().treeCount());
  }
}
