/**
 * Emits a trained tree as one dependency-free Java source file (JavaPoet): layouts, method splitting under a bytecode cap, safe names and exact literals.
 */
package dev.splitwright.emit;
