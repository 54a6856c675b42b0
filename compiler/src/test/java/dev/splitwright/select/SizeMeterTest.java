package dev.splitwright.select;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.data.Dataset;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.verify.Verifier;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class SizeMeterTest {
  private static InMemoryCompiler compiler;
  private static List<DistinctTree> candidates;

  @BeforeAll
  static void setUp() throws Exception {
    compiler = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);
    Dataset train = TestData.split(TestData.pump()).train();
    candidates = CandidateGenerator.generate(train, SearchSettings.builder(1000).maxDepth(5)
        .minLeafs(List.of(1, 10)).build(), SearchProgress.none()).trees();
  }

  @AfterAll
  static void tearDown() {
    compiler.close();
  }

  @ParameterizedTest(name = "package ''{0}'', class ''{1}''")
  @CsvSource(delimiter = '|', value = {
      "com.example.pump|PumpStateClassifier",
      "|PumpStateClassifier",
      "p|C",
      "prüfstand.pumpe|Zustandsprüfer",
      "|Zustandsprüfer"})
  void batchSizesEqualTheFilesJavacWrites(String packageName, String className,
      @TempDir Path dir) throws IOException {
    EmitOptions options = EmitOptions.builder(packageName == null ? "" : packageName, className)
        .build();
    List<EmittedSource> sources = new ArrayList<>();
    for (int i = 0; i < candidates.size(); i += 7) {
      sources.add(JavaEmitter.emit((DecisionTree) candidates.get(i).model(), options,
          HeaderInfo.none()));
    }
    SizeMeter meter = new SizeMeter(compiler);

    List<Sizes> sizes = meter.measure(sources);

    // Aliased batches must weigh exactly what javac writes to disk for the real name (javac of
    // this JDK, run as a user would, with --release 17 and its default debug information).
    assertThat(meter.javacRuns()).isLessThan(sources.size());
    for (int i = 0; i < sources.size(); i++) {
      EmittedSource source = sources.get(i);
      assertThat(sizes.get(i).classFileBytes()).as("source %d", i)
          .isEqualTo(compileOnDisk(source, dir.resolve("s" + i)));
      assertThat(sizes.get(i)).isEqualTo(meter.measureAlone(source));
      assertThat(sizes.get(i).sourceBytes()).isEqualTo(source.sourceBytes());
    }
  }

  /** Compiles with the system javac into {@code dir} and returns the class file's length. */
  static int compileOnDisk(EmittedSource source, Path dir) throws IOException {
    Path src = dir.resolve("src").resolve(source.relativePath());
    Files.createDirectories(src.getParent());
    Files.writeString(src, source.source());
    Path out = dir.resolve("classes");
    int status = ToolProvider.getSystemJavaCompiler().run(null, null, null, "--release", "17",
        "-encoding", "UTF-8", "-d", out.toString(), src.toString());
    assertThat(status).isZero();
    Path classFile = out.resolve(source.qualifiedName().replace('.', '/') + ".class");
    return (int) Files.size(classFile);
  }
}
