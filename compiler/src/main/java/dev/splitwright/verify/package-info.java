/**
 * Proves emitted code equals the model: compiles it in memory, probes every split's boundaries
 * (for double input also the rounding boundaries), compares classes and class probabilities,
 * and measures the class file.
 */
package dev.splitwright.verify;
