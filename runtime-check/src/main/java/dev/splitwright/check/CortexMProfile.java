package dev.splitwright.check;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * An Arm Cortex-M core to build for, with the qemu MPS2 board that runs its code. qemu 7.2's MPS2
 * boards: {@code mps2-an385} has a Cortex-M3, {@code mps2-an386} a Cortex-M4 with single-precision
 * FPU, {@code mps2-an500} a Cortex-M7 whose FPU also does double precision (its MVFR0 reads
 * 0x10110221 there, double-precision field 2).
 *
 * <p>qemu has no Cortex-M0+ board, so {@link #CORTEX_M0PLUS} code runs on the Cortex-M3 board. That
 * is sound for checking results: ARMv6-M's Thumb instructions are a subset of ARMv7-M's with the
 * same meaning (ARMv6-M reference manual, A1.2 and appendix "ARMv6-M differences"), and the few
 * system features the harness uses (vector table at 0, reset, HardFault, SysTick, semihosting by
 * {@code bkpt 0xAB}) work the same on both. The compiler is told it builds for the M0+, so the
 * image holds only ARMv6-M instructions and links the ARMv6-M soft-float helpers from libgcc,
 * which is what the check is about. Timing is not that of an M0+.
 */
public enum CortexMProfile {
  /** ARMv6-M, no FPU: floats go through libgcc's Thumb-1 soft-float helpers. */
  CORTEX_M0PLUS(
      "cortex-m0plus", "mps2-an385", false, "-mcpu=cortex-m0plus", "-mthumb", "-mfloat-abi=soft"),
  /** ARMv7-M, no FPU: floats go through libgcc's Thumb-2 soft-float helpers. */
  CORTEX_M3("cortex-m3", "mps2-an385", false, "-mcpu=cortex-m3", "-mthumb", "-mfloat-abi=soft"),
  /** ARMv7E-M with single-precision FPU (FPv4-SP), floats passed in FPU registers. */
  CORTEX_M4F(
      "cortex-m4f",
      "mps2-an386",
      true,
      "-mcpu=cortex-m4",
      "-mthumb",
      "-mfloat-abi=hard",
      "-mfpu=fpv4-sp-d16"),
  /** ARMv7E-M with single- and double-precision FPU (FPv5), floats passed in FPU registers. */
  CORTEX_M7(
      "cortex-m7",
      "mps2-an500",
      true,
      "-mcpu=cortex-m7",
      "-mthumb",
      "-mfloat-abi=hard",
      "-mfpu=fpv5-d16");

  /**
   * Options every image is compiled with besides the target ones: no hosted C library is assumed,
   * and each function and variable gets its own section so that the link drops what is unused.
   */
  public static final List<String> IMAGE_FLAGS =
      List.of("-ffreestanding", "-ffunction-sections", "-fdata-sections");

  private static final Pattern OPTIMISATION = Pattern.compile("-O[0123sgz]?");

  private final String id;
  private final String machine;
  private final boolean hasFpu;
  private final List<String> targetFlags;

  CortexMProfile(String id, String machine, boolean hasFpu, String... targetFlags) {
    this.id = id;
    this.machine = machine;
    this.hasFpu = hasFpu;
    this.targetFlags = List.of(targetFlags);
  }

  /** The profile's name, e.g. {@code cortex-m4f}. */
  public String id() {
    return id;
  }

  /** The qemu machine ({@code -M}) that runs the code, e.g. {@code mps2-an386}. */
  public String machine() {
    return machine;
  }

  /** Whether the core has a floating-point unit that the code uses. */
  public boolean hasFpu() {
    return hasFpu;
  }

  /** The options choosing core, instruction set and float ABI, e.g. {@code -mcpu=cortex-m4}. */
  public List<String> targetFlags() {
    return targetFlags;
  }

  /**
   * All compiler options of an image: {@link #targetFlags()}, {@link #IMAGE_FLAGS}, then the
   * caller's, in that order.
   *
   * @param codeFlags the caller's options; exactly one optimisation level ({@code -O0}, {@code
   *     -O1}, {@code -O2}, {@code -O3}, {@code -Os}, {@code -Oz}, {@code -Og} or {@code -O}), so
   *     that a recorded flag list always says how the code was optimised; {@code -Ofast} is
   *     refused because it gives up IEEE 754 semantics
   */
  public List<String> compilerFlags(List<String> codeFlags) {
    List<String> caller = List.copyOf(Objects.requireNonNull(codeFlags, "codeFlags"));
    long levels = caller.stream().filter(f -> f.startsWith("-O")).count();
    boolean valid = caller.stream().filter(f -> f.startsWith("-O"))
        .allMatch(f -> OPTIMISATION.matcher(f).matches());
    if (levels != 1 || !valid) {
      throw new IllegalArgumentException(
          "codeFlags must contain exactly one of -O0 -O1 -O2 -O3 -Os -Oz -Og -O, but they are "
              + caller);
    }
    List<String> flags = new ArrayList<>(targetFlags);
    flags.addAll(IMAGE_FLAGS);
    flags.addAll(caller);
    return List.copyOf(flags);
  }

  /**
   * The profile of that name.
   *
   * @throws IllegalArgumentException if there is none; the message lists the valid names
   */
  public static CortexMProfile fromId(String id) {
    Objects.requireNonNull(id, "id");
    return Arrays.stream(values())
        .filter(p -> p.id.equals(id))
        .findFirst()
        .orElseThrow(
            () ->
                new IllegalArgumentException(
                    "unknown Cortex-M profile \"" + id + "\"; valid are "
                        + Arrays.stream(values()).map(CortexMProfile::id).toList()));
  }
}
