/**
 * The immutable decision tree and its nodes, and ensembles of such trees ({@code TreeEnsemble}:
 * voting forests and SAMME-boosted trees); their {@code predict} is the oracle emitted code is
 * checked against.
 */
package dev.splitwright.model;
