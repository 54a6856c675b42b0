/*
 * Splitwright bare-metal harness for Cortex-M boards emulated by qemu-system-arm.
 *
 * The harness starts the image (vector table, .data copy, .bss zeroing, FPU enable where there
 * is one), calls the program's own `int main(void)` and ends the emulator with its return value
 * as exit status (0..249; 250 means the core took a fault). There is no C library: files are
 * read and written through Arm semihosting, relative to the emulator's working directory, where
 * the runner puts SW_INPUT and collects SW_OUTPUT.
 */
#ifndef SW_IO_H
#define SW_IO_H

/* The file the runner fills with the caller's input bytes. */
#define SW_INPUT "input.bin"
/* The file the runner returns as output bytes. */
#define SW_OUTPUT "output.bin"
/* Exit status of an image that took a fault (HardFault, NMI and the like). */
#define SW_FAULT_STATUS 250
/* Executed instructions per SysTick tick under the runner's `-icount shift=3` (8 ns per
 * instruction) and the boards' 25 MHz processor clock (40 ns per tick). */
#define SW_INSTRUCTIONS_PER_TICK 5u

/* Opens a file to read bytes; returns a handle >= 0, or -1. */
int sw_open_read(const char *path);
/* Creates or truncates a file to write bytes; returns a handle >= 0, or -1. */
int sw_open_write(const char *path);
/* Reads up to n bytes; returns how many (0 at the end of the file), or -1 on error. */
int sw_read(int handle, void *buffer, unsigned n);
/* Writes n bytes; returns 0, or -1 if not all could be written. */
int sw_write(int handle, const void *buffer, unsigned n);
/* Closes a handle; returns 0, or -1. */
int sw_close(int handle);
/* Ends the emulator with this exit status. */
void sw_exit(int status) __attribute__((noreturn));
/* Writes a line of text to the emulator's console (the runner's console text). */
void sw_log(const char *text);

/* Starts counting executed instructions (restarts SysTick). */
void sw_count_start(void);
/* Instructions executed since sw_count_start(), to within SW_INSTRUCTIONS_PER_TICK. */
unsigned long long sw_count_instructions(void);

#endif
