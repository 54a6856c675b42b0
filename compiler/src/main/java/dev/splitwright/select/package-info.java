/**
 * Byte-budget model selection: parses sizes such as {@code 4KiB} ({@link
 * dev.splitwright.select.SizeText}), generates candidate trees from a sweep of depth and leaf-size
 * limits combined with each tree's cost-complexity pruning path, scores them on validation data or
 * by k-fold cross-validation, measures every distinct candidate by emitting and compiling it, picks
 * the best one that fits the budget and records the size/score Pareto frontier. Entry point: {@link
 * dev.splitwright.select.BudgetSelection}. Also chooses the smaller layout for {@code --layout
 * smallest} ({@link dev.splitwright.select.LayoutChooser}) and measures class files built with
 * other debug settings ({@link dev.splitwright.select.DebugSizes}).
 */
package dev.splitwright.select;
