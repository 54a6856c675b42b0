package dev.splitwright.cli;

import dev.splitwright.backend.Languages;
import dev.splitwright.backend.OutputLanguage;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.data.InputException;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.verify.Verifier;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import picocli.CommandLine;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;

/** The {@code compile} options choosing the output language, mixed into {@link CompileCommand}. */
final class LanguageOptions {
  /** Options that shape Java alone; given with {@code --emit c} they are refused. */
  static final List<String> JAVA_ONLY = List.of("--package", "--named-args", "--max-method-bytes",
      "--dex-size", "--min-api");
  private static final List<String> C_ONLY = List.of("--host-cc", "--cc", "--cflags", "--core",
      "--prove-on");
  /** Options that choose the target; with {@code --core} or {@code --prove-on} the core does. */
  private static final List<String> TARGET_FLAGS = List.of("-mcpu=", "-march=", "-mtune=",
      "-mfpu=", "-mfloat-abi=", "-mthumb", "-marm");
  private static final Pattern OPTIMISATION = Pattern.compile("-O.*");

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

  @Option(names = "--core", paramLabel = "CORE",
      description = "With --emit c: measure the flash with arm-none-eabi-gcc for this Cortex-M "
          + "core (cortex-m0plus, cortex-m3, cortex-m4f or cortex-m7) and its full flags; "
          + "--cflags adds to them, with -Os unless it gives an -O level. Not with --cc.")
  String core;

  @Option(names = "--prove-on", paramLabel = "CORE", split = ",",
      description = "With --emit c: after the check on this machine, build the C with a "
          + "bare-metal harness for each core (names as --core) and run it on qemu-system-arm "
          + "over the same inputs; any answer that differs from the model fails the run "
          + "(exit 1), as does an emulator run past 5 minutes.")
  List<String> proveOn = new ArrayList<>();

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
    if (!c) {
      return;
    }
    if (core != null && cc != null) {
      throw new ParameterException(cli, "option '--core' measures with "
          + CortexMToolchain.COMPILER + " and the core's flags; leave out --cc, or --core to "
          + "measure with --cc and --cflags");
    }
    // Unknown names are refused here, before any data is read.
    core(cli);
    cores(cli);
    if (core != null || !proveOn.isEmpty()) {
      for (String flag : flags()) {
        if (TARGET_FLAGS.stream().anyMatch(t -> t.endsWith("=") ? flag.startsWith(t)
            : flag.equals(t))) {
          throw new ParameterException(cli, "option '--cflags' chooses the target with " + flag
              + ", but with --core or --prove-on the core does; leave " + flag + " out");
        }
      }
    }
  }

  /** The {@code --core} profile; throws naming the option and listing the names it takes. */
  private Optional<CortexMProfile> core(CommandLine cli) {
    return core == null ? Optional.empty() : Optional.of(profile(cli, "--core", core));
  }

  /** The {@code --prove-on} profiles in the order given, each once. */
  private List<CortexMProfile> cores(CommandLine cli) {
    Set<CortexMProfile> profiles = new LinkedHashSet<>();
    for (String name : proveOn) {
      profiles.add(profile(cli, "--prove-on", name));
    }
    return List.copyOf(profiles);
  }

  private static CortexMProfile profile(CommandLine cli, String option, String name) {
    String id = name.strip().toLowerCase(Locale.ROOT);
    for (CortexMProfile p : CortexMProfile.values()) {
      if (p.id().equals(id)) {
        return p;
      }
    }
    throw new ParameterException(cli, "option '" + option + "' must be one of "
        + Arrays.stream(CortexMProfile.values()).map(CortexMProfile::id)
            .collect(Collectors.joining(", ")) + ", but it is '" + name + "'");
  }

  /**
   * The options after a core's own: {@code --cflags}, with {@code -Os} added when they give no
   * optimisation level, since a core's recorded flags must say how the code was optimised.
   */
  private List<String> codeFlags() {
    List<String> flags = new ArrayList<>(flags());
    if (flags.stream().noneMatch(f -> OPTIMISATION.matcher(f).matches())) {
      flags.add("-Os");
    }
    return List.copyOf(flags);
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
    return Languages.c(options, new Languages.CTools(hostCc, cc == null ? hostCc : cc, flags()),
        new Languages.Cores(core(cli), cores(cli), codeFlags()));
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
      if (core != null) {
        parts.add("--core " + core(cli).orElseThrow().id());
      }
      parts.add("--cflags \"" + String.join(" ", flags()) + "\"");
    }
    return parts;
  }
}
