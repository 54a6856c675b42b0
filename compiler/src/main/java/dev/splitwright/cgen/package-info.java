/**
 * Emits a trained tree as C99 source: a header and a source file that include nothing but {@code
 * <stdint.h>}, with nested comparisons ({@code branches}) or a {@code static const} table walked by
 * a loop ({@code table}), float or int32 input, class probabilities, safe names and thresholds
 * spelled exactly (hexadecimal floating constants, C99 6.4.4.2); plus a test-side harness {@code
 * main} and the binary files it reads and writes.
 *
 * <p>No {@code <float.h>}: the code compares float values with float constants and does no
 * arithmetic, and a comparison is exact whatever {@code FLT_EVAL_METHOD} says, because widening a
 * float to a wider format keeps its value (C99 6.3.1.5). Sums of scores (ensembles) will need the
 * {@code FLT_EVAL_METHOD == 0} check.
 */
package dev.splitwright.cgen;
