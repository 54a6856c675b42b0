package dev.splitwright.demo;

import java.util.List;
import java.util.Objects;

/**
 * One generated log row: the formatted feature cells (empty for a missing reading), the state that
 * really produced them, and the label the log records, which label noise may have changed.
 */
public record DemoRow(List<String> cells, String trueLabel, String loggedLabel) {

  public DemoRow {
    cells = List.copyOf(Objects.requireNonNull(cells, "cells"));
    Objects.requireNonNull(trueLabel, "trueLabel");
    Objects.requireNonNull(loggedLabel, "loggedLabel");
  }

  /** Tells whether label noise changed this row's label. */
  public boolean mislabelled() {
    return !trueLabel.equals(loggedLabel);
  }
}
