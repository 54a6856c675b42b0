package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatIllegalArgumentException;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.lang.reflect.Method;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.tools.Diagnostic;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class InMemoryCompilerTest {

  // The project's own build flags (root pom), so generated code is held to the same bar.
  private static final List<String> STRICT = List.of("--release", "17", "-Xlint:all", "-Werror");

  private static InMemoryCompiler compiler;

  @BeforeAll
  static void openCompiler() {
    compiler = InMemoryCompiler.create(STRICT);
  }

  @AfterAll
  static void closeCompiler() {
    compiler.close();
  }

  @Test
  void compiledStaticMethodCanBeCalledThroughReflection() throws Exception {
    CompiledClasses classes =
        compiler.compileOne(
            "demo.Adder",
            """
            package demo;

            public final class Adder {
              private Adder() {}

              public static int add(int a, int b) {
                return a + b;
              }
            }
            """);

    Method add = classes.load("demo.Adder").getMethod("add", int.class, int.class);

    assertThat(add.invoke(null, 2, 3)).isEqualTo(5);
  }

  @Test
  void typeErrorIsReportedWithPositionAndSourceExcerpt() {
    String source =
        """
        package demo;

        final class Broken {
          static int value() {
            return "seven";
          }
        }
        """;

    assertThatThrownBy(() -> compiler.compileOne("demo.Broken", source))
        .isInstanceOfSatisfying(
            CompilationException.class,
            e -> {
              // Line 5, column 12 is where "seven" starts: worked by hand from the text above.
              // Command-line javac 17, run by hand on the same file, puts its caret there too and
              // prints the same text with "String" shortened; the API keeps the full name.
              assertThat(e.diagnostics())
                  .containsExactly(
                      new CompileDiagnostic(
                          Diagnostic.Kind.ERROR,
                          "demo.Broken",
                          5,
                          12,
                          "incompatible types: java.lang.String cannot be converted to int"));
              assertThat(e)
                  .hasMessage(
                      """
                      compilation failed with 1 error
                      demo/Broken.java:5:12: error: incompatible types: java.lang.String cannot \
                      be converted to int
                           5 |     return "seven";
                             |            ^""");
            });
  }

  @Test
  void lintWarningFailsOnlyUnderWerror() throws Exception {
    String source =
        """
        package demo;

        final class Casting {
          static int twice(int x) {
            return (int) x * 2;
          }
        }
        """;

    assertThatThrownBy(() -> compiler.compileOne("demo.Casting", source))
        .isInstanceOfSatisfying(
            CompilationException.class,
            e -> {
              // The redundant cast starts at line 5, column 12 (worked by hand); command-line
              // javac 17 with the same flags, run by hand, reports "[cast] redundant cast to int"
              // there and then "error: warnings found and -Werror specified" without a position.
              assertThat(e.diagnostics())
                  .filteredOn(d -> d.kind() == Diagnostic.Kind.WARNING)
                  .singleElement()
                  .satisfies(
                      d -> {
                        assertThat(d.line()).isEqualTo(5);
                        assertThat(d.column()).isEqualTo(12);
                        assertThat(d.message()).contains("redundant cast to int");
                      });
              assertThat(e.errors())
                  .singleElement()
                  .satisfies(
                      d -> {
                        assertThat(d.hasPosition()).isFalse();
                        assertThat(d.message()).contains("-Werror");
                      });
              assertThat(e.getMessage()).contains("     5 |     return (int) x * 2;");
            });
    try (InMemoryCompiler lenient = InMemoryCompiler.create(List.of("--release", "17"))) {
      assertThat(lenient.compileOne("demo.Casting", source).names())
          .containsExactly("demo.Casting");
    }
  }

  @Test
  void batchCompilesClassesThatReferToEachOtherIncludingNestedOnes() throws Exception {
    CompiledClasses classes =
        compiler.compile(
            List.of(
                new SourceFile(
                    "demo.Threshold",
                    """
                    package demo;

                    public final class Threshold {
                      private Threshold() {}

                      public static float value() {
                        return 2.5f;
                      }
                    }
                    """),
                new SourceFile(
                    "demo.Rule",
                    """
                    package demo;

                    public final class Rule {
                      private Rule() {}

                      public static int apply(float x) {
                        return Side.of(x).ordinal();
                      }

                      enum Side {
                        LEFT,
                        RIGHT;

                        static Side of(float x) {
                          return x <= Threshold.value() ? LEFT : RIGHT;
                        }
                      }
                    }
                    """)));

    assertThat(classes.names()).containsExactly("demo.Rule", "demo.Rule$Side", "demo.Threshold");
    Method apply = classes.load("demo.Rule").getMethod("apply", float.class);
    assertThat(apply.invoke(null, 2.5f)).isEqualTo(0);
    assertThat(apply.invoke(null, Math.nextUp(2.5f))).isEqualTo(1);
  }

  @Test
  void batchGivesTheSameClassFilesAsCompilingOneByOne() throws Exception {
    List<SourceFile> sources = new ArrayList<>();
    for (int i = 0; i < 20; i++) {
      sources.add(numberedClass(i));
    }

    CompiledClasses batch = compiler.compile(sources);

    assertThat(batch.names()).hasSize(20);
    for (SourceFile source : sources) {
      CompiledClasses single = compiler.compile(List.of(source));
      String name = source.binaryClassName();
      assertThat(batch.bytes(name)).as(name).isEqualTo(single.bytes(name));
    }
  }

  @Test
  void releaseOfTheRunningJdkIsPassedAsSourceAndTarget() {
    String running = Integer.toString(Runtime.version().feature());
    assertThat(InMemoryCompiler.runningRelease(List.of("-g", "--release", running, "-Werror")))
        .containsExactly("-g", "-source", running, "-target", running, "-Werror");
    assertThat(InMemoryCompiler.runningRelease(List.of("--release", "11", "-Werror")))
        .containsExactly("--release", "11", "-Werror");
    assertThat(InMemoryCompiler.runningRelease(List.of("-Xlint:all")))
        .containsExactly("-Xlint:all");
    assertThat(compiler.options()).isEqualTo(STRICT);
  }

  @Test
  void givesTheClassFilesJavacWritesWithRelease(@TempDir Path dir) throws Exception {
    // Reference: the JDK's own javac run as a build would run it, with --release and files on
    // disk. Sources use string switches, concatenation, lambdas, records and nested classes, whose
    // code javac generates with help from the platform classes.
    String source = """
        package demo;

        import java.util.function.IntUnaryOperator;

        public final class Mixed {
          record Pair(int a, float b) {}

          public static String f(String s, float x) {
            IntUnaryOperator twice = v -> v * 2;
            int k = switch (s) {
              case "one" -> 1;
              case "two" -> 2;
              default -> twice.applyAsInt(s.length());
            };
            return "k=" + k + ", x=" + Float.floatToRawIntBits(x) + new Pair(k, x);
          }
        }
        """;
    Path file = dir.resolve("Mixed.java");
    Files.writeString(file, source);
    String release = Integer.toString(Runtime.version().feature());
    int status = ToolProvider.getSystemJavaCompiler().run(null, null, null, "--release", release,
        "-d", dir.toString(), file.toString());
    assertThat(status).isZero();

    CompiledClasses ours = compiler.compile(List.of(new SourceFile("demo.Mixed", source)));

    assertThat(ours.names()).containsExactlyInAnyOrder("demo.Mixed", "demo.Mixed$Pair");
    for (String name : ours.names()) {
      byte[] reference = Files.readAllBytes(dir.resolve(name.replace('.', '/') + ".class"));
      assertThat(ours.bytes(name)).as(name).isEqualTo(reference);
    }
  }

  @Test
  void applicationClassPathIsInvisibleToSources() {
    String source =
        """
        package demo;

        final class Peek {
          dev.splitwright.check.SourceFile file;
        }
        """;

    assertThatThrownBy(() -> compiler.compileOne("demo.Peek", source))
        .isInstanceOfSatisfying(
            CompilationException.class,
            e ->
                assertThat(e.errors())
                    .singleElement()
                    .satisfies(d -> assertThat(d.message()).contains("dev.splitwright.check")));
  }

  @Test
  void rejectsEmptyBatch() {
    assertThatIllegalArgumentException()
        .isThrownBy(() -> compiler.compile(List.of()))
        .withMessage("sources is empty");
  }

  @Test
  void rejectsBatchNamingAClassTwice() {
    SourceFile source = numberedClass(1);

    assertThatIllegalArgumentException()
        .isThrownBy(() -> compiler.compile(List.of(source, source)))
        .withMessage("sources names class demo.Numbered1 more than once");
  }

  @Test
  void rejectsUnknownOptionAtCreation() {
    assertThatIllegalArgumentException()
        .isThrownBy(() -> InMemoryCompiler.create(List.of("--no-such-option")));
  }

  @Test
  void rejectsClassNameThatIsNotAJavaName() {
    assertThatIllegalArgumentException()
        .isThrownBy(() -> new SourceFile("demo.1st", ""))
        .withMessage("binaryClassName \"demo.1st\" is not a qualified Java name");
  }

  static SourceFile numberedClass(int i) {
    String name = "Numbered" + i;
    String source =
        String.format(
            Locale.ROOT,
            """
            package demo;

            public final class %s {
              private %s() {}

              public static int value(float x) {
                return x <= %d.5f ? %d : -1;
              }
            }
            """,
            name,
            name,
            i,
            i);
    return new SourceFile("demo." + name, source);
  }
}
