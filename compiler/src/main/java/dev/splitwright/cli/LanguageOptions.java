package dev.splitwright.cli;

import dev.splitwright.backend.Languages;
import dev.splitwright.backend.OutputLanguage;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.verify.Verifier;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.OptionalInt;
import picocli.CommandLine;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;

/** The {@code compile} options choosing the output language, mixed into {@link CompileCommand}. */
final class LanguageOptions {
  /** Options that shape Java alone; given with {@code --emit c} they are refused. */
  static final List<String> JAVA_ONLY = List.of("--package", "--named-args", "--max-method-bytes",
      "--dex-size", "--min-api");
  private static final List<String> C_ONLY = List.of("--host-cc", "--cc", "--cflags");

  @Option(names = "--emit", defaultValue = "java", paramLabel = "LANGUAGE",
      description = "Language of the emitted classifier: java, or c for <out>/<base>.h and "
          + "<out>/<base>.c in C99, <base> being the class name in snake case "
          + "(default: ${DEFAULT-VALUE}).")
  String emit;

  @Option(names = "--host-cc", defaultValue = "cc", paramLabel = "CMD",
      description = "With --emit c: the compiler that builds and runs the check of the C code "
          + "on this machine (default: ${DEFAULT-VALUE}).")
  String hostCc;

  @Option(names = "--cc", paramLabel = "CMD",
      description = "With --emit c: the compiler whose object file is measured, e.g. "
          + "arm-none-eabi-gcc (default: --host-cc).")
  String cc;

  @Option(names = "--cflags", defaultValue = "-Os", paramLabel = "FLAGS",
      description = "With --emit c: the flags of the measured object file, e.g. \"-mcpu=cortex-m4 "
          + "-mthumb -Os\" (default: ${DEFAULT-VALUE}).")
  String cflags;

  /** The language's name, checked; throws naming {@code --emit}. */
  String name(CommandLine cli) {
    String name = emit.strip().toLowerCase(Locale.ROOT);
    if (!Languages.NAMES.contains(name)) {
      throw new ParameterException(cli, "option '--emit' must be " + String.join(" or ",
          Languages.NAMES) + ", but it is '" + emit + "'");
    }
    return name;
  }

  /**
   * Refuses options that mean nothing for the chosen language; runs before any data is read.
   *
   * @throws ParameterException naming the first such option
   */
  void checkOptions(CommandLine cli) {
    boolean c = name(cli).equals("c");
    for (String option : c ? JAVA_ONLY : C_ONLY) {
      if (cli.getParseResult().hasMatchedOption(option)) {
        throw new ParameterException(cli, "option '" + option + "' "
            + (!c ? "only applies together with --emit c"
                : "shapes Java code and means nothing with --emit c"));
      }
    }
  }

  /**
   * The output language; for C the compilers are looked up here.
   *
   * @throws InputException naming {@code --host-cc} or {@code --cc} if one is not found
   */
  OutputLanguage<?> language(CommandLine cli, EmitOptions options, OptionalInt dexMinApi,
      Verifier verifier) throws InputException {
    if (name(cli).equals("java")) {
      return Languages.java(options, verifier, dexMinApi);
    }
    return Languages.c(options, new Languages.CTools(hostCc, cc == null ? hostCc : cc, flags()));
  }

  private List<String> flags() {
    String text = cflags.strip();
    return text.isEmpty() ? List.of() : Arrays.asList(text.split("\\s+"));
  }

  /** The options that reproduce the emitted files, without paths; none for Java. */
  List<String> optionsText(CommandLine cli) {
    List<String> parts = new ArrayList<>();
    if (name(cli).equals("c")) {
      parts.add("--emit c");
      if (cc != null) {
        parts.add("--cc " + Path.of(cc).getFileName());
      }
      parts.add("--cflags \"" + String.join(" ", flags()) + "\"");
    }
    return parts;
  }
}
