package dev.splitwright.check;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.spi.ToolProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Cross-checks the hand-written parser with the JDK's own class file disassembler, javap (module
 * jdk.jdeps), on a class that uses most constant pool kinds: Long, Double, String, MethodHandle,
 * MethodType and InvokeDynamic (lambda and string concatenation), plus a switch, a loop and an
 * exception handler.
 */
class ClassFileInfoJavapTest {

  private static final String VARIETY =
      """
      package demo;

      import java.util.function.IntUnaryOperator;

      public class Variety implements Runnable {
        static final long BIG = 1234567890123L;
        private final double scale = 2.5;
        private final StringBuilder log = new StringBuilder();

        interface Shape {
          double area();
        }

        @Override
        public void run() {
          log.append("ran");
        }

        int classify(int x) {
          switch (x) {
            case 0: return 10;
            case 1: return 11;
            case 2: return 12;
            default: return -1;
          }
        }

        long sum(int[] values) {
          long s = 0;
          for (int v : values) {
            s += v;
          }
          return s + BIG;
        }

        double scaled(double v) {
          return Math.abs(v) * scale;
        }

        String describe(Object o) {
          return "o=" + o;
        }

        int applyTwice(int x) {
          IntUnaryOperator f = v -> v + 1;
          return f.applyAsInt(f.applyAsInt(x));
        }

        static int safeDivide(int a, int b) {
          try {
            return a / b;
          } catch (ArithmeticException e) {
            return 0;
          }
        }
      }
      """;

  // JVMS §6.5: the return instructions and athrow have no operands, so they are one byte long.
  private static final Set<String> ONE_BYTE_ENDINGS =
      Set.of("return", "ireturn", "lreturn", "freturn", "dreturn", "areturn", "athrow");

  private static final Pattern POOL_ENTRY = Pattern.compile("^\\s+#(\\d+) = (\\w+)");
  private static final Pattern INSTRUCTION = Pattern.compile("^\\s+(\\d+): ([a-z][a-z0-9_]*)");
  private static final Pattern LINE_ENTRY = Pattern.compile("^\\s+line \\d+: \\d+$");
  private static final Pattern COUNTS =
      Pattern.compile("^\\s+interfaces: \\d+, fields: \\d+, methods: (\\d+), attributes: \\d+$");

  @TempDir Path dir;

  @Test
  void agreesWithJavapOnVersionPoolSizeCodeLengthsAndLineTables() throws Exception {
    CompiledClasses classes;
    try (InMemoryCompiler compiler = InMemoryCompiler.create(List.of("--release", "17"))) {
      classes = compiler.compileOne("demo.Variety", VARIETY);
    }
    assertThat(classes.names()).containsExactly("demo.Variety", "demo.Variety$Shape");

    for (String name : classes.names()) {
      ClassFileInfo info = ClassFileInfo.parse(classes.bytes(name));
      Javap javap = javap(name, classes.bytes(name));

      assertThat(info.majorVersion()).as(name).isEqualTo(javap.majorVersion);
      assertThat(info.constantPoolCount()).as(name).isEqualTo(javap.constantPoolCount);
      assertThat(info.methods()).as(name).hasSize(javap.methodCount);
      assertThat(info.lineNumberTableBytes()).as(name).isEqualTo(javap.lineNumberTableBytes);
      List<String> withCode = new ArrayList<>();
      for (MethodSize method : info.methods()) {
        if (method.codeLength() > 0) {
          withCode.add(method.descriptor() + " " + method.codeLength());
        }
      }
      assertThat(withCode).as(name).containsExactlyElementsOf(javap.codeLengths);
    }
  }

  /** What javap -v -p says, reduced to the numbers the parser also reports. */
  private record Javap(
      int majorVersion,
      int constantPoolCount,
      int methodCount,
      int lineNumberTableBytes,
      List<String> codeLengths) {}

  private Javap javap(String name, byte[] bytes) throws Exception {
    Path file = dir.resolve(name + ".class");
    Files.write(file, bytes);
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int exit =
        ToolProvider.findFirst("javap")
            .orElseThrow()
            .run(new PrintWriter(out), new PrintWriter(err), "-v", "-p", file.toString());
    assertThat(exit).as(err.toString()).isZero();

    int major = -1;
    int lastIndex = 0;
    String lastTag = "";
    int methods = -1;
    int lineTables = 0;
    int lineEntries = 0;
    List<String> codeLengths = new ArrayList<>();
    String descriptor = "";
    int lastOffset = -1;
    String lastMnemonic = "";
    for (String line : out.toString().lines().toList()) {
      Matcher m;
      if (line.startsWith("  major version: ")) {
        major = Integer.parseInt(line.substring("  major version: ".length()));
      } else if ((m = COUNTS.matcher(line)).matches()) {
        methods = Integer.parseInt(m.group(1));
      } else if ((m = POOL_ENTRY.matcher(line)).find()) {
        lastIndex = Integer.parseInt(m.group(1));
        lastTag = m.group(2);
      } else if (line.startsWith("    descriptor: ")) {
        addCodeLength(codeLengths, descriptor, lastOffset, lastMnemonic);
        descriptor = line.substring("    descriptor: ".length());
        lastOffset = -1;
      } else if ((m = INSTRUCTION.matcher(line)).find()) {
        lastOffset = Integer.parseInt(m.group(1));
        lastMnemonic = m.group(2);
      } else if (line.trim().equals("LineNumberTable:")) {
        lineTables++;
      } else if (LINE_ENTRY.matcher(line).matches()) {
        lineEntries++;
      }
    }
    addCodeLength(codeLengths, descriptor, lastOffset, lastMnemonic);
    // §4.4.5: a Long or Double in the last printed index also occupies the index after it.
    boolean wide = lastTag.equals("Long") || lastTag.equals("Double");
    int poolCount = lastIndex + (wide ? 2 : 1);
    // §4.7.12: 6-byte header, u2 line_number_table_length, then 4 bytes per entry.
    int lineBytes = lineTables * 8 + lineEntries * 4;
    return new Javap(major, poolCount, methods, lineBytes, codeLengths);
  }

  private static void addCodeLength(
      List<String> codeLengths, String descriptor, int lastOffset, String lastMnemonic) {
    if (lastOffset < 0) {
      return;
    }
    assertThat(ONE_BYTE_ENDINGS).as("last instruction of " + descriptor).contains(lastMnemonic);
    codeLengths.add(descriptor + " " + (lastOffset + 1));
  }
}
