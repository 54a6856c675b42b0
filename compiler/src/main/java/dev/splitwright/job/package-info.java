/**
 * The main job end to end (load, split, train, score, emit, verify) and the atomic writing of its
 * outputs.
 */
package dev.splitwright.job;
