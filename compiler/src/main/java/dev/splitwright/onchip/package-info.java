/**
 * Runs an emitted C classifier on an emulated Arm Cortex-M core and measures it there: a
 * bare-metal harness {@code main} over the semihosting calls of {@code sw_io.h} ({@link
 * dev.splitwright.onchip.BareMetalHarness}), the proof that the image gives the model's class and
 * probabilities for every verification input, with instruction counts ({@link
 * dev.splitwright.onchip.OnChipProver}), and the flash a core pays for the classifier, soft-float
 * helpers included ({@link dev.splitwright.onchip.CoreFlash}).
 */
package dev.splitwright.onchip;
