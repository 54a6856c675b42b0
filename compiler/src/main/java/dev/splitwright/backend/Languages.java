package dev.splitwright.backend;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CNames;
import dev.splitwright.check.ArmToolNotFoundException;
import dev.splitwright.check.CCompiler;
import dev.splitwright.check.CCompilerNotFoundException;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.Layout;
import dev.splitwright.select.BudgetUnit;
import dev.splitwright.verify.Verifier;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;

/** Makes the {@link OutputLanguage} a run asks for: {@code --emit java} or {@code --emit c}. */
public final class Languages {
  /** The languages {@code --emit} accepts, the default first. */
  public static final List<String> NAMES = List.of("java", "c");

  private Languages() {}

  /**
   * What a budget may count for the language {@code name}, the default first, known before the
   * language is made (its compilers looked up).
   *
   * @throws IllegalArgumentException if {@code name} is not one of {@link #NAMES}
   */
  public static List<BudgetUnit> budgetUnits(String name) {
    return switch (name) {
      case "java" -> JavaLanguage.BUDGET_UNITS;
      case "c" -> CLanguage.BUDGET_UNITS;
      default -> throw new IllegalArgumentException("no language " + name);
    };
  }

  /** Java with {@code options}, checked and measured with {@code verifier}'s javac. */
  public static OutputLanguage<?> java(EmitOptions options, Verifier verifier,
      OptionalInt dexMinApi) {
    return new JavaLanguage(options, verifier, dexMinApi);
  }

  /**
   * The C toolchain of a run.
   *
   * @param hostCc the compiler that builds the checked program ({@code --host-cc})
   * @param cc the compiler whose object file is measured ({@code --cc}); may be a cross compiler
   * @param cflags the flags of the measured object file ({@code --cflags})
   */
  public record CTools(String hostCc, String cc, List<String> cflags) {

    public CTools {
      Objects.requireNonNull(hostCc, "hostCc");
      Objects.requireNonNull(cc, "cc");
      cflags = List.copyOf(cflags);
    }
  }

  /**
   * The emulated Cortex-M cores of a C run.
   *
   * @param core the core whose cross compiler and flags measure the flash ({@code --core})
   * @param proveOn the cores the files are proved on after the host ({@code --prove-on}), in
   *     order; empty for none
   * @param codeFlags the compiler options after each core's own ({@link
   *     CortexMProfile#compilerFlags}), with exactly one optimisation level
   */
  public record Cores(Optional<CortexMProfile> core, List<CortexMProfile> proveOn,
      List<String> codeFlags) {

    /** No core: the flash is measured by {@code --cc} and nothing runs on an emulator. */
    public static final Cores NONE = new Cores(Optional.empty(), List.of(), List.of());

    public Cores {
      Objects.requireNonNull(core, "core");
      proveOn = List.copyOf(proveOn);
      codeFlags = List.copyOf(codeFlags);
    }
  }

  /**
   * C with the name, layout, input type and extras of {@code options}: the files are {@code
   * <base>.h} and {@code <base>.c}, the base name made from the class name.
   *
   * @throws InputException naming {@code --class}, {@code --input}, {@code --host-cc}, {@code
   *     --cc} or {@code --cflags} if that option cannot work; the compilers are looked up here,
   *     before any data is read
   */
  public static OutputLanguage<?> c(EmitOptions options, CTools tools) throws InputException {
    return c(options, tools, Cores.NONE);
  }

  /**
   * C as {@link #c(EmitOptions, CTools)}, for Cortex-M cores: with {@code cores.core()} the flash
   * is measured by {@value CortexMToolchain#COMPILER} with that core's full flags instead of
   * {@code tools}' {@code cc} and {@code cflags}; with {@code cores.proveOn()} the check goes on to
   * prove the files on each emulated core ({@link OnChipStage}).
   *
   * @throws InputException naming {@code --core} or {@code --prove-on} if a tool they need is not
   *     installed (one line with the tool and the Debian package), or an option as {@link
   *     #c(EmitOptions, CTools)} does; every tool is looked up here, before any data is read
   */
  public static OutputLanguage<?> c(EmitOptions options, CTools tools, Cores cores)
      throws InputException {
    Objects.requireNonNull(cores, "cores");
    Optional<OnChipStage> stage = Optional.empty();
    CTools measuring = tools;
    try {
      // The flags first: a bad --cflags is named even where the tools are missing.
      cores.core().ifPresent(core -> core.compilerFlags(cores.codeFlags()));
      cores.proveOn().forEach(core -> core.compilerFlags(cores.codeFlags()));
      if (!cores.proveOn().isEmpty()) {
        CortexMToolchain arm;
        try {
          arm = CortexMToolchain.find(CLanguage.TIMEOUT);
        } catch (ArmToolNotFoundException e) {
          throw missing("prove-on", e);
        }
        stage = Optional.of(new OnChipStage(arm, cores.proveOn(), cores.codeFlags(),
            CLanguage.TIMEOUT));
      }
      if (cores.core().isPresent()) {
        try {
          CortexMToolchain.requireCompiler(CortexMToolchain.COMPILER);
        } catch (ArmToolNotFoundException e) {
          throw missing("core", e);
        }
        measuring = new CTools(tools.hostCc(), CortexMToolchain.COMPILER,
            cores.core().get().compilerFlags(cores.codeFlags()));
      }
    } catch (IllegalArgumentException e) {
      // The recorded flags must say how the code was optimised (CortexMProfile#compilerFlags).
      throw new InputException("cflags", "a core's build needs exactly one of -O0 -O1 -O2 -O3 "
          + "-Os -Oz -Og -O (not -Ofast, which gives up IEEE 754 semantics), but the flags are '"
          + String.join(" ", cores.codeFlags()) + "'", "give one optimisation level, e.g. -Os");
    }
    return c(options, measuring, stage);
  }

  private static OutputLanguage<?> c(EmitOptions options, CTools tools,
      Optional<OnChipStage> onChip) throws InputException {
    String base;
    try {
      base = CNames.baseName(options.className());
    } catch (IllegalArgumentException e) {
      throw new InputException("class", "'" + options.className() + "' gives no C base name: "
          + e.getMessage(), "use a class name of ASCII letters and digits, e.g. PumpClassifier");
    }
    if (!CLanguage.supports(options.inputKind())) {
      throw new InputException("input", "C takes float or int input, not "
          + options.inputKind().optionName(), "use --input float or --input int");
    }
    boolean smallest = options.layout() == Layout.SMALLEST;
    CEmitOptions c = new CEmitOptions(base, smallest ? Layout.BRANCHES : options.layout(),
        options.inputKind(), options.probabilities(), options.bare());
    CCompiler host = find("host-cc", tools.hostCc(), CLanguage.VERIFY_FLAGS);
    CCompiler target = find("cc", tools.cc(), tools.cflags());
    return new CLanguage(c, smallest, host, target, onChip);
  }

  /** One line naming the missing tool and the Debian packages that install it. */
  private static InputException missing(String option, ArmToolNotFoundException e) {
    return new InputException(option, "\"" + e.tool() + "\" is not installed (not found on "
        + "PATH)", "install the Debian package" + (e.debianPackages().size() == 1 ? " " : "s ")
        + String.join(" and ", e.debianPackages()) + ", e.g. apt-get install "
        + String.join(" ", e.debianPackages()));
  }

  /** The Debian package that ships {@code command}, by its file name; gcc for the unknown. */
  static String debianPackage(String command) {
    String name = Path.of(command).getFileName().toString();
    if (name.startsWith("arm-none-eabi-")) {
      return "gcc-arm-none-eabi";
    }
    if (name.startsWith("clang")) {
      return "clang";
    }
    return name.startsWith("g++") || name.startsWith("c++") ? "g++" : "gcc";
  }

  private static CCompiler find(String option, String command, List<String> flags)
      throws InputException {
    try {
      return CCompiler.find(command, flags, CLanguage.TIMEOUT);
    } catch (CCompilerNotFoundException e) {
      throw new InputException(option, "no C compiler '" + command + "' found",
          "install it (on Debian: apt-get install " + debianPackage(command) + ") or name "
              + "another with --" + option + " (a command on PATH or a path)");
    } catch (IllegalArgumentException e) {
      throw new InputException(option.equals("cc") ? "cflags" : option, e.getMessage(),
          "leave out -c, -S, -E and -o; the output is chosen by Splitwright");
    }
  }
}
