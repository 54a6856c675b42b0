package dev.splitwright.onchip;

import dev.splitwright.cgen.CEmitOptions;
import dev.splitwright.cgen.CSource;
import dev.splitwright.check.BareMetalImage;
import dev.splitwright.check.CCompileException;
import dev.splitwright.check.CCompiler;
import dev.splitwright.check.CCompilerNotFoundException;
import dev.splitwright.check.CortexMProfile;
import dev.splitwright.check.CortexMToolchain;
import dev.splitwright.check.ElfFile;
import dev.splitwright.check.ElfSymbol;
import dev.splitwright.check.ProcessTimeoutException;
import dev.splitwright.emit.InputKind;
import java.time.Duration;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;
import java.util.stream.Collectors;

/**
 * Measures the flash an emitted C classifier takes on a Cortex-M core ({@link FlashCost}): its
 * object file built with the core's flags by {@value CortexMToolchain#COMPILER}, and two minimal
 * images linked with and without it, whose difference shows the libgcc helpers it pulls in.
 */
public final class CoreFlash {
  private static final String MAIN = "flash_main.c";

  private CoreFlash() {}

  /**
   * Measures {@code source} on {@code profile}.
   *
   * @param codeFlags the caller's compiler options, with one optimisation level (see {@link
   *     CortexMProfile#compilerFlags})
   * @param buildLimit time limit of each compiler run
   * @throws CCompileException if the cross compiler or the linker rejects the sources
   * @throws ProcessTimeoutException if a build runs past {@code buildLimit}
   */
  public static FlashCost measure(CortexMToolchain arm, CSource source, CEmitOptions options,
      CortexMProfile profile, List<String> codeFlags, Duration buildLimit)
      throws CCompileException, ProcessTimeoutException {
    Objects.requireNonNull(arm, "arm");
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(options, "options");
    Objects.requireNonNull(profile, "profile");
    Objects.requireNonNull(buildLimit, "buildLimit");
    List<String> flags = profile.compilerFlags(codeFlags);
    Map<String, String> classifier = new LinkedHashMap<>();
    classifier.put(source.headerName(), source.headerText());
    classifier.put(source.sourceName(), source.sourceText());
    CCompiler compiler;
    try {
      compiler = CCompiler.find(CortexMToolchain.COMPILER, flags, buildLimit);
    } catch (CCompilerNotFoundException e) {
      // The toolchain found it on PATH already.
      throw new IllegalStateException(e.getMessage(), e);
    }
    ElfFile object = compiler.compileObjects(classifier).elf(source.sourceName());

    long without;
    Set<String> baseFunctions;
    try (BareMetalImage image = arm.build(profile, codeFlags,
        Map.of(MAIN, "#include \"" + CortexMToolchain.HEADER + "\"\n\n"
            + "int main(void)\n{\n    return 0;\n}\n"))) {
      without = image.flashBytes();
      baseFunctions = names(image.elf().functions());
    }
    Map<String, String> with = new LinkedHashMap<>(classifier);
    with.put(MAIN, caller(options));
    try (BareMetalImage image = arm.build(profile, codeFlags, with)) {
      Set<String> own = names(object.functions());
      List<ElfSymbol> helpers = image.elf().functions().stream()
          .filter(f -> !baseFunctions.contains(f.name()) && !own.contains(f.name())
              && !f.name().equals("main"))
          .toList();
      return new FlashCost(profile.id(), flags, object.flashBytes(), without,
          image.flashBytes(), helpers.stream().map(ElfSymbol::name).sorted().distinct().toList(),
          coveredBytes(helpers));
    }
  }

  /**
   * A {@code main} that calls what the options emit, on an input the compiler cannot see through
   * (a volatile pointer), so nothing is folded away.
   */
  static String caller(CEmitOptions options) {
    String p = options.baseName();
    String m = options.macroPrefix();
    String element = options.inputKind() == InputKind.INT ? "int32_t" : "float";
    StringBuilder out = new StringBuilder()
        .append("#include \"").append(CortexMToolchain.HEADER).append("\"\n")
        .append("#include \"").append(p).append(".h\"\n\n")
        .append("static ").append(element).append(" input[").append(m)
        .append("_FEATURE_COUNT];\n")
        .append("static const ").append(element).append(" *volatile at = input;\n");
    if (options.probabilities()) {
      out.append("static float frequencies[").append(m).append("_CLASS_COUNT];\n")
          .append("static float *volatile into = frequencies;\n");
    }
    if (!options.bare()) {
      out.append("static const char *volatile text;\n");
    }
    out.append("\nint main(void)\n{\n    int c = ").append(p).append("_classify(at);\n");
    if (options.probabilities()) {
      out.append("    ").append(p).append("_probabilities(at, into);\n");
    }
    if (!options.bare()) {
      out.append("    text = ").append(p).append("_label(c);\n")
          .append("    text = ").append(p).append("_feature_name(c);\n");
    }
    return out.append("    return c;\n}\n").toString();
  }

  /**
   * Bytes the functions span, each byte once: libgcc gives one body several names (e.g. {@code
   * __aeabi_fcmple} beside {@code __lesf2} entry points), and their sizes overlap.
   */
  static long coveredBytes(List<ElfSymbol> functions) {
    // Start address (Thumb bit cleared) to the furthest end seen from there.
    TreeMap<Long, Long> ranges = new TreeMap<>();
    for (ElfSymbol f : functions) {
      long start = f.value() & ~1L;
      ranges.merge(start, start + f.size(), Long::max);
    }
    long covered = 0;
    long reached = Long.MIN_VALUE;
    for (Map.Entry<Long, Long> range : ranges.entrySet()) {
      long from = Math.max(range.getKey(), reached);
      if (range.getValue() > from) {
        covered += range.getValue() - from;
        reached = range.getValue();
      }
    }
    return covered;
  }

  private static Set<String> names(List<ElfSymbol> functions) {
    return functions.stream().map(ElfSymbol::name).collect(Collectors.toSet());
  }
}
