/**
 * Trains CART classification trees (Breiman, Friedman, Olshen and Stone, 1984) on a {@link
 * dev.splitwright.data.Dataset}: split search with Gini impurity or entropy, class weights, depth,
 * leaf-count and leaf-size limits, learned routing of missing values, and minimal cost-complexity
 * pruning; and ensembles of such trees: voting forests (Breiman 2001) and SAMME boosting (Zhu,
 * Zou, Rosset and Hastie 2009). Entry points are {@link dev.splitwright.train.CartTrainer},
 * {@link dev.splitwright.train.PruningPath}, {@link dev.splitwright.train.ForestTrainer} and
 * {@link dev.splitwright.train.BoostingTrainer}; training is single-threaded and deterministic.
 */
package dev.splitwright.train;
