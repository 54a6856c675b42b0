package dev.splitwright.backend;

import dev.splitwright.check.ClassFileInfo;
import dev.splitwright.check.MethodSize;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.EmittedSource;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.model.Classifier;
import dev.splitwright.report.CompileReport;
import dev.splitwright.select.BudgetUnit;
import dev.splitwright.select.DebugSizes;
import dev.splitwright.select.DexMeter;
import dev.splitwright.select.DexSizes;
import dev.splitwright.select.JavaSearchMeter;
import dev.splitwright.select.LayoutChoice;
import dev.splitwright.select.LayoutChooser;
import dev.splitwright.select.SearchMeter;
import dev.splitwright.verify.VerificationResult;
import dev.splitwright.verify.Verifier;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;

/**
 * Java: one class emitted by {@link dev.splitwright.emit.JavaEmitter}, compiled by javac in
 * memory, checked by {@link Verifier} and measured as class files.
 */
public final class JavaLanguage implements OutputLanguage<JavaLanguage.JavaEmission> {
  /** What a Java budget may count, the default first. */
  public static final List<BudgetUnit> BUDGET_UNITS =
      List.of(BudgetUnit.CLASS, BudgetUnit.BYTECODE, BudgetUnit.SOURCE, BudgetUnit.DEX);

  private final EmitOptions options;
  private final Verifier verifier;
  private final OptionalInt dexMinApi;

  public JavaLanguage(EmitOptions options, Verifier verifier) {
    this(options, verifier, OptionalInt.empty());
  }

  /** Java as above, its class also measured in DEX bytes at {@code dexMinApi} when present. */
  public JavaLanguage(EmitOptions options, Verifier verifier, OptionalInt dexMinApi) {
    this.options = Objects.requireNonNull(options, "options");
    this.verifier = Objects.requireNonNull(verifier, "verifier");
    this.dexMinApi = Objects.requireNonNull(dexMinApi, "dexMinApi");
  }

  @Override
  public Runnable warmUp() {
    return JavacWarmUp.start(options, verifier);
  }

  /**
   * The emitted class, compiled while its layout was chosen.
   *
   * @param choice the source, its options with the layout kept, and its class files
   */
  public record JavaEmission(LayoutChoice choice) implements Emission {

    public JavaEmission {
      Objects.requireNonNull(choice, "choice");
    }

    public EmittedSource source() {
      return choice.source();
    }

    @Override
    public List<OutputText> files() {
      return written(choice.source(), choice.options()).files();
    }

    @Override
    public String layout() {
      return choice.options().layout().optionName();
    }

    @Override
    public Optional<String> layoutChoice() {
      return Optional.of(choice.describe());
    }

    @Override
    public String input() {
      return choice.options().inputKind().optionName();
    }

    @Override
    public int sourceBytes() {
      return choice.source().sourceBytes();
    }
  }

  /**
   * A Java source as written: {@code <package path>/<Class>.java}.
   *
   * @param options the options it was emitted with, a concrete layout
   */
  public record JavaFile(EmittedSource source, EmitOptions options) implements Emission {

    public JavaFile {
      Objects.requireNonNull(source, "source");
      Objects.requireNonNull(options, "options");
    }

    @Override
    public List<OutputText> files() {
      return List.of(new OutputText(path(source.qualifiedName()), source.source()));
    }

    @Override
    public String layout() {
      return options.layout().optionName();
    }

    @Override
    public String input() {
      return options.inputKind().optionName();
    }

    @Override
    public int sourceBytes() {
      return source.sourceBytes();
    }
  }

  /** {@code source} emitted with {@code options} as the files it is written to. */
  public static JavaFile written(EmittedSource source, EmitOptions options) {
    return new JavaFile(source, options);
  }

  /** {@code <package path>/<Class>.java} of a qualified class name. */
  public static String path(String qualifiedName) {
    return qualifiedName.replace('.', '/') + ".java";
  }

  @Override
  public String name() {
    return "java";
  }

  @Override
  public List<String> plannedFiles() {
    return List.of(path(options.qualifiedName()));
  }

  @Override
  public String stem() {
    return options.className();
  }

  @Override
  public JavaEmission emit(Classifier model, HeaderInfo header) throws InputException {
    return new JavaEmission(LayoutChooser.resolve(model, options, header, verifier.compiler()));
  }

  @Override
  public List<BudgetUnit> budgetUnits() {
    return BUDGET_UNITS;
  }

  /**
   * {@inheritDoc}
   *
   * @throws IllegalArgumentException if {@code unit} counts DEX bytes but this language was made
   *     without a minimum API level
   */
  @Override
  public SearchMeter<JavaEmission> searchMeter(BudgetUnit unit) {
    if (unit == BudgetUnit.DEX && dexMinApi.isEmpty()) {
      throw new IllegalArgumentException("a DEX budget needs a minimum API level");
    }
    // D8 is loaded only when the budget counts DEX bytes.
    Optional<DexMeter> dex = unit == BudgetUnit.DEX
        ? Optional.of(DexMeter.forMinApi(dexMinApi.getAsInt())) : Optional.empty();
    return new JavaSearchMeter(unit, options, verifier, dex)
        .mapped(JavaEmission::new, JavaEmission::choice);
  }

  @Override
  public VerificationResult verify(Classifier tree, JavaEmission emission, List<Dataset> rows,
      long seed) {
    LayoutChoice choice = emission.choice();
    return verifier.check(tree, choice.classes(), choice.source(), choice.options(), rows, seed);
  }

  @Override
  public SizeFigures measure(JavaEmission emission) {
    EmittedSource source = emission.source();
    byte[] bytes = emission.choice().classes().bytes(source.qualifiedName());
    ClassFileInfo info = ClassFileInfo.parse(bytes);
    // D8 is loaded only here, and only when DEX sizes were asked for.
    Optional<DexSizes> dex = dexMinApi.isPresent()
        ? Optional.of(DexMeter.forMinApi(dexMinApi.getAsInt())
            .measure(emission.choice().classes(), source.qualifiedName()))
        : Optional.empty();
    return figures(source, bytes.length, DebugSizes.noDebug(source),
        Verifier.largestPerCallMethod(info), emission.choice().options().maxMethodBytes(),
        info.constantPoolCount(), info.methods(), dex);
  }

  private static SizeFigures figures(EmittedSource source, int classFileBytes, int noDebugBytes,
      int maxMethodBytes, int methodByteCap, int constantPoolCount, List<MethodSize> methods,
      Optional<DexSizes> dex) {
    String dexText = dex.map(d -> String.format(Locale.ROOT,
        ", DEX %d bytes at min-api %d (an empty class %d, the classifier %d more)",
        d.dexBytes(), d.minApi(), d.emptyClassBytes(), d.classifierBytes())).orElse("");
    String summary = String.format(Locale.ROOT, "size: source %d bytes, class file %d bytes (%d "
        + "without debug info)%s, largest method %d bytecode bytes", source.sourceBytes(),
        classFileBytes, noDebugBytes, dexText, maxMethodBytes);
    return new SizeFigures(source.sourceBytes(), Optional.of(new SizeFigures.JavaFigures(
        classFileBytes, noDebugBytes, maxMethodBytes, methodByteCap, constantPoolCount,
        methods.stream().map(m -> new CompileReport.MethodBytes(m.name(), m.codeLength()))
            .toList(), dex)), Optional.empty(), summary);
  }
}
