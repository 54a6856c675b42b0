/**
 * Seeded generators of invented but physically plausible sensor logs for demos and tests: a field
 * pump vibration monitor ({@link dev.splitwright.demo.PumpVibrationScenario}) and a wrist-worn
 * gesture band ({@link dev.splitwright.demo.GestureBandScenario}). No external data.
 */
package dev.splitwright.demo;
