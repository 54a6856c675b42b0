/**
 * The immutable decision tree and its nodes; {@code DecisionTree.predict} is the oracle emitted
 * code is checked against.
 */
package dev.splitwright.model;
