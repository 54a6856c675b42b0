package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.select.SearchStats;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;

class ProgressBarTest {
  private final StringWriter text = new StringWriter();
  private final AtomicLong clock = new AtomicLong(5_000_000_000L);

  private ProgressBar bar(boolean enabled) {
    return new ProgressBar(new PrintWriter(text), enabled, clock::get);
  }

  @Test
  void drawsOneLineInPlaceWithDoneTotalAndElapsed() {
    ProgressBar bar = bar(true);
    clock.addAndGet(1_500_000_000L);
    bar.update("measuring", 50, 200);

    assertThat(text.toString()).isEqualTo(
        "\rmeasuring        [######------------------] 50/200  1.5 s");
    assertThat(text.toString()).doesNotContain("\n");
  }

  @Test
  void redrawsAtMostTenTimesASecondButAlwaysTheLastStep() {
    ProgressBar bar = bar(true);
    bar.update("measuring", 1, 4);
    clock.addAndGet(50_000_000L);
    bar.update("measuring", 2, 4); // 50 ms later: skipped
    clock.addAndGet(60_000_000L);
    bar.update("measuring", 3, 4); // 110 ms after the first draw: drawn
    bar.update("measuring", 4, 4); // the last step: always drawn

    assertThat(text.toString().split("\r", -1)).hasSize(4)
        .anyMatch(s -> s.contains(" 1/4 ")).noneMatch(s -> s.contains(" 2/4 "))
        .anyMatch(s -> s.contains(" 3/4 ")).anyMatch(s -> s.contains(" 4/4 "));
  }

  @Test
  void clearsTheLineWhenFinished() {
    ProgressBar bar = bar(true);
    bar.update("growing", 40, 40);
    int width = text.toString().length() - 1;
    SearchStats stats = new SearchStats(10, 5, 6, 2, 1_000_000L);
    bar.finished(stats);

    assertThat(text.toString()).endsWith("\r" + " ".repeat(width) + "\r");
    assertThat(bar.stats()).isEqualTo(stats);
  }

  @Test
  void printsNothingWhenDisabled() {
    ProgressBar bar = bar(false);
    bar.update("growing", 1, 40);
    bar.update("measuring", 100, 100);
    bar.finished(new SearchStats(1, 1, 1, 1, 1));

    assertThat(text.toString()).isEmpty();
    assertThat(bar.stats()).isNotNull();
  }

  @Test
  void isOffWhenQuietOrWithoutAConsole() {
    // Test runs have no console (System.console() is null when output is redirected), so the bar
    // must stay off whether or not --quiet is given.
    ProgressBar.forTerminal(new PrintWriter(text), false).update("growing", 1, 2);
    ProgressBar.forTerminal(new PrintWriter(text), true).update("growing", 1, 2);
    assertThat(text.toString()).isEmpty();
  }
}
