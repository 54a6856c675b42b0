package dev.splitwright.check;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A linked Cortex-M image built by {@link CortexMToolchain#build}, living in its own temporary
 * directory until {@link #close()} deletes it.
 *
 * <p>Each {@link #run} starts {@code qemu-system-arm} on the profile's board in a fresh directory
 * holding the input as {@code input.bin}; the image reads it and writes {@code output.bin} through
 * semihosting. The emulator runs with {@code -icount shift=3}: every instruction advances virtual
 * time by 8 ns, so timers, and with them {@code sw_count_instructions()}, depend on the
 * instructions executed and not on the host's speed or load.
 *
 * <p>Runs may happen from several threads at once; {@link #close()} must come after all of them.
 */
public final class BareMetalImage implements AutoCloseable {

  /**
   * Emulator options of every run besides board and image: no display, monitor or serial port;
   * semihosting on, with file names relative to the emulator's working directory; deterministic
   * instruction-driven clock.
   */
  public static final List<String> EMULATOR_FLAGS =
      List.of(
          "-nographic",
          "-monitor",
          "none",
          "-serial",
          "none",
          "-semihosting-config",
          "enable=on,target=native",
          "-icount",
          "shift=3");

  /**
   * Instructions per SysTick tick under {@link #EMULATOR_FLAGS} ({@code SW_INSTRUCTIONS_PER_TICK}):
   * 40 ns per tick of the boards' 25 MHz clock over 8 ns per instruction.
   */
  public static final int INSTRUCTIONS_PER_TICK = 5;

  private static final String INPUT = "input.bin";
  private static final String OUTPUT = "output.bin";

  private final CortexMProfile profile;
  private final List<String> compilerFlags;
  private final NativeExecutable program;
  private final ElfFile elf;
  private final Path emulator;

  BareMetalImage(
      CortexMProfile profile,
      List<String> compilerFlags,
      NativeExecutable program,
      ElfFile elf,
      Path emulator) {
    this.profile = profile;
    this.compilerFlags = List.copyOf(compilerFlags);
    this.program = program;
    this.elf = elf;
    this.emulator = emulator;
  }

  /** The core the image was built for. */
  public CortexMProfile profile() {
    return profile;
  }

  /** The linked ELF file, e.g. for GNU binutils; valid until {@link #close()}. */
  public Path path() {
    return program.path();
  }

  /** Every compiler option the image was built with, in order. */
  public List<String> compilerFlags() {
    return compilerFlags;
  }

  /** Every link option, after the sources ({@link CortexMToolchain#LINK_FLAGS}). */
  public List<String> linkFlags() {
    return CortexMToolchain.LINK_FLAGS;
  }

  /** What the compiler wrote to standard error although it succeeded, e.g. warnings. */
  public String diagnostics() {
    return program.diagnostics();
  }

  /** The linked image's sections and symbols, e.g. the libgcc helpers among its functions. */
  public ElfFile elf() {
    return elf;
  }

  /** Bytes of flash the image takes: code, constants and initial values of variables. */
  public long flashBytes() {
    return elf.flashBytes();
  }

  /** The emulator command line of a run, as shown in messages. */
  public String emulatorCommand() {
    return ProcessRunner.display(command(CortexMToolchain.EMULATOR, "program"));
  }

  /**
   * Runs the image on the profile's emulated board.
   *
   * @param input the bytes the image reads from {@code SW_INPUT}
   * @param limit wall-clock time limit of the emulator process
   * @throws ProcessTimeoutException if the image runs longer than {@code limit}; the emulator is
   *     killed then
   */
  public BareMetalRun run(byte[] input, Duration limit) throws ProcessTimeoutException {
    Objects.requireNonNull(input, "input");
    Objects.requireNonNull(limit, "limit");
    if (!Files.exists(program.path())) {
      throw new IllegalStateException("image was closed");
    }
    try (TempDirectory directory = TempDirectory.create("splitwright-qemu-")) {
      Path output = directory.path().resolve(OUTPUT);
      try {
        Files.write(directory.path().resolve(INPUT), input);
      } catch (IOException e) {
        throw new UncheckedIOException("cannot write the emulator's input file", e);
      }
      ProcessBuilder builder =
          new ProcessBuilder(command(emulator.toString(), program.path().toString()))
              .directory(directory.path().toFile());
      builder.environment().put("LC_ALL", "C");
      ProcessOutcome outcome = ProcessRunner.run(builder, emulatorCommand(), null, limit);
      byte[] written;
      try {
        written = Files.exists(output) ? Files.readAllBytes(output) : new byte[0];
      } catch (IOException e) {
        throw new UncheckedIOException("cannot read the emulator's output file", e);
      }
      String console =
          new String(outcome.stdout(), StandardCharsets.UTF_8)
              + new String(outcome.stderr(), StandardCharsets.UTF_8);
      return new BareMetalRun(outcome.exitCode(), written, console, outcome.elapsed());
    }
  }

  /** Deletes the image and its directory. */
  @Override
  public void close() {
    program.close();
  }

  private List<String> command(String emulatorName, String image) {
    List<String> command = new ArrayList<>();
    command.add(emulatorName);
    command.add("-M");
    command.add(profile.machine());
    command.addAll(EMULATOR_FLAGS);
    command.add("-kernel");
    command.add(image);
    return command;
  }
}
