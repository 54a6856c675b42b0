/**
 * Proves emitted code equals the model: compiles it in memory, probes every split's boundaries
 * (for double input also the rounding boundaries), compares classes and class probabilities,
 * measures the class file, and chooses the smaller layout for {@code --layout smallest}.
 */
package dev.splitwright.verify;
