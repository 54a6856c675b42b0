/**
 * The report written beside each classifier: its JSON form and rendering.
 */
package dev.splitwright.report;
