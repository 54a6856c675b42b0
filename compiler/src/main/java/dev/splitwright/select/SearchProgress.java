package dev.splitwright.select;

/** Hears how far the budget search has come; called on the searching thread. */
public interface SearchProgress {

  /** {@code done} of {@code total} steps of {@code stage} (e.g. "measuring") are finished. */
  void update(String stage, int done, int total);

  /** The search is over; the bar, if any, should be cleared. */
  void finished(SearchStats stats);

  /** A listener that ignores everything. */
  static SearchProgress none() {
    return new SearchProgress() {
      @Override
      public void update(String stage, int done, int total) {}

      @Override
      public void finished(SearchStats stats) {}
    };
  }
}
