/**
 * Emits a trained tree as one dependency-free Java source file (JavaPoet): the {@code branches}
 * layout (nested comparisons split into methods under a bytecode cap) and the {@code table} layout
 * (the tree packed into string constants and walked by a loop), float, double or int input, named
 * arguments, class probabilities, safe names and exact literals.
 */
package dev.splitwright.emit;
