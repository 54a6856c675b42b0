package dev.splitwright.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ForkJoinPool;
import org.junit.jupiter.api.Test;

class TwoSharesTest {
  private record Call(int from, int to, int share) {}

  @Test
  void smallWorkIsOneShareOnTheCaller() {
    ConcurrentLinkedQueue<Call> calls = new ConcurrentLinkedQueue<>();
    Thread caller = Thread.currentThread();
    ConcurrentLinkedQueue<Thread> threads = new ConcurrentLinkedQueue<>();
    TwoShares.run(20, TwoShares.MIN_CELLS - 1, (from, to, share) -> {
      calls.add(new Call(from, to, share));
      threads.add(Thread.currentThread());
    });
    assertThat(calls).containsExactly(new Call(0, 20, 0));
    assertThat(threads).containsExactly(caller);
  }

  @Test
  void oneFeatureIsNeverSplit() {
    ConcurrentLinkedQueue<Call> calls = new ConcurrentLinkedQueue<>();
    TwoShares.run(1, Long.MAX_VALUE, (from, to, share) -> calls.add(new Call(from, to, share)));
    assertThat(calls).containsExactly(new Call(0, 1, 0));
  }

  @Test
  void largeWorkIsSplitInTwoHalvesOnTwoCores() {
    boolean twoCores = Runtime.getRuntime().availableProcessors() >= 2
        && ForkJoinPool.getCommonPoolParallelism() >= 1;
    assertThat(TwoShares.splits(TwoShares.MIN_CELLS)).isEqualTo(twoCores);
    ConcurrentLinkedQueue<Call> calls = new ConcurrentLinkedQueue<>();
    TwoShares.run(7, TwoShares.MIN_CELLS,
        (from, to, share) -> calls.add(new Call(from, to, share)));
    assertThat(calls).containsExactlyInAnyOrderElementsOf(twoCores
        ? List.of(new Call(0, 3, 0), new Call(3, 7, 1))
        : List.of(new Call(0, 7, 0)));
  }

  @Test
  void aFailureInEitherShareReachesTheCaller() {
    for (int failing = 0; failing < 2; failing++) {
      int which = failing;
      assertThatThrownBy(() -> TwoShares.run(4, Long.MAX_VALUE, (from, to, share) -> {
        if (share == which || !TwoShares.splits(Long.MAX_VALUE)) {
          throw new IllegalStateException("share " + share);
        }
      })).hasMessageContaining("share");
    }
  }
}
