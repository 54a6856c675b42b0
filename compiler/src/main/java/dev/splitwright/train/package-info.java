/**
 * Trains CART classification trees (Breiman, Friedman, Olshen and Stone, 1984) on a {@link
 * dev.splitwright.data.Dataset}: split search with Gini impurity or entropy, class weights, depth,
 * leaf-count and leaf-size limits, learned routing of missing values, and minimal cost-complexity
 * pruning. Entry points are {@link dev.splitwright.train.CartTrainer} and {@link
 * dev.splitwright.train.PruningPath}; training is single-threaded and deterministic.
 */
package dev.splitwright.train;
