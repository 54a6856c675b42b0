package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.SourceFile;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.DecisionTree;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import javax.tools.Diagnostic;
import javax.tools.DiagnosticCollector;
import javax.tools.DocumentationTool;
import javax.tools.JavaFileObject;
import javax.tools.StandardJavaFileManager;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every emitted class, for every combination of the options that shape its comments (bare or not,
 * layout, input type, named arguments, probabilities, small method caps, categorical features of
 * every size class, names full of HTML and Javadoc syntax), passes {@code javac -Xdoclint:all
 * -Werror} (all checks, down to private members) and the JDK's {@code javadoc} without a warning.
 */
class EmittedJavadocTest {
  private static final List<String> DOCLINT =
      List.of("--release", "17", "-Xlint:all", "-Xdoclint:all", "-Werror");

  /** Names with HTML, entity and Javadoc tag syntax, and a comment end. */
  private static final Schema SCHEMA = new Schema(List.of(
      Feature.numeric("temp <C> & \"rate\""),
      Feature.numeric("@param */ {@link x}"),
      Feature.categorical("mode", List.of("on", "off", "<unknown> & @other")),
      Feature.categorical("code70", names("k", 70)),
      Feature.numeric("plain"),
      Feature.categorical("id300", names("id", 300))),
      "state <&>", List.of("ok", "fault & stop", "@return", "<none>"));

  private static List<String> names(String prefix, int n) {
    List<String> out = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      out.add(prefix + i);
    }
    return out;
  }

  private static final HeaderInfo HEADER = new HeaderInfo("pump <1> & {@code}.csv", "ab12",
      "splitwright compile --budget 2kb @args", List.of("validation accuracy 0.9 <b> & @x"));

  @Test
  void everyOptionCombinationPassesDoclintAndJavadoc(@TempDir Path dir) throws Exception {
    List<EmittedSource> sources = new ArrayList<>();
    int i = 0;
    for (boolean bare : List.of(false, true)) {
      for (Layout layout : List.of(Layout.BRANCHES, Layout.TABLE)) {
        for (InputKind input : InputKind.values()) {
          for (boolean named : List.of(false, true)) {
            for (boolean probabilities : List.of(false, true)) {
              DecisionTree tree = RandomTrees.tree(new SplittableRandom(i), SCHEMA, 7, 120);
              EmitOptions options = EmitOptions.builder("doc.check", "Doc" + i)
                  .bare(bare).layout(layout).inputKind(input).namedArgs(named)
                  .probabilities(probabilities)
                  // Every other class with the smallest cap, so helper methods are documented too.
                  .maxMethodBytes(i % 2 == 0 ? 256 : EmitOptions.DEFAULT_MAX_METHOD_BYTES)
                  .build();
              sources.add(JavaEmitter.emit(tree, options, HEADER));
              i++;
            }
          }
        }
      }
    }
    assertThat(sources.stream().filter(s -> s.source().contains(" node"))).isNotEmpty();

    // javac -Xdoclint:all checks every access level; -Werror turns any finding into an error.
    try (InMemoryCompiler javac = InMemoryCompiler.create(DOCLINT)) {
      javac.compile(sources.stream()
          .map(s -> new SourceFile(s.qualifiedName(), s.source())).toList());
    }

    assertThat(javadoc(sources, dir)).isEmpty();
  }

  /** Runs the JDK's javadoc on the sources; returns every diagnostic that is not a note. */
  private static List<String> javadoc(List<EmittedSource> sources, Path dir) throws IOException {
    List<Path> files = new ArrayList<>();
    for (EmittedSource source : sources) {
      Path file = dir.resolve("src").resolve(source.relativePath());
      Files.createDirectories(file.getParent());
      Files.writeString(file, source.source(), StandardCharsets.UTF_8);
      files.add(file);
    }
    DocumentationTool tool = ToolProvider.getSystemDocumentationTool();
    DiagnosticCollector<JavaFileObject> diagnostics = new DiagnosticCollector<>();
    StringWriter out = new StringWriter();
    try (StandardJavaFileManager fileManager =
        tool.getStandardFileManager(null, Locale.ROOT, StandardCharsets.UTF_8)) {
      boolean ok = tool.getTask(out, fileManager, diagnostics, null,
          List.of("-quiet", "-Xdoclint:all", "-d", dir.resolve("api").toString()),
          fileManager.getJavaFileObjectsFromPaths(files)).call();
      List<String> problems = new ArrayList<>();
      for (Diagnostic<? extends JavaFileObject> d : diagnostics.getDiagnostics()) {
        if (d.getKind() != Diagnostic.Kind.NOTE) {
          problems.add(d.getKind() + " " + (d.getSource() == null ? "" : d.getSource().getName())
              + ":" + d.getLineNumber() + ": " + d.getMessage(Locale.ROOT));
        }
      }
      if (!ok) {
        problems.add("javadoc failed: " + out);
      }
      return problems;
    }
  }
}
