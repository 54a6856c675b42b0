/**
 * Proves emitted code equals the model: compiles it in memory, probes every split's boundaries, compares and measures the class file.
 */
package dev.splitwright.verify;
