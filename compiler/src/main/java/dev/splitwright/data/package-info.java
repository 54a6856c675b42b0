/**
 * Input data: the immutable column-wise {@link dev.splitwright.data.Dataset} and its {@link
 * dev.splitwright.data.Schema}, the streaming {@link dev.splitwright.data.CsvLoader}, and {@link
 * dev.splitwright.data.InputException}, the one checked error for bad input files and options.
 */
package dev.splitwright.data;
