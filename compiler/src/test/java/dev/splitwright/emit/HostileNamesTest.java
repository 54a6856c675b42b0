package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;

import com.sun.source.tree.ClassTree;
import com.sun.source.tree.CompilationUnitTree;
import com.sun.source.tree.Tree;
import com.sun.source.util.JavacTask;
import com.sun.source.util.TreeScanner;
import dev.splitwright.check.ClassFileInfo;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.check.SourceFile;
import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.lang.reflect.Field;
import java.lang.reflect.Method;
import java.lang.reflect.Modifier;
import java.net.URI;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.TreeSet;
import java.util.stream.Stream;
import javax.tools.JavaCompiler;
import javax.tools.JavaFileObject;
import javax.tools.SimpleJavaFileObject;
import javax.tools.ToolProvider;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * CSV headers and labels are user text. Each of these must give source that compiles with {@code
 * -Xlint:all -Werror}, declares exactly the members a benign twin declares (so no text became
 * code), keeps the original text in {@code label(i)} and {@code featureName(i)}, and passes
 * verification. Unicode escapes matter because javac decodes them before anything else, even in
 * comments (JLS §3.3); line terminators because a line comment ends there (JLS §3.4, §3.7).
 */
class HostileNamesTest {
  private static final Verifier VERIFIER = Verifier.create().withRandomProbes(200);

  /**
   * After the escape of a lone high surrogate javac 17 miscounts the next backslashes, so a
   * doubled backslash here would not stop the escape that ends a line comment (measured; this
   * file writes that backslash as the octal escape 134 for the same reason).
   */
  private static final String LINE_ENDER = "lone \ud83d\134u000a int injected = 1; //";
  /** The same with an escaped star that would close a block comment. */
  private static final String COMMENT_CLOSER = "lone \udbff\134u002a/ int injected; /\\u002a";

  /** Each name is used as a feature name, a class label and a category. */
  static final List<String> NAMES = List.of(
      LINE_ENDER,
      COMMENT_CLOSER,
      // Parameter and local names of the emitted methods, for --named-args.
      "x",
      "out",
      "leaf",
      "say \"hi\"",
      "C:\\temp\\new",
      "back\\ü slash before non-ASCII",
      "end */ class Evil {} /*",
      "\\u000a static { System.exit(1); }",
      "\\u002a\\u002f static int evil; /\\u002a",
      "x\\u0022 + System.exit(1) + \\u0022",
      "\\\\u000a double backslash",
      "line one\nline two",
      "carriage\rreturn",
      "line\u2028separator\u2029paragraph\u0085next",
      "tab\tand nul\u0000",
      "Geschwindigkeit ü",
      "温度",
      "fire 🔥 alarm",
      "lone \ud800 surrogate",
      "class",
      "int",
      "null",
      "true",
      "_",
      "var",
      "yield",
      "1st axis",
      "2nd-axis",
      "",
      " ",
      "a-b",
      "a b",
      "a_b",
      "a.b",
      "$value",
      "cost$",
      "$L $S $N $$",
      "%s %d %n",
      "FEATURE_COUNT",
      "CLASS_COUNT",
      "LABELS",
      "{@link java.lang.System#exit} <b>bold</b> @param &amp;",
      "\"; System.exit(1); //",
      "long " + "name ".repeat(20_000));

  static Stream<Arguments> variants() {
    return Stream.of(
        Arguments.of(Layout.BRANCHES, InputKind.FLOAT, false, false),
        Arguments.of(Layout.TABLE, InputKind.FLOAT, false, false),
        Arguments.of(Layout.BRANCHES, InputKind.DOUBLE, true, true),
        Arguments.of(Layout.TABLE, InputKind.INT, true, true),
        Arguments.of(Layout.TABLE, InputKind.DOUBLE, false, true));
  }

  @ParameterizedTest
  @MethodSource("variants")
  void hostileNamesCompileStayTextAndVerify(Layout layout, InputKind input, boolean named,
      boolean probabilities) throws Exception {
    // At most 32 features for named arguments: the first 32 names then (keywords and the emitted
    // methods' own parameter and local names among them), all of them as labels.
    int featureCount = named ? EmitOptions.MAX_NAMED_ARGS : NAMES.size();
    DecisionTree hostile = tree(NAMES.subList(0, featureCount), NAMES);
    List<String> benignNames = new ArrayList<>();
    for (int i = 0; i < NAMES.size(); i++) {
      // As long as the hostile name where that decides how the tables are written.
      int length = NAMES.get(i).length();
      benignNames.add(length > StringTable.MAX_INITIALIZER_CHARS ? "n".repeat(length) : "name" + i);
    }
    DecisionTree benign = tree(benignNames.subList(0, featureCount), benignNames);
    EmitOptions options = EmitOptions.builder("hostile", "Names").layout(layout)
        .inputKind(input).namedArgs(named).probabilities(probabilities).build();
    EmitOptions twinOptions = EmitOptions.builder("benign", "Names").layout(layout)
        .inputKind(input).namedArgs(named).probabilities(probabilities).build();
    // The header's text lands in the file comment (data name) and the class javadoc.
    HeaderInfo header = new HeaderInfo(LINE_ENDER + COMMENT_CLOSER + ".csv", NAMES.get(7),
        "--target " + LINE_ENDER + NAMES.get(8), List.of(COMMENT_CLOSER, NAMES.get(5)));
    EmittedSource source = JavaEmitter.emit(hostile, options, header);
    EmittedSource twin = JavaEmitter.emit(benign, twinOptions, HeaderInfo.none());

    assertThat(source.source().chars()).allMatch(c -> c == '\n' || (c >= 0x20 && c < 0x7f));
    assertThat(topLevelTypes(source)).containsExactly("Names");
    CompiledClasses compiled = VERIFIER.compiler().compile(List.of(
        new SourceFile(source.qualifiedName(), source.source()),
        new SourceFile(twin.qualifiedName(), twin.source())));
    Class<?> type = compiled.load(source.qualifiedName());
    Class<?> twinType = compiled.load(twin.qualifiedName());

    assertThat(members(type)).isEqualTo(members(twinType));
    // Same bytecode lengths method by method, static initializer included: no text became code.
    assertThat(codeLengths(compiled, source.qualifiedName()))
        .isEqualTo(codeLengths(compiled, twin.qualifiedName()));
    Method label = type.getMethod("label", int.class);
    for (int c = 0; c < NAMES.size(); c++) {
      assertThat(label.invoke(null, c)).isEqualTo(NAMES.get(c));
      assertThat(type.getField(constantName(type, c)).getInt(null)).isEqualTo(c);
    }
    Method featureName = type.getMethod("featureName", int.class);
    for (int f = 0; f < featureCount; f++) {
      assertThat(featureName.invoke(null, f)).isEqualTo(NAMES.get(f));
    }
    VerificationResult result =
        VERIFIER.check(hostile, compiled, source, options, List.of(), 3);
    assertThat(result.passed()).as(result.verdict()).isTrue();
  }

  /**
   * An array initializer costs about seven bytes of static initializer per element and a method
   * holds at most 65,535 bytes (JVMS §4.7.3), so 10,000 labels only fit packed.
   */
  @ParameterizedTest
  @EnumSource(value = Layout.class, names = {"BRANCHES", "TABLE"})
  void tenThousandLabelsArePackedAndReadBackExactly(Layout layout) throws Exception {
    List<String> labels = new ArrayList<>();
    for (int c = 0; c < 10_000; c++) {
      labels.add(NAMES.get(c % (NAMES.size() - 1)) + " #" + c);
    }
    Schema schema = new Schema(List.of(Feature.numeric(NAMES.get(3)), Feature.numeric("b")),
        "target", labels);
    DecisionTree tree = RandomTrees.tree(new SplittableRandom(5), schema, 10, 300);
    EmitOptions options = EmitOptions.builder("many", "Labels").layout(layout)
        .probabilities(layout == Layout.TABLE).build();
    EmittedSource source = JavaEmitter.emit(tree, options, HeaderInfo.none());

    CompiledClasses compiled = VERIFIER.compiler().compileOne(source.qualifiedName(),
        source.source());
    Method label = compiled.load(source.qualifiedName()).getMethod("label", int.class);
    for (int c = 0; c < labels.size(); c++) {
      assertThat(label.invoke(null, c)).isEqualTo(labels.get(c));
    }
    VerificationResult result = VERIFIER.check(tree, compiled, source, options, List.of(), 5);
    assertThat(result.passed()).as(result.verdict()).isTrue();
    assertThat(result.methods()).filteredOn(m -> m.name().equals("<clinit>"))
        .allSatisfy(m -> assertThat(m.codeLength()).isLessThan(2000));
  }

  private static List<String> codeLengths(CompiledClasses compiled, String type) {
    return ClassFileInfo.parse(compiled.bytes(type)).methods().stream()
        .map(m -> m.name() + m.descriptor() + " " + m.codeLength())
        .sorted()
        .toList();
  }

  /** A tree over numeric and categorical features named {@code features}, labels {@code labels}. */
  private static DecisionTree tree(List<String> features, List<String> labels) {
    List<Feature> list = new ArrayList<>();
    for (int f = 0; f < features.size(); f++) {
      // Every third feature categorical, its categories the hostile names too.
      list.add(f % 3 == 1
          ? Feature.categorical(features.get(f), NAMES.subList(0, Math.min(NAMES.size(), 3 + f)))
          : Feature.numeric(features.get(f)));
    }
    Schema schema = new Schema(list, features.get(0), labels);
    // Same seed for hostile and benign trees: the same shape, splits and leaves.
    return RandomTrees.tree(new SplittableRandom(31), schema, 8, 200);
  }

  /** The CLASS_ constant whose value is {@code classIndex}. */
  private static String constantName(Class<?> type, int classIndex) throws Exception {
    for (Field field : type.getFields()) {
      if (field.getName().startsWith("CLASS_") && !field.getName().equals("CLASS_COUNT")
          && field.getInt(null) == classIndex) {
        return field.getName();
      }
    }
    throw new AssertionError("no constant for class " + classIndex);
  }

  /**
   * The shape of a class: each method's modifiers, return and parameter types, each field's
   * modifiers and type, and how many public named constants there are; names aside, which
   * differ by design (CLASS_ and category constants and named parameters follow the text).
   */
  private static List<String> members(Class<?> type) {
    TreeSet<String> out = new TreeSet<>();
    for (Method m : type.getDeclaredMethods()) {
      StringBuilder text = new StringBuilder(Modifier.toString(m.getModifiers())).append(' ')
          .append(m.getReturnType().getName()).append(' ').append(m.getName()).append('(');
      for (Class<?> p : m.getParameterTypes()) {
        text.append(p.getName()).append(',');
      }
      out.add(text.append(')').toString());
    }
    List<String> fields = new ArrayList<>();
    for (Field f : type.getDeclaredFields()) {
      // CLASS_ and category code constants are named after the labels and categories.
      boolean named = Modifier.isPublic(f.getModifiers()) && f.getType() == int.class
          && !f.getName().equals("CLASS_COUNT") && !f.getName().equals("FEATURE_COUNT");
      String name = named ? "NAMED_CONSTANT" : f.getName();
      fields.add(Modifier.toString(f.getModifiers()) + " " + f.getType().getName() + " " + name);
    }
    fields.sort(null);
    List<String> all = new ArrayList<>(out);
    all.addAll(fields);
    all.add(type.getDeclaredConstructors().length + " constructors, "
        + type.getDeclaredClasses().length + " nested classes");
    return all;
  }

  /** The top-level types javac's parser finds (JLS §7.6), and any nested class. */
  private static List<String> topLevelTypes(EmittedSource source) throws Exception {
    JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
    JavaFileObject file = new SimpleJavaFileObject(
        URI.create("string:///" + source.relativePath()), JavaFileObject.Kind.SOURCE) {
      @Override
      public CharSequence getCharContent(boolean ignoreEncodingErrors) {
        return source.source();
      }
    };
    JavacTask task = (JavacTask) javac.getTask(null, null, null, List.of(), null, List.of(file));
    List<String> names = new ArrayList<>();
    for (CompilationUnitTree unit : task.parse()) {
      for (Tree type : unit.getTypeDecls()) {
        names.add(((ClassTree) type).getSimpleName().toString());
        // No nested or local class either: the emitter writes none.
        new TreeScanner<Void, Void>() {
          @Override
          public Void visitClass(ClassTree node, Void unused) {
            if (node != type) {
              names.add("nested " + node.getSimpleName());
            }
            return super.visitClass(node, unused);
          }

        }.scan(type, null);
      }
    }
    return names;
  }
}
