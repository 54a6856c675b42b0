/**
 * Checks generated code outside the compiler that generated it.
 *
 * <p>Java: compiles source in memory ({@link dev.splitwright.check.InMemoryCompiler}), loads the
 * classes in a fresh class loader ({@link dev.splitwright.check.CompiledClasses}), measures the
 * class files ({@link dev.splitwright.check.ClassFileInfo}) and compares a candidate function with
 * an oracle ({@link dev.splitwright.check.OracleComparison}).
 *
 * <p>C: runs a C compiler such as {@code cc} or {@code arm-none-eabi-gcc} as a process under a
 * time limit ({@link dev.splitwright.check.CCompiler}), either to object files, many translation
 * units in one run ({@link dev.splitwright.check.ObjectFiles}), or to a program ({@link
 * dev.splitwright.check.NativeExecutable}) that is run on binary input ({@link
 * dev.splitwright.check.NativeRun}, {@link dev.splitwright.check.LittleEndian}).
 *
 * <p>Cortex-M: builds C sources with a small start-up harness and no C library into bare-metal
 * images for Arm Cortex-M cores ({@link dev.splitwright.check.CortexMProfile}, {@link
 * dev.splitwright.check.CortexMToolchain}) and runs them on qemu's emulated MPS2 boards, feeding
 * input and collecting output over Arm semihosting ({@link dev.splitwright.check.BareMetalImage},
 * {@link dev.splitwright.check.BareMetalRun}).
 *
 * <p>ELF: reads the sections and symbols of ELF32 and ELF64 objects of either byte order ({@link
 * dev.splitwright.check.ElfFile}) to tell how many bytes of flash the code and tables take.
 *
 * <p>DEX: turns class files into one DEX file per class with D8, Android's dexer, in this JVM
 * ({@link dev.splitwright.check.Dexer}), and reads a DEX file's header, strings, types and classes
 * ({@link dev.splitwright.check.DexFile}) to tell how many bytes an Android app ships.
 *
 * <p>Depends on the JDK and, for dexing only, on D8 (Maven Central {@code com.android.tools:r8}),
 * whose classes are loaded on the first call that dexes; it knows nothing about trees or data sets.
 */
package dev.splitwright.check;
