package dev.splitwright.backend;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CEmitter;
import dev.splitwright.cgen.CHarness;
import dev.splitwright.cgen.CSource;
import dev.splitwright.cgen.HarnessData;
import dev.splitwright.check.CCompileException;
import dev.splitwright.check.CCompiler;
import dev.splitwright.check.ElfFile;
import dev.splitwright.check.ElfSymbol;
import dev.splitwright.check.NativeExecutable;
import dev.splitwright.check.NativeRun;
import dev.splitwright.check.ObjectFiles;
import dev.splitwright.check.ProcessTimeoutException;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitLimitException;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.model.Classifier;
import dev.splitwright.onchip.OnChipProof;
import dev.splitwright.report.CompileReport;
import dev.splitwright.select.BudgetUnit;
import dev.splitwright.select.SearchMeter;
import dev.splitwright.verify.BatchVerifier;
import dev.splitwright.verify.VerificationResult;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * C99: a header and a source file emitted by {@link CEmitter}. The check builds them with a
 * generated harness by the host compiler and runs that program on the verification inputs, handed
 * over as raw IEEE 754 bit patterns; the size is the flash bytes of the object file the target
 * compiler writes, read from its ELF section headers. With an {@link OnChipStage} the check then
 * proves the same files over the same inputs on emulated Cortex-M cores.
 */
public final class CLanguage implements OutputLanguage<CLanguage.CEmission> {
  /** Flags of the host build that is checked: C99, no contraction of a*b+c, every warning. */
  public static final List<String> VERIFY_FLAGS = List.of("-std=c99", "-O2",
      "-ffp-contract=off", "-Wall", "-Wextra", "-Wpedantic", "-Wconversion", "-Wshadow",
      "-Werror");
  /** Flags of the measured object file unless {@code --cflags} says otherwise. */
  public static final List<String> DEFAULT_CFLAGS = List.of("-Os");
  /** What a C budget may count: flash bytes of the object file. */
  public static final List<BudgetUnit> BUDGET_UNITS = List.of(BudgetUnit.FLASH);
  /** Time limit of one compiler or harness run; a loaded machine needs generous ones. */
  static final Duration TIMEOUT = Duration.ofMinutes(5);

  private final CEmitOptions options;
  private final boolean smallest;
  private final CCompiler host;
  private final CCompiler target;
  private final Optional<OnChipStage> onChip;
  private String hostVersion;
  private List<CompileReport.OnChip> onChipProofs = List.of();

  /**
   * C emitted with {@code options} (its layout is ignored when {@code smallest}), checked with
   * {@code host} (which should use {@link #VERIFY_FLAGS}) and measured with {@code target}.
   */
  public CLanguage(CEmitOptions options, boolean smallest, CCompiler host, CCompiler target) {
    this(options, smallest, host, target, Optional.empty());
  }

  /**
   * C as above whose check, once the host proof passed, goes on to prove the same files on
   * emulated Cortex-M cores with {@code onChip}.
   */
  public CLanguage(CEmitOptions options, boolean smallest, CCompiler host, CCompiler target,
      Optional<OnChipStage> onChip) {
    this.options = Objects.requireNonNull(options, "options");
    this.smallest = smallest;
    this.host = Objects.requireNonNull(host, "host");
    this.target = Objects.requireNonNull(target, "target");
    this.onChip = Objects.requireNonNull(onChip, "onChip");
  }

  /**
   * The emitted files and the object file measured for them.
   *
   * @param flashByLayout flash bytes of every layout measured to choose this one, in layout order
   */
  public record CEmission(CSource source, CEmitOptions options, ElfFile object,
      Map<Layout, Long> flashByLayout) implements Emission {

    public CEmission {
      Objects.requireNonNull(source, "source");
      Objects.requireNonNull(options, "options");
      Objects.requireNonNull(object, "object");
      flashByLayout = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(flashByLayout));
    }

    @Override
    public List<OutputText> files() {
      return List.of(new OutputText(source.headerName(), source.headerText()),
          new OutputText(source.sourceName(), source.sourceText()));
    }

    @Override
    public String layout() {
      return options.layout().optionName();
    }

    @Override
    public String input() {
      return options.inputKind().optionName();
    }
  }

  @Override
  public String name() {
    return "c";
  }

  @Override
  public List<String> plannedFiles() {
    return List.of(options.baseName() + ".h", options.baseName() + ".c");
  }

  @Override
  public String stem() {
    return options.baseName();
  }

  /** The compiler and flags that measure flash. */
  public CCompiler target() {
    return target;
  }

  @Override
  public List<BudgetUnit> budgetUnits() {
    return BUDGET_UNITS;
  }

  @Override
  public SearchMeter<CEmission> searchMeter(BudgetUnit unit) {
    if (unit != BudgetUnit.FLASH) {
      throw new IllegalArgumentException("C is measured in flash bytes, not " + unit);
    }
    return new CSearchMeter(this, variants());
  }

  /** The options of every layout measured: both with {@code smallest}, else the one asked for. */
  private List<CEmitOptions> variants() {
    return smallest
        ? List.of(options.withLayout(Layout.BRANCHES), options.withLayout(Layout.TABLE))
        : List.of(options);
  }

  @Override
  public CEmission emit(Classifier tree, HeaderInfo header) throws InputException {
    List<CEmitOptions> variants = variants();
    List<CSource> sources = new ArrayList<>();
    for (CEmitOptions v : variants) {
      try {
        sources.add(CEmitter.emit(tree, v, header));
      } catch (EmitLimitException e) {
        throw new InputException(e.option(), e.problem(), e.remedy());
      }
    }
    List<ElfFile> objects = compile(sources);
    Map<Layout, Long> flash = new LinkedHashMap<>();
    for (int i = 0; i < sources.size(); i++) {
      flash.put(variants.get(i).layout(), objects.get(i).flashBytes());
    }
    int best = leastFlash(objects, 0, objects.size());
    return new CEmission(sources.get(best), variants.get(best), objects.get(best),
        smallest ? flash : Map.of());
  }

  /**
   * The position in {@code [from, to)} of the object with the least flash; the first on a tie, so
   * that branches, listed first, is kept unless a table is strictly smaller.
   */
  static int leastFlash(List<ElfFile> objects, int from, int to) {
    int best = from;
    for (int i = from + 1; i < to; i++) {
      if (objects.get(i).flashBytes() < objects.get(best).flashBytes()) {
        best = i;
      }
    }
    return best;
  }

  /**
   * Compiles each source to an object file with the target compiler, all in one run: with more
   * than one, each pair of files gets its own names ({@code u0.c} including {@code u0.h}, ...),
   * which changes no allocated section.
   *
   * @throws InputException naming {@code --cflags} if the target compiler rejects the files but
   *     the host compiler with {@link #VERIFY_FLAGS} accepts them: the flags or the compiler are
   *     at fault, not the code
   * @throws IllegalStateException if the host compiler rejects them too: a bug of ours
   */
  public List<ElfFile> compile(List<CSource> sources) throws InputException {
    Map<String, String> files = new LinkedHashMap<>();
    List<String> units = new ArrayList<>();
    for (int i = 0; i < sources.size(); i++) {
      CSource s = sources.get(i);
      if (sources.size() == 1) {
        files.put(s.headerName(), s.headerText());
        files.put(s.sourceName(), s.sourceText());
        units.add(s.sourceName());
        continue;
      }
      String unit = "u" + i;
      files.put(unit + ".h", s.headerText());
      files.put(unit + ".c", s.sourceText().replace("#include \"" + s.headerName() + "\"",
          "#include \"" + unit + ".h\""));
      units.add(unit + ".c");
    }
    ObjectFiles objects;
    try {
      objects = target.compileObjects(files);
    } catch (CCompileException e) {
      requireHostAccepts(files);
      throw new InputException("cflags", "the emitted C does not compile with " + target.command()
          + " " + String.join(" ", target.flags()) + ": " + e.firstErrorLine(),
          "check --cc and --cflags; the host compiler accepts the same files");
    } catch (ProcessTimeoutException e) {
      throw new IllegalStateException(e.getMessage(), e);
    }
    List<ElfFile> out = new ArrayList<>();
    for (String unit : units) {
      out.add(objects.elf(unit));
    }
    return out;
  }

  private void requireHostAccepts(Map<String, String> files) {
    try {
      host.compileObjects(files);
    } catch (CCompileException e) {
      throw new IllegalStateException("the emitted C does not compile with " + host.command()
          + ": " + e.firstErrorLine(), e);
    } catch (ProcessTimeoutException e) {
      throw new IllegalStateException(e.getMessage(), e);
    }
  }

  /**
   * {@inheritDoc}
   *
   * <p>When the host proof passed and cores were named, the same files and inputs are proved on
   * each emulated core in turn; a core with a mismatch fails the check with that core's figures
   * and first mismatches, each naming the core.
   *
   * @throws InputException naming {@code --cflags} if the cross compiler rejects a proof image
   * @throws UnfinishedProofException if a proof image runs past its time limit or fails
   */
  @Override
  public VerificationResult verify(Classifier tree, CEmission emission, List<Dataset> rows,
      long seed) throws InputException {
    VerificationResult onHost = verifyOnHost(tree, emission, rows, seed);
    onChipProofs = List.of();
    if (!onHost.passed() || onChip.isEmpty()) {
      return onHost;
    }
    BatchVerifier.Inputs inputs =
        BatchVerifier.inputs(tree, emission.options().inputKind(), rows, seed);
    List<OnChipProof> proofs =
        onChip.get().prove(tree, emission.source(), emission.options(), inputs);
    for (OnChipProof proof : proofs) {
      if (!proof.passed()) {
        List<String> described = new ArrayList<>();
        for (String mismatch : proof.firstMismatches()) {
          described.add("on " + proof.core() + " (" + proof.board() + "): " + mismatch);
        }
        return new VerificationResult(proof.inputsChecked(), proof.mismatches(), described,
            onHost.splits(), onHost.coveredSplits(), 0, 0, 0, List.of(), 0, List.of());
      }
    }
    onChipProofs = proofs.stream().map(OnChipStage::reported).toList();
    return onHost;
  }

  @Override
  public List<CompileReport.OnChip> onChipProofs() {
    return onChipProofs;
  }

  private VerificationResult verifyOnHost(Classifier tree, CEmission emission,
      List<Dataset> rows, long seed) {
    CEmitOptions used = emission.options();
    Map<String, String> files = new LinkedHashMap<>();
    files.put(emission.source().headerName(), emission.source().headerText());
    files.put(emission.source().sourceName(), emission.source().sourceText());
    files.put(CHarness.fileName(used), CHarness.source(used));
    try (NativeExecutable program = host.buildExecutable(files)) {
      if (hostVersion == null) {
        hostVersion = host.version();
      }
      int classes = tree.schema().classCount();
      int features = tree.schema().featureCount();
      return BatchVerifier.check(tree, used.inputKind(), used.probabilities(), rows, seed,
          new BatchVerifier.BatchClassifier() {
            @Override
            public BatchVerifier.Answers floats(List<float[]> inputs) {
              return run(program, HarnessData.packFloats(inputs, features), inputs.size(),
                  classes, features, used);
            }

            @Override
            public BatchVerifier.Answers ints(List<int[]> inputs) {
              return run(program, HarnessData.packInts(inputs, features), inputs.size(),
                  classes, features, used);
            }
          });
    } catch (CCompileException e) {
      throw new IllegalStateException("the emitted C does not compile with " + host.command()
          + ": " + e.firstErrorLine(), e);
    } catch (ProcessTimeoutException e) {
      throw new IllegalStateException(e.getMessage(), e);
    }
  }

  private static BatchVerifier.Answers run(NativeExecutable program, byte[] input, int rows,
      int classes, int features, CEmitOptions used) {
    Path dir = program.path().getParent();
    Path in = dir.resolve("inputs.bin");
    Path out = dir.resolve("outputs.bin");
    try {
      Files.write(in, input);
      NativeRun run = program.run(List.of(in.toString(), out.toString()), new byte[0], TIMEOUT);
      if (!run.succeeded()) {
        throw new IllegalStateException("the verification harness exited with "
            + run.exitCode() + ": " + run.stderr().strip());
      }
      HarnessData.Output output = HarnessData.readOutput(Files.readAllBytes(out), rows,
          classes, features, used);
      return new BatchVerifier.Answers(output.classes(), output.probabilities());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (ProcessTimeoutException e) {
      throw new IllegalStateException(e.getMessage(), e);
    }
  }

  @Override
  public Optional<CompileReport.Compiler> verifyingCompiler() {
    return hostVersion == null
        ? Optional.empty()
        : Optional.of(new CompileReport.Compiler(hostVersion, host.flags()));
  }

  @Override
  public SizeFigures measure(CEmission emission) {
    ElfFile elf = emission.object();
    Map<String, Long> sections = new LinkedHashMap<>();
    elf.sections().stream()
        .filter(s -> s.isFlash() && s.size() > 0)
        .sorted(Comparator.comparing(s -> s.name()))
        .forEach(s -> sections.merge(s.name(), s.size(), Long::sum));
    Map<String, Long> functions = new LinkedHashMap<>();
    elf.functions().stream()
        .sorted(Comparator.comparing(ElfSymbol::name))
        .forEach(f -> functions.merge(f.name(), f.size(), Long::sum));
    String version;
    try {
      version = target.version();
    } catch (CCompileException | ProcessTimeoutException e) {
      version = target.command();
    }
    CompileReport.Flash flash = new CompileReport.Flash(version, target.flags(),
        elf.flashBytes(), sections, functions, layoutSizes(emission));
    String summary = String.format(Locale.ROOT, "size: %s %d bytes, %s %d bytes, flash %d bytes "
        + "(%s %s)", emission.source().headerName(), emission.files().get(0).bytes(),
        emission.source().sourceName(), emission.files().get(1).bytes(), elf.flashBytes(),
        target.command(), String.join(" ", target.flags()));
    return new SizeFigures(emission.sourceBytes(), Optional.empty(), Optional.of(flash),
        summary);
  }

  private static Map<String, Long> layoutSizes(CEmission emission) {
    Map<String, Long> out = new LinkedHashMap<>();
    emission.flashByLayout().forEach((layout, bytes) -> out.put(layout.optionName(), bytes));
    return out.isEmpty() ? null : out;
  }

  /** {@code int} input in C is {@code int32_t}; there is no double input. */
  static boolean supports(InputKind kind) {
    return kind == InputKind.FLOAT || kind == InputKind.INT;
  }
}
