package dev.splitwright.backend;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CNames;
import dev.splitwright.check.CCompiler;
import dev.splitwright.check.CCompilerNotFoundException;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.Layout;
import dev.splitwright.select.BudgetUnit;
import dev.splitwright.verify.Verifier;
import java.util.List;
import java.util.Objects;
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
   * C with the name, layout, input type and extras of {@code options}: the files are {@code
   * <base>.h} and {@code <base>.c}, the base name made from the class name.
   *
   * @throws InputException naming {@code --class}, {@code --input}, {@code --host-cc}, {@code
   *     --cc} or {@code --cflags} if that option cannot work; the compilers are looked up here,
   *     before any data is read
   */
  public static OutputLanguage<?> c(EmitOptions options, CTools tools) throws InputException {
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
    return new CLanguage(c, smallest, host, target);
  }

  private static CCompiler find(String option, String command, List<String> flags)
      throws InputException {
    try {
      return CCompiler.find(command, flags, CLanguage.TIMEOUT);
    } catch (CCompilerNotFoundException e) {
      throw new InputException(option, "no C compiler '" + command + "' found",
          "install one or name it with --" + option + " (a command on PATH or a path)");
    } catch (IllegalArgumentException e) {
      throw new InputException(option.equals("cc") ? "cflags" : option, e.getMessage(),
          "leave out -c, -S, -E and -o; the output is chosen by Splitwright");
    }
  }
}
