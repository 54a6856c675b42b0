/**
 * Output languages: each one emits a tree as source files, proves those files return what the
 * model returns, and measures them. The compile job talks to {@link
 * dev.splitwright.backend.OutputLanguage} alone; Java and C are its two implementations.
 */
package dev.splitwright.backend;
