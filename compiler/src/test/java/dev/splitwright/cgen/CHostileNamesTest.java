package dev.splitwright.cgen;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.emit.RandomTrees;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.verify.ProbeAccess;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * CSV headers and labels are user text. In C they may only become string literals and block
 * comment text. Trigraphs are replaced before anything else under {@code -trigraphs} (and
 * {@code -std=c99}), so {@code ??/} is a backslash, even in a literal or before a line end
 * (C99 5.1.1.2, 5.2.1.1); a backslash before a line end splices lines, even in a comment; and
 * string literals longer than 4095 characters are beyond what C99 promises (5.2.4.1). Each case
 * must compile with -Werror, define exactly the symbols and code of a benign twin, and return the
 * original UTF-8 bytes from label(i) and feature_name(i).
 */
class CHostileNamesTest {
  static final List<String> NAMES = List.of(
      "??/",
      "a??=b??(c??)",
      "???/",
      "?",
      "??'??!??<??>??-",
      "*/ int evil = 1; /*",
      "/* nested",
      "// line comment \\",
      "trailing backslash\\",
      "trigraph backslash ??/",
      "line one\nline two",
      "carriage\rreturn",
      "tab\tand nul\u0000byte",
      "line\u2028separator",
      "quote \" inside",
      "\\x41\\101 not escapes",
      "\\",
      "Geschwindigkeit \u00fc",
      "\u6e29\u5ea6",
      "fire \ud83d\udd25 alarm",
      "int",
      "while",
      "_Bool",
      "__LINE__",
      "_Pragma(\"once\")",
      "#define X 1",
      "1st axis",
      "",
      " ",
      "count",
      "COUNT",
      "FEATURE_COUNT",
      "max",
      "MIN",
      "c",
      "a-b",
      "a b",
      "A_B",
      "a__b",
      "_x",
      "%s%n",
      "long " + "name ".repeat(1000));

  private static final Pattern DEFINE = Pattern.compile("(?m)^#define (\\S+) (\\S+)");

  @TempDir
  Path dir;

  static List<Arguments> variants() {
    return List.of(Arguments.of(Layout.BRANCHES, InputKind.FLOAT),
        Arguments.of(Layout.TABLE, InputKind.FLOAT),
        Arguments.of(Layout.BRANCHES, InputKind.INT),
        Arguments.of(Layout.TABLE, InputKind.INT));
  }

  @ParameterizedTest
  @MethodSource("variants")
  void hostileNamesStayTextAndCompileWithTrigraphs(Layout layout, InputKind kind)
      throws IOException {
    assumeTrue(Gcc.available(), "gcc is needed to build emitted C");
    DecisionTree hostile = tree(NAMES);
    List<String> benignNames = new ArrayList<>();
    for (int i = 0; i < NAMES.size(); i++) {
      int length = NAMES.get(i).length();
      benignNames.add(CText.isLongString(NAMES.get(i)) ? "n".repeat(length) : "name" + i);
    }
    DecisionTree benign = tree(benignNames);
    // "int_probe": its macros start with INT, as <stdint.h>'s reserved INT..._MAX do.
    CEmitOptions options = new CEmitOptions("int_probe", layout, kind, true, false);
    HeaderInfo header = new HeaderInfo(NAMES.get(5) + NAMES.get(9) + ".csv", NAMES.get(7),
        "--target " + NAMES.get(8) + NAMES.get(0), List.of(NAMES.get(10), NAMES.get(6)));
    CSource source = CEmitter.emit(hostile, options, header);
    CSource twin = CEmitter.emit(benign, options, HeaderInfo.none());

    String all = source.headerText() + source.sourceText();
    assertThat(all.chars()).allMatch(c -> c == '\n' || (c >= 0x20 && c < 0x7f));
    assertThat(all).doesNotContain("??");
    assertThat(codeOnly(source.headerText()) + codeOnly(source.sourceText()))
        .doesNotContain("//");
    // No text became code: outside comments and literals the two .c files are the same.
    assertThat(codeOnly(source.sourceText())).isEqualTo(codeOnly(twin.sourceText()));
    macrosAreSafe(source, hostile.schema());

    // Same objects from both: symbols and the size of the code.
    List<String> flags = new ArrayList<>(Gcc.STRICT);
    flags.add("-trigraphs");
    Gcc.write(dir, source.headerName(), source.headerText(), source.sourceName(),
        source.sourceText());
    Gcc.gcc(dir, flags, List.of(source.sourceName()), "hostile.o").orFail("gcc hostile");
    Path twinDir = dir.resolve("twin");
    java.nio.file.Files.createDirectories(twinDir);
    Gcc.write(twinDir, twin.headerName(), twin.headerText(), twin.sourceName(),
        twin.sourceText());
    Gcc.gcc(twinDir, flags, List.of(twin.sourceName()), "twin.o").orFail("gcc twin");
    assertThat(symbols(dir, "hostile.o")).isEqualTo(symbols(twinDir, "twin.o"));
    assertThat(textSize(dir, "hostile.o")).isEqualTo(textSize(twinDir, "twin.o"));

    // Label and name bytes, and classes on probes, through the harness (also under -trigraphs).
    int features = hostile.schema().featureCount();
    byte[] raw;
    List<float[]> model = new ArrayList<>();
    Gcc.write(dir, CHarness.fileName(options), CHarness.source(options));
    flags.addAll(Gcc.SANITIZE);
    Gcc.gcc(dir, flags, List.of(source.sourceName(), CHarness.fileName(options)), "harness")
        .orFail("gcc harness");
    byte[] input;
    if (kind == InputKind.FLOAT) {
      model.addAll(ProbeAccess.floatProbes(hostile, 3, 100));
      input = HarnessData.packFloats(model, features);
    } else {
      List<int[]> ints = ProbeAccess.intProbes(hostile);
      for (int[] x : ints) {
        float[] v = new float[x.length];
        for (int f = 0; f < v.length; f++) {
          v[f] = x[f];
        }
        model.add(v);
      }
      input = HarnessData.packInts(ints, features);
    }
    java.nio.file.Files.write(dir.resolve("in.bin"), input);
    Gcc.run(dir, List.of(dir.resolve("harness").toString(), "in.bin", "out.bin"))
        .orFail("harness");
    raw = java.nio.file.Files.readAllBytes(dir.resolve("out.bin"));
    COracle.Report report = COracle.report(hostile, options, raw, model);
    assertThat(report.mismatches()).as(report.describe()).isZero();
  }

  /** Macro names: [A-Z0-9_], the prefix first, unique, no "__", none that stdint.h reserves. */
  private static void macrosAreSafe(CSource source, Schema schema) {
    Matcher m = DEFINE.matcher(source.headerText());
    Set<String> names = new HashSet<>();
    List<String> classValues = new ArrayList<>();
    List<String> featureValues = new ArrayList<>();
    while (m.find()) {
      String name = m.group(1);
      assertThat(name).matches("INT_PROBE_[A-Z0-9_]*").doesNotContain("__");
      assertThat(name.endsWith("_MAX") || name.endsWith("_MIN") || name.endsWith("_C"))
          .as(name).isFalse();
      assertThat(names.add(name)).as(name).isTrue();
      if (name.startsWith("INT_PROBE_CLASS_") && !name.equals("INT_PROBE_CLASS_COUNT")) {
        classValues.add(m.group(2));
      } else if (name.startsWith("INT_PROBE_FEATURE_")
          && !name.equals("INT_PROBE_FEATURE_COUNT")) {
        featureValues.add(m.group(2));
      }
    }
    List<String> expectedClasses = new ArrayList<>();
    for (int c = 0; c < schema.classCount(); c++) {
      expectedClasses.add(Integer.toString(c));
    }
    List<String> expectedFeatures = new ArrayList<>();
    for (int f = 0; f < schema.featureCount(); f++) {
      expectedFeatures.add(Integer.toString(f));
    }
    assertThat(classValues).isEqualTo(expectedClasses);
    assertThat(featureValues).isEqualTo(expectedFeatures);
    assertThat(names).contains("INT_PROBE_CLASS_COUNT", "INT_PROBE_CLASS_COUNT_2",
        "INT_PROBE_CLASS_MAX_2", "INT_PROBE_CLASS_A_B", "INT_PROBE_CLASS_A_B_2",
        "INT_PROBE_CLASS_27", "INT_PROBE_FEATURE_COUNT_2");
  }

  /**
   * The code of a C file with block comments dropped and string and character literals emptied
   * (C99 6.4.9, 6.4.5, 6.4.4.4), scanning as the compiler would after phase 2: what is left is
   * what the compiler reads as code.
   */
  private static String codeOnly(String source) {
    StringBuilder out = new StringBuilder();
    for (int i = 0; i < source.length(); i++) {
      char c = source.charAt(i);
      if (c == '/' && i + 1 < source.length() && source.charAt(i + 1) == '*') {
        int end = source.indexOf("*/", i + 2);
        assertThat(end).as("unclosed comment at " + i).isPositive();
        out.append(' ');
        i = end + 1;
      } else if (c == '"' || c == '\'') {
        int j = i + 1;
        while (source.charAt(j) != c) {
          assertThat(source.charAt(j)).as("line end in a literal at " + j).isNotEqualTo('\n');
          j += source.charAt(j) == '\\' ? 2 : 1;
        }
        out.append(c).append(c);
        i = j;
      } else {
        out.append(c);
      }
    }
    return out.toString();
  }

  private static DecisionTree tree(List<String> names) {
    List<Feature> features = new ArrayList<>();
    for (int f = 0; f < names.size(); f++) {
      features.add(f % 7 == 3 ? Feature.categorical(names.get(f), names)
          : Feature.numeric(names.get(f)));
    }
    Schema schema = new Schema(features, names.get(1), names);
    return RandomTrees.tree(new SplittableRandom(11), schema, 8, 120);
  }

  private static List<String> symbols(Path dir, String object) throws IOException {
    return Gcc.run(dir, List.of("nm", object)).orFail("nm").output().lines()
        .map(l -> l.substring(l.indexOf(' ', 17) + 1)).sorted().toList();
  }

  private static String textSize(Path dir, String object) throws IOException {
    return Gcc.run(dir, List.of("size", "-A", object)).orFail("size").output().lines()
        .map(l -> l.trim().split("\\s+")).filter(l -> l[0].equals(".text")).map(l -> l[1])
        .findFirst().orElseThrow();
  }
}
