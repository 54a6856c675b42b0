package dev.splitwright.check;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * A C compiler with GCC-style options ({@code cc}, {@code gcc}, {@code clang}, {@code
 * arm-none-eabi-gcc} ...) run as a separate process. Each call writes the sources into a fresh
 * temporary directory, runs the compiler there under the time limit and deletes the directory, so
 * messages name the files as given ({@code a.c:3:5: error: ...}) and never a temporary path.
 *
 * <p>The compiler runs with {@code LC_ALL=C}, so its messages are in English and {@link
 * CCompileException#firstErrorLine()} can look for the word "error".
 *
 * <p>Instances are immutable and may be shared between threads.
 */
public final class CCompiler {

  // These choose what the compiler writes; the methods below set them themselves.
  private static final Set<String> OUTPUT_OPTIONS = Set.of("-c", "-S", "-E", "-o");

  private static final String PROGRAM = "program";

  private final String command;
  private final Path executable;
  private final List<String> flags;
  private final Duration timeout;

  private CCompiler(String command, Path executable, List<String> flags, Duration timeout) {
    this.command = command;
    this.executable = executable;
    this.flags = flags;
    this.timeout = timeout;
  }

  /**
   * Locates a C compiler.
   *
   * @param command a name looked up on {@code PATH} (e.g. {@code cc}) or a path to the compiler
   * @param flags options for every call, e.g. {@code -std=c99 -Os -ffunction-sections}; not {@code
   *     -c}, {@code -S}, {@code -E} or {@code -o}, which the methods choose
   * @param timeout time limit of each compiler run
   * @throws CCompilerNotFoundException if no executable file of that name exists
   */
  public static CCompiler find(String command, List<String> flags, Duration timeout)
      throws CCompilerNotFoundException {
    Objects.requireNonNull(command, "command");
    List<String> copy = List.copyOf(Objects.requireNonNull(flags, "flags"));
    Objects.requireNonNull(timeout, "timeout");
    if (command.isBlank()) {
      throw new IllegalArgumentException("command must not be blank");
    }
    for (String flag : copy) {
      if (OUTPUT_OPTIONS.contains(flag)) {
        throw new IllegalArgumentException(
            "flags must not contain " + flag + ": the compile methods choose the output");
      }
    }
    if (timeout.isNegative() || timeout.isZero()) {
      throw new IllegalArgumentException("timeout must be positive, but it is " + timeout);
    }
    return new CCompiler(command, resolve(command), copy, timeout);
  }

  /** The command as given to {@link #find}. */
  public String command() {
    return command;
  }

  /** The compiler's executable file, found on {@code PATH} or as given. */
  public Path executable() {
    return executable;
  }

  /** The options passed on every call. */
  public List<String> flags() {
    return flags;
  }

  /** The time limit of each compiler run. */
  public Duration timeout() {
    return timeout;
  }

  /**
   * The first line the compiler prints for {@code --version}, e.g. {@code gcc (Debian
   * 12.2.0-14) 12.2.0}.
   *
   * @throws CCompileException if the compiler exits with a non-zero status
   * @throws ProcessTimeoutException if it does not answer within the time limit
   */
  public String version() throws CCompileException, ProcessTimeoutException {
    try (TempDirectory directory = TempDirectory.create("splitwright-cc-")) {
      ProcessOutcome outcome = compile(directory, List.of("--version"));
      return new String(outcome.stdout(), StandardCharsets.UTF_8)
          .lines()
          .findFirst()
          .orElse("");
    }
  }

  /**
   * Compiles each {@code .c} file to an object file in one compiler run ({@code cc flags -c a.c
   * b.c ...}). gcc still runs its compiler proper once per file, so this saves only the driver's
   * start-up and the temporary directory per file: 40 small files at -Os took 12-16 s in one run
   * and 17-21 s in 40 runs (measured on a shared 2-core machine under load average 22; flash
   * bytes were identical). {@code .h} files are written next to them for {@code #include "..."}.
   *
   * @param sources file name (plain, ending in {@code .c} or {@code .h}) to text; at least one
   *     {@code .c}
   * @throws CCompileException if the compiler rejects the sources
   * @throws ProcessTimeoutException if it runs longer than the time limit
   */
  public ObjectFiles compileObjects(Map<String, String> sources)
      throws CCompileException, ProcessTimeoutException {
    CSources files = new CSources(sources);
    try (TempDirectory directory = TempDirectory.create("splitwright-cc-")) {
      files.writeTo(directory.path());
      List<String> args = new ArrayList<>(flags);
      args.add("-c");
      args.addAll(files.translationUnits());
      ProcessOutcome outcome = compile(directory, args);
      Map<String, byte[]> objects = new LinkedHashMap<>();
      for (String unit : files.translationUnits()) {
        Path object = directory.path().resolve(CSources.objectName(unit));
        try {
          objects.put(unit, Files.readAllBytes(object));
        } catch (IOException e) {
          throw new UncheckedIOException(
              "\"" + command + "\" succeeded but wrote no " + object.getFileName(), e);
        }
      }
      return new ObjectFiles(objects, stderrText(outcome), outcome.elapsed());
    }
  }

  /**
   * Compiles and links the sources into one program ({@code cc flags -o program a.c b.c ...
   * linkFlags}).
   *
   * @param sources file name (plain, ending in {@code .c}, {@code .h} or {@code .ld}) to text; at
   *     least one {@code .c}, exactly one of them defining {@code main}; a linker script is
   *     written next to the sources for a link option such as {@code -T image.ld}
   * @param linkFlags options placed after the sources, where libraries must go, e.g. {@code -lm}
   * @throws CCompileException if the compiler or the linker rejects the sources
   * @throws ProcessTimeoutException if the build runs longer than the time limit
   */
  public NativeExecutable buildExecutable(Map<String, String> sources, List<String> linkFlags)
      throws CCompileException, ProcessTimeoutException {
    CSources files = new CSources(sources);
    List<String> link = List.copyOf(Objects.requireNonNull(linkFlags, "linkFlags"));
    TempDirectory directory = TempDirectory.create("splitwright-cc-");
    try {
      files.writeTo(directory.path());
      List<String> args = new ArrayList<>(flags);
      args.add("-o");
      args.add(PROGRAM);
      args.addAll(files.translationUnits());
      args.addAll(link);
      ProcessOutcome outcome = compile(directory, args);
      Path program = directory.path().resolve(PROGRAM);
      if (!Files.isExecutable(program)) {
        throw new IllegalStateException(
            "\"" + command + "\" succeeded but wrote no executable " + PROGRAM);
      }
      return new NativeExecutable(directory, program, stderrText(outcome));
    } catch (CCompileException | ProcessTimeoutException | RuntimeException e) {
      directory.close();
      throw e;
    }
  }

  /** {@link #buildExecutable(Map, List)} without link options. */
  public NativeExecutable buildExecutable(Map<String, String> sources)
      throws CCompileException, ProcessTimeoutException {
    return buildExecutable(sources, List.of());
  }

  private ProcessOutcome compile(TempDirectory directory, List<String> args)
      throws CCompileException, ProcessTimeoutException {
    List<String> commandLine = new ArrayList<>();
    commandLine.add(executable.toString());
    commandLine.addAll(args);
    ProcessBuilder builder =
        new ProcessBuilder(commandLine).directory(directory.path().toFile());
    builder.environment().put("LC_ALL", "C");
    List<String> shown = new ArrayList<>(args);
    shown.add(0, command);
    String display = ProcessRunner.display(shown);
    ProcessOutcome outcome = ProcessRunner.run(builder, display, null, timeout);
    if (outcome.exitCode() != 0) {
      throw new CCompileException(display, outcome.exitCode(), stderrText(outcome));
    }
    return outcome;
  }

  private static String stderrText(ProcessOutcome outcome) {
    return new String(outcome.stderr(), StandardCharsets.UTF_8);
  }

  private static Path resolve(String command) throws CCompilerNotFoundException {
    return ExecutableLookup.find(command)
        .orElseThrow(
            () -> new CCompilerNotFoundException(command, ExecutableLookup.whereNotFound(command)));
  }
}
