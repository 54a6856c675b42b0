/**
 * Trains CART classification trees (Breiman, Friedman, Olshen and Stone, 1984) on a {@link
 * dev.splitwright.data.Dataset}: split search with Gini impurity or entropy, class weights, depth,
 * leaf-count and leaf-size limits, learned routing of missing values, and minimal cost-complexity
 * pruning; and ensembles of such trees: voting forests (Breiman 2001) and SAMME boosting (Zhu,
 * Zou, Rosset and Hastie 2009). Entry points are {@link dev.splitwright.train.CartTrainer},
 * {@link dev.splitwright.train.PruningPath}, {@link dev.splitwright.train.ForestTrainer} and
 * {@link dev.splitwright.train.BoostingTrainer}. Training is deterministic: large nodes are
 * searched and partitioned in two shares of the features on two cores (TwoShares), whose results
 * are combined in feature order, so the tree never depends on the threads.
 */
package dev.splitwright.train;
