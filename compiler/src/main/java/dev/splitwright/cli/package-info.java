/**
 * The {@code splitwright} command line (picocli): parses options, runs the job, maps every failure
 * to one line and an exit code.
 */
package dev.splitwright.cli;
