package dev.splitwright.verify;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.check.ClassFileInfo;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.InMemoryCompiler;
import dev.splitwright.check.MethodSize;
import dev.splitwright.check.SourceFile;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.ClassCounts;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.model.Leaf;
import dev.splitwright.model.Node;
import dev.splitwright.model.NumericSplit;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.TreeSet;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Shows with HotSpot's own {@code -XX:+PrintCompilation} log, in a child JVM, why methods are kept
 * under 8,000 bytes of bytecode: a method of 8,001 bytes is never JIT-compiled (the develop flag
 * {@code HugeMethodLimit}, 8000, is not visible in a product JVM, so its value is measured here)
 * unless {@code -XX:-DontCompileHugeMethods} is given, while the split depth-14 tree is compiled
 * method by method.
 */
public class HotSpotJitTest {
  private static final InMemoryCompiler JAVAC = InMemoryCompiler.create(Verifier.JAVAC_OPTIONS);
  private static final Pattern COMPILED = Pattern.compile("\\s(\\S+)::(\\S+) \\(\\d+ bytes\\)");
  private static final int DEPTH = 14;
  private static final int FEATURES = DEPTH;

  @TempDir Path temp;

  @Test
  void aMethodOfMoreThan8000BytecodeBytesIsNeverCompiled() throws Exception {
    String source = "package jit;\n\npublic final class Sized {\n"
        // 4 bytes of frame around 3-byte "b += 1" (iinc) and 4-byte "b ^= a" statements.
        + sizedMethod("bytes8000", 0, 1999) + sizedMethod("bytes8001", 3, 1997)
        + "  public static void main(String[] args) {\n"
        + "    long sum = 0;\n"
        + "    long end = System.nanoTime() + 1_500_000_000L;\n"
        + "    for (int n = 0; System.nanoTime() < end; n++) {\n"
        + "      sum += bytes8000(n) + bytes8001(n);\n"
        + "    }\n"
        + "    System.out.println(sum);\n"
        + "  }\n}\n";
    CompiledClasses classes = JAVAC.compileOne("jit.Sized", source);
    assertThat(codeLength(classes, "jit.Sized", "bytes8000")).isEqualTo(8000);
    assertThat(codeLength(classes, "jit.Sized", "bytes8001")).isEqualTo(8001);
    Path dir = write(classes);

    TreeSet<String> compiled = compiledMethods(dir, "jit.Sized", List.of());
    assertThat(compiled).contains("jit.Sized::bytes8000").doesNotContain("jit.Sized::bytes8001");

    // The rule behind it is DontCompileHugeMethods (a product flag): turned off, 8001 compiles.
    TreeSet<String> withHuge =
        compiledMethods(dir, "jit.Sized", List.of("-XX:-DontCompileHugeMethods"));
    assertThat(withHuge).contains("jit.Sized::bytes8001");
  }

  private static String sizedMethod(String name, int increments, int xors) {
    StringBuilder out = new StringBuilder("  static int " + name + "(int a) {\n    int b = a;\n");
    out.append("    b += 1;\n".repeat(increments)).append("    b ^= a;\n".repeat(xors));
    return out.append("    return b;\n  }\n\n").toString();
  }

  @Test
  void depth14TreeIsSplitUnderTheCapAndEveryMethodGetsCompiled() throws Exception {
    DecisionTree deep = levelTree(DEPTH, 14);
    assertThat(deep.internalNodeCount()).isEqualTo(16_383);
    EmitOptions deepOptions = EmitOptions.builder("jit", "Deep").build();
    EmittedSource deepSource = JavaEmitter.emit(deep, deepOptions, HeaderInfo.none());
    EmitOptions tableOptions =
        EmitOptions.builder("jit", "DeepTable").layout(Layout.TABLE).build();
    EmittedSource tableSource = JavaEmitter.emit(deep, tableOptions, HeaderInfo.none());
    CompiledClasses classes = JAVAC.compile(List.of(
        new SourceFile(deepSource.qualifiedName(), deepSource.source()),
        new SourceFile(tableSource.qualifiedName(), tableSource.source()),
        new SourceFile("jit.Driver", driver())));

    VerificationResult verified = Verifier.create().withRandomProbes(500)
        .check(deep, classes, deepSource, deepOptions, List.of(), 14);
    assertThat(verified.passed()).as(verified.verdict()).isTrue();
    List<MethodSize> methods = verified.methods();
    // JVMS §4.7.3 code_length of every method, read from the class file.
    assertThat(methods).allSatisfy(m -> assertThat(m.codeLength()).isLessThanOrEqualTo(8000));
    List<String> treeMethods = methods.stream().map(MethodSize::name)
        .filter(n -> n.equals("classify") || n.matches("node\\d+")).toList();
    assertThat(treeMethods).hasSizeGreaterThan(10);
    VerificationResult table = Verifier.create().withRandomProbes(500)
        .check(deep, classes, tableSource, tableOptions, List.of(), 14);
    assertThat(table.passed()).as(table.verdict()).isTrue();
    assertThat(table.classFileBytes()).isLessThan(verified.classFileBytes());
    System.out.printf(Locale.ROOT, "depth-14 tree: branches %d bytes, %d methods, largest %d "
        + "bytes, %d constants; table %d bytes, largest %d bytes, static initializer %d bytes, "
        + "%d constants%n",
        verified.classFileBytes(), methods.size(), verified.maxMethodBytes(),
        verified.constantPoolCount(), table.classFileBytes(), table.maxMethodBytes(),
        codeLength(classes, "jit.DeepTable", "<clinit>"), table.constantPoolCount());

    TreeSet<String> compiled = compiledMethods(write(classes), "jit.Driver", List.of());
    for (String name : treeMethods) {
      assertThat(compiled).contains("jit.Deep::" + name);
    }
    // A method past 8,000 bytes is never compiled: measured by the 8,000/8,001-byte pair above.
    // (A tree of one huge method cannot be emitted any more: the emitter nests at most 9 ifs
    // per method so that no line passes 100 columns.)
  }

  /**
   * A full tree testing feature {@code level} at each level, so every leaf is reachable and the
   * driver's uniform inputs reach every subtree; thresholds differ a little around 0.
   */
  public static DecisionTree levelTree(int depth, long seed) {
    List<Feature> features = new ArrayList<>();
    for (int f = 0; f < FEATURES; f++) {
      features.add(Feature.numeric("f" + f));
    }
    Schema schema = new Schema(features, "state", List.of("a", "b", "c", "d", "e"));
    return new DecisionTree(schema, level(0, depth, new SplittableRandom(seed)));
  }

  private static Node level(int level, int depth, SplittableRandom random) {
    ClassCounts counts = ClassCounts.of(1, 2, 3, 4, 5);
    if (level == depth) {
      return new Leaf(random.nextInt(5), counts);
    }
    Node left = level(level + 1, depth, random);
    Node right = level(level + 1, depth, random);
    float threshold = (float) ((random.nextDouble() - 0.5) * 0.2);
    return new NumericSplit(level, threshold, random.nextBoolean(), left, right, counts);
  }

  /** Calls the depth-14 classifier for three seconds on uniform inputs in [-1, 1]. */
  private static String driver() {
    return "package jit;\n\n"
        + "public final class Driver {\n"
        + "  public static void main(String[] args) {\n"
        + "    java.util.SplittableRandom random = new java.util.SplittableRandom(7);\n"
        + "    float[][] inputs = new float[4096][" + FEATURES + "];\n"
        + "    for (float[] x : inputs) {\n"
        + "      for (int f = 0; f < x.length; f++) {\n"
        + "        x[f] = (float) (random.nextDouble() * 2 - 1);\n"
        + "      }\n"
        + "    }\n"
        + "    long sum = 0;\n"
        + "    long end = System.nanoTime() + 3_000_000_000L;\n"
        + "    for (int n = 0; System.nanoTime() < end; n++) {\n"
        + "      sum += Deep.classify(inputs[n & 4095]);\n"
        + "    }\n"
        + "    System.out.println(sum);\n"
        + "  }\n"
        + "}\n";
  }

  private static int codeLength(CompiledClasses classes, String type, String method) {
    return ClassFileInfo.parse(classes.bytes(type)).methods().stream()
        .filter(m -> m.name().equals(method))
        .mapToInt(MethodSize::codeLength)
        .findFirst()
        .orElseThrow();
  }

  private Path write(CompiledClasses classes) throws IOException {
    Path dir = Files.createTempDirectory(temp, "classes");
    for (String name : classes.names()) {
      Path file = dir.resolve(name.replace('.', '/') + ".class");
      Files.createDirectories(file.getParent());
      Files.write(file, classes.bytes(name));
    }
    return dir;
  }

  /** Runs {@code main} in a child JVM and returns {@code Class::method} of each compilation. */
  private TreeSet<String> compiledMethods(Path classPath, String main, List<String> flags)
      throws IOException, InterruptedException {
    List<String> command = new ArrayList<>();
    command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    command.add("-XX:+PrintCompilation");
    command.addAll(flags);
    command.addAll(List.of("-cp", classPath.toString(), main));
    Path log = Files.createTempFile(temp, "jit", ".log");
    Process process = new ProcessBuilder(command).redirectErrorStream(true)
        .redirectOutput(log.toFile()).start();
    assertThat(process.waitFor(60, TimeUnit.SECONDS)).as("child JVM finished").isTrue();
    String output = Files.readString(log, StandardCharsets.UTF_8);
    assertThat(process.exitValue()).as(output).isZero();
    TreeSet<String> compiled = new TreeSet<>();
    Matcher m = COMPILED.matcher(output);
    while (m.find()) {
      compiled.add(m.group(1) + "::" + m.group(2));
    }
    return compiled;
  }
}
