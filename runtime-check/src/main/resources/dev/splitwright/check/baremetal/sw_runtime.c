/* Splitwright bare-metal harness: start-up, vector table and semihosting calls (see sw_io.h). */
#include <stddef.h>
#include <stdint.h>
#include "sw_io.h"

/* Arm semihosting operations (Arm "Semihosting for AArch32 and AArch64", version 2.0). */
#define SYS_OPEN 0x01u
#define SYS_CLOSE 0x02u
#define SYS_WRITE0 0x04u
#define SYS_WRITE 0x05u
#define SYS_READ 0x06u
#define SYS_EXIT_EXTENDED 0x20u
#define ADP_STOPPED_APPLICATION_EXIT 0x20026u
/* SYS_OPEN modes "rb" and "wb". */
#define MODE_READ_BINARY 1u
#define MODE_WRITE_BINARY 5u

/* SysTick registers (ARMv6-M and ARMv7-M architecture reference manuals, B3.3). */
#define SYST_CSR (*(volatile uint32_t *)0xE000E010u)
#define SYST_RVR (*(volatile uint32_t *)0xE000E014u)
#define SYST_CVR (*(volatile uint32_t *)0xE000E018u)
#define SYST_RELOAD 0x00FFFFFFu

/* From the linker script sw_image.ld. */
extern uint32_t __sw_data_load[], __sw_data_start[], __sw_data_end[];
extern uint32_t __sw_bss_start[], __sw_bss_end[];
extern char __sw_stack_top[];

int main(void);
void sw_reset(void);
void sw_start(void);
void sw_fault(void);
void sw_systick(void);

static volatile uint32_t sw_wraps;

/* A semihosting call: bkpt 0xAB with the operation in r0 and its argument in r1, result in r0.
 * The same instruction is valid on ARMv6-M and ARMv7-M. */
static int sw_call(uint32_t op, const void *argument) {
  register uint32_t r0 __asm__("r0") = op;
  register const void *r1 __asm__("r1") = argument;
  __asm__ volatile("bkpt 0xAB" : "+r"(r0) : "r"(r1) : "memory");
  return (int)r0;
}

static uint32_t sw_length(const char *text) {
  uint32_t n = 0;
  while (text[n] != '\0') {
    n++;
  }
  return n;
}

static int sw_open(const char *path, uint32_t mode) {
  uint32_t block[3];
  block[0] = (uint32_t)(uintptr_t)path;
  block[1] = mode;
  block[2] = sw_length(path);
  return sw_call(SYS_OPEN, block);
}

int sw_open_read(const char *path) { return sw_open(path, MODE_READ_BINARY); }

int sw_open_write(const char *path) { return sw_open(path, MODE_WRITE_BINARY); }

int sw_read(int handle, void *buffer, unsigned n) {
  uint32_t block[3];
  int left;
  block[0] = (uint32_t)handle;
  block[1] = (uint32_t)(uintptr_t)buffer;
  block[2] = n;
  /* SYS_READ answers with the number of bytes it did NOT read. */
  left = sw_call(SYS_READ, block);
  if (left < 0 || (unsigned)left > n) {
    return -1;
  }
  return (int)(n - (unsigned)left);
}

int sw_write(int handle, const void *buffer, unsigned n) {
  uint32_t block[3];
  block[0] = (uint32_t)handle;
  block[1] = (uint32_t)(uintptr_t)buffer;
  block[2] = n;
  return sw_call(SYS_WRITE, block) == 0 ? 0 : -1;
}

int sw_close(int handle) {
  uint32_t block[1];
  block[0] = (uint32_t)handle;
  return sw_call(SYS_CLOSE, block) == 0 ? 0 : -1;
}

void sw_log(const char *text) {
  (void)sw_call(SYS_WRITE0, text);
  (void)sw_call(SYS_WRITE0, "\n");
}

/* SYS_EXIT_EXTENDED, not SYS_EXIT: on AArch32 plain SYS_EXIT cannot carry a status. */
void sw_exit(int status) {
  uint32_t block[2];
  block[0] = ADP_STOPPED_APPLICATION_EXIT;
  block[1] = (uint32_t)status;
  for (;;) {
    (void)sw_call(SYS_EXIT_EXTENDED, block);
  }
}

void sw_fault(void) {
  sw_log("sw: the core took a fault");
  sw_exit(SW_FAULT_STATUS);
}

void sw_systick(void) { sw_wraps = sw_wraps + 1u; }

void sw_count_start(void) {
  SYST_CSR = 0u;
  SYST_RVR = SYST_RELOAD;
  SYST_CVR = 0u;
  sw_wraps = 0u;
  /* Enable, interrupt on wrap, processor clock. */
  SYST_CSR = 7u;
}

unsigned long long sw_count_instructions(void) {
  uint32_t wraps;
  uint32_t value;
  unsigned long long ticks;
  unsigned long long four;
  do {
    wraps = sw_wraps;
    value = SYST_CVR;
  } while (wraps != sw_wraps);
  ticks = ((unsigned long long)wraps << 24) + (SYST_RELOAD - value);
  /* Times SW_INSTRUCTIONS_PER_TICK (5) by shift and add. The empty asm hides the pattern from
   * the compiler, which at -Os would call __aeabi_lmul from libgcc on ARMv6-M instead. */
  four = ticks << 2;
  __asm__("" : "+r"(four));
  return four + ticks;
}

/* Word loops the compiler must not turn into calls to memcpy or memset, which need not exist. */
__attribute__((optimize("no-tree-loop-distribute-patterns"))) void sw_start(void) {
  uint32_t *from = __sw_data_load;
  uint32_t *to = __sw_data_start;
  while (to < __sw_data_end) {
    *to++ = *from++;
  }
  for (to = __sw_bss_start; to < __sw_bss_end; to++) {
    *to = 0u;
  }
  sw_exit(main());
}

/* Reset handler in assembly, so that no floating-point instruction can run before the FPU is
 * switched on: CPACR (0xE000ED88) bits 20-23 grant full access to CP10 and CP11 (ARMv7-M
 * reference manual, B3.2.20). Cores without FPU branch straight to sw_start. */
__attribute__((naked)) void sw_reset(void) {
#if defined(__ARM_FP)
  __asm__ volatile(
      "ldr r0, =0xE000ED88\n"
      "ldr r1, [r0]\n"
      "orr r1, r1, #0x00F00000\n"
      "str r1, [r0]\n"
      "dsb\n"
      "isb\n"
      "b sw_start\n"
      ".ltorg\n");
#else
  __asm__ volatile("b sw_start\n");
#endif
}

/* The 16 system entries shared by ARMv6-M and ARMv7-M: initial stack pointer, then handlers.
 * Entries reserved on one architecture are never taken there, so one table serves both. */
struct sw_vectors {
  char *stack_top;
  void (*handlers[15])(void);
};

__attribute__((section(".sw_vectors"), used)) static const struct sw_vectors sw_vector_table = {
    __sw_stack_top,
    {
        sw_reset,   /* Reset */
        sw_fault,   /* NMI */
        sw_fault,   /* HardFault */
        sw_fault,   /* MemManage (ARMv7-M) */
        sw_fault,   /* BusFault (ARMv7-M) */
        sw_fault,   /* UsageFault (ARMv7-M) */
        NULL, NULL, NULL, NULL,
        sw_fault,   /* SVCall */
        sw_fault,   /* DebugMonitor (ARMv7-M) */
        NULL,
        sw_fault,   /* PendSV */
        sw_systick, /* SysTick */
    }};
