package dev.splitwright.check;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Builds C sources into bare-metal images for emulated Arm Cortex-M boards ({@code
 * arm-none-eabi-gcc}) and runs them ({@code qemu-system-arm}, see {@link BareMetalImage#run}).
 *
 * <p>The caller's sources define {@code int main(void)} and include {@value #HEADER}, which
 * declares file input and output over Arm semihosting, exit, a console line and an instruction
 * counter. The toolchain adds the harness: start-up code and vector table ({@code sw_runtime.c})
 * and a linker script ({@code sw_image.ld}). No C library is linked, only libgcc, whose helpers
 * (soft-float {@code __aeabi_f*}, division) the compiler calls on its own; so the flash an image
 * takes is harness plus caller code plus exactly the helpers that code needs.
 *
 * <p>Instances are immutable and may be shared between threads.
 */
public final class CortexMToolchain {

  /** The cross compiler looked up by {@link #find(Duration)}. */
  public static final String COMPILER = "arm-none-eabi-gcc";

  /** The emulator looked up by {@link #find(Duration)}. */
  public static final String EMULATOR = "qemu-system-arm";

  /** The header the caller's sources include for semihosting input and output. */
  public static final String HEADER = "sw_io.h";

  static final String RUNTIME = "sw_runtime.c";
  static final String LINKER_SCRIPT = "sw_image.ld";

  /** Link options of every image, after the sources. */
  public static final List<String> LINK_FLAGS =
      List.of("-nostdlib", "-T", LINKER_SCRIPT, "-Wl,--gc-sections", "-lgcc");

  private static final List<String> COMPILER_PACKAGES =
      List.of("gcc-arm-none-eabi", "binutils-arm-none-eabi");
  private static final List<String> EMULATOR_PACKAGES = List.of("qemu-system-arm");

  private static final Map<String, String> HARNESS = loadHarness();

  private final String compilerCommand;
  private final Path emulator;
  private final Duration buildTimeout;

  private CortexMToolchain(String compilerCommand, Path emulator, Duration buildTimeout) {
    this.compilerCommand = compilerCommand;
    this.emulator = emulator;
    this.buildTimeout = buildTimeout;
  }

  /**
   * Looks up {@value #COMPILER} and {@value #EMULATOR} on {@code PATH}.
   *
   * @param buildTimeout time limit of each compiler run
   * @throws ArmToolNotFoundException if either is missing; it names the Debian package to install
   */
  public static CortexMToolchain find(Duration buildTimeout) throws ArmToolNotFoundException {
    return find(COMPILER, EMULATOR, buildTimeout);
  }

  /**
   * Looks up a cross compiler and an emulator given by name on {@code PATH} or by path.
   *
   * @throws ArmToolNotFoundException if either is missing, the compiler checked first
   */
  public static CortexMToolchain find(String compiler, String emulator, Duration buildTimeout)
      throws ArmToolNotFoundException {
    Objects.requireNonNull(compiler, "compiler");
    Objects.requireNonNull(emulator, "emulator");
    Objects.requireNonNull(buildTimeout, "buildTimeout");
    if (compiler.isBlank() || emulator.isBlank()) {
      throw new IllegalArgumentException("compiler and emulator must not be blank");
    }
    if (buildTimeout.isNegative() || buildTimeout.isZero()) {
      throw new IllegalArgumentException(
          "buildTimeout must be positive, but it is " + buildTimeout);
    }
    if (ExecutableLookup.find(compiler).isEmpty()) {
      throw new ArmToolNotFoundException(
          compiler, ExecutableLookup.whereNotFound(compiler), COMPILER_PACKAGES);
    }
    Path emulatorPath =
        ExecutableLookup.find(emulator)
            .orElseThrow(
                () ->
                    new ArmToolNotFoundException(
                        emulator, ExecutableLookup.whereNotFound(emulator), EMULATOR_PACKAGES));
    return new CortexMToolchain(compiler, emulatorPath, buildTimeout);
  }

  /**
   * Looks up the cross compiler alone, given by name on {@code PATH} or by path, for a run that
   * builds for a core but emulates nothing.
   *
   * @throws ArmToolNotFoundException if it is missing; it names the Debian packages to install
   */
  public static void requireCompiler(String compiler) throws ArmToolNotFoundException {
    Objects.requireNonNull(compiler, "compiler");
    if (compiler.isBlank()) {
      throw new IllegalArgumentException("compiler must not be blank");
    }
    if (ExecutableLookup.find(compiler).isEmpty()) {
      throw new ArmToolNotFoundException(
          compiler, ExecutableLookup.whereNotFound(compiler), COMPILER_PACKAGES);
    }
  }

  /** The emulator's executable file. */
  public Path emulator() {
    return emulator;
  }

  /**
   * The harness files added to every build, by name: {@value #HEADER}, {@code sw_runtime.c} and
   * {@code sw_image.ld}, e.g. to archive them next to a report.
   */
  public static Map<String, String> harnessFiles() {
    return HARNESS;
  }

  /**
   * Compiles and links the sources with the harness into an image for {@code profile} ({@code
   * arm-none-eabi-gcc compilerFlags -o program sources... LINK_FLAGS}).
   *
   * @param codeFlags the caller's compiler options, see {@link CortexMProfile#compilerFlags}
   * @param sources file name (plain, ending in {@code .c} or {@code .h}) to text; one of them
   *     defines {@code int main(void)}; none may be named like a harness file
   * @throws CCompileException if the compiler or the linker rejects the sources
   * @throws ProcessTimeoutException if the build runs longer than the time limit
   */
  public BareMetalImage build(
      CortexMProfile profile, List<String> codeFlags, Map<String, String> sources)
      throws CCompileException, ProcessTimeoutException {
    Objects.requireNonNull(profile, "profile");
    Objects.requireNonNull(sources, "sources");
    List<String> flags = profile.compilerFlags(codeFlags);
    Map<String, String> all = new LinkedHashMap<>(sources);
    for (Map.Entry<String, String> file : HARNESS.entrySet()) {
      if (all.putIfAbsent(file.getKey(), file.getValue()) != null) {
        throw new IllegalArgumentException(
            "source file name \"" + file.getKey() + "\" is taken by the harness; harness files are "
                + HARNESS.keySet());
      }
    }
    CCompiler compiler;
    try {
      compiler = CCompiler.find(compilerCommand, flags, buildTimeout);
    } catch (CCompilerNotFoundException e) {
      // It was there when this toolchain was found.
      throw new IllegalStateException(e.getMessage(), e);
    }
    NativeExecutable program = compiler.buildExecutable(all, LINK_FLAGS);
    try {
      return new BareMetalImage(profile, flags, program, ElfFile.read(program.path()), emulator);
    } catch (IOException | RuntimeException e) {
      program.close();
      if (e instanceof IOException io) {
        throw new UncheckedIOException("cannot read the linked image", io);
      }
      throw (RuntimeException) e;
    }
  }

  /**
   * The flash bytes ({@link ElfFile#flashBytes()}) of the linked image of the sources. Build two
   * images that differ in one function to learn what that function costs, libgcc helpers
   * included.
   *
   * @throws CCompileException if the compiler or the linker rejects the sources
   * @throws ProcessTimeoutException if the build runs longer than the time limit
   */
  public long linkedFlashBytes(
      CortexMProfile profile, List<String> codeFlags, Map<String, String> sources)
      throws CCompileException, ProcessTimeoutException {
    try (BareMetalImage image = build(profile, codeFlags, sources)) {
      return image.flashBytes();
    }
  }

  private static Map<String, String> loadHarness() {
    Map<String, String> files = new LinkedHashMap<>();
    for (String name : List.of(HEADER, RUNTIME, LINKER_SCRIPT)) {
      try (InputStream in = CortexMToolchain.class.getResourceAsStream("baremetal/" + name)) {
        if (in == null) {
          throw new IllegalStateException("harness file " + name + " is missing from the jar");
        }
        files.put(name, new String(in.readAllBytes(), StandardCharsets.UTF_8));
      } catch (IOException e) {
        throw new UncheckedIOException("cannot read harness file " + name, e);
      }
    }
    return Collections.unmodifiableMap(files);
  }
}
