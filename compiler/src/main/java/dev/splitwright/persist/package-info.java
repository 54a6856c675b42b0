/**
 * Splitwright's JSON model file: write a trained tree or tree ensemble, read it back to re-emit
 * without retraining.
 */
package dev.splitwright.persist;
