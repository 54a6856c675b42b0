/**
 * Evaluation of trained trees on held-out data, starting with the seeded {@link
 * dev.splitwright.eval.StratifiedSplit} into train, validation and test parts and stratified k-fold
 * cross-validation.
 */
package dev.splitwright.eval;
