package dev.splitwright.job;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.data.LoadedData;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.TrainingOptions;
import dev.splitwright.verify.Verifier;
import java.io.BufferedWriter;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Optional;
import java.util.SplittableRandom;
import java.util.concurrent.Callable;

/**
 * Run in a child JVM by {@link LargeDataMemoryTest}, so that its heap limit is the one under test:
 * writes a generated CSV of the given shape, then measures the peak heap of loading, of training
 * (with the loaded data still held) and of the whole compile job (load, split, train, score, emit,
 * verify), printing one {@code key=value} line per measurement.
 *
 * <p>Arguments: directory, rows, numeric features, categorical features.
 */
final class LargeDataRun {
  private LargeDataRun() {}

  public static void main(String[] args) throws Exception {
    Path dir = Path.of(args[0]);
    int rows = Integer.parseInt(args[1]);
    int numeric = Integer.parseInt(args[2]);
    int categorical = Integer.parseInt(args[3]);
    Path csv = dir.resolve("large-" + rows + "x" + (numeric + categorical) + ".csv");
    write(csv, rows, numeric, categorical, 42);
    System.out.printf(Locale.ROOT, "fileBytes=%d%n", Files.size(csv));

    // The loaded data stays reachable while the tree trains, so the train peak includes it.
    LoadedData loaded = measure("load", () -> CsvLoader.load(csv, LoadOptions.defaults()));
    DecisionTree tree = measure("train",
        () -> CartTrainer.train(loaded.dataset(), TrainingOptions.defaults()));
    System.out.printf(Locale.ROOT, "rows=%d%nfeatures=%d%n", loaded.dataset().rows(),
        loaded.dataset().featureCount());
    System.out.printf(Locale.ROOT, "leaves=%d%n", tree.leafCount());

    CompileResult result = measure("compileJob", () -> new CompileJob(Verifier.create()).run(
        new CompileRequest(csv, Optional.empty(), Optional.empty(), LoadOptions.defaults(),
            new double[] {0.6, 0.2, 0.2}, 1, TrainingOptions.defaults(),
            EmitOptions.builder("", "Large").build(), dir.resolve("out"), Optional.empty(),
            "")));
    System.out.printf(Locale.ROOT, "verifiedInputs=%d%nmismatches=%d%npassed=%b%n",
        result.verification().inputsChecked(), result.verification().mismatches(),
        result.verification().passed());
  }

  /**
   * Runs {@code work} and prints its time and peak heap: the largest heap use seen by a sampler
   * every 5 ms (it can miss a short spike), and the sum of each heap pool's own peak (an upper
   * bound, since the pools need not peak at once).
   */
  private static <T> T measure(String name, Callable<T> work) throws Exception {
    System.gc();
    for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
      pool.resetPeakUsage();
    }
    long[] sampled = {used()};
    Thread sampler = new Thread(() -> {
      while (!Thread.currentThread().isInterrupted()) {
        sampled[0] = Math.max(sampled[0], used());
        try {
          Thread.sleep(5);
        } catch (InterruptedException e) {
          return;
        }
      }
    });
    sampler.setDaemon(true);
    sampler.start();
    long start = System.nanoTime();
    T result = work.call();
    long millis = (System.nanoTime() - start) / 1_000_000;
    sampler.interrupt();
    sampler.join();
    long poolPeaks = 0;
    for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
      if (pool.getType() == MemoryType.HEAP) {
        poolPeaks += pool.getPeakUsage().getUsed();
      }
    }
    System.out.printf(Locale.ROOT, "%sMillis=%d%n%sSampledPeakMiB=%d%n%sPoolPeaksMiB=%d%n",
        name, millis, name, sampled[0] >> 20, name, poolPeaks >> 20);
    return result;
  }

  private static long used() {
    return ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed();
  }

  /** Appends {@code hundredths / 100} with two decimals; String.format would dominate the run. */
  private static void appendHundredths(StringBuilder line, long hundredths) {
    long abs = Math.abs(hundredths);
    if (hundredths < 0) {
      line.append('-');
    }
    line.append(abs / 100).append('.').append((char) ('0' + abs / 10 % 10))
        .append((char) ('0' + abs % 10));
  }

  /**
   * Writes rows whose class (three classes) depends on the first two numeric features and the
   * first categorical one, with 10% of labels random and 1% of numeric cells empty.
   */
  static void write(Path csv, int rows, int numeric, int categorical, long seed)
      throws IOException {
    SplittableRandom random = new SplittableRandom(seed);
    try (BufferedWriter out = Files.newBufferedWriter(csv, StandardCharsets.UTF_8)) {
      for (int f = 0; f < numeric; f++) {
        out.write("n" + f + ",");
      }
      for (int f = 0; f < categorical; f++) {
        out.write("c" + f + ",");
      }
      out.write("state\n");
      float[] x = new float[numeric];
      int[] c = new int[categorical];
      StringBuilder line = new StringBuilder();
      for (int r = 0; r < rows; r++) {
        line.setLength(0);
        for (int f = 0; f < numeric; f++) {
          long hundredths = Math.round(random.nextGaussian() * 1000);
          x[f] = hundredths / 100f;
          if (random.nextInt(100) != 0) {
            appendHundredths(line, hundredths);
          }
          line.append(',');
        }
        for (int f = 0; f < categorical; f++) {
          c[f] = random.nextInt(3 + 5 * f);
          line.append("k").append(c[f]).append(',');
        }
        double score = x[0] + (numeric > 1 ? 0.5 * x[1] : 0) + (categorical > 0 ? 4 * c[0] : 0);
        int label = score < 0 ? 0 : score < 10 ? 1 : 2;
        if (random.nextInt(10) == 0) {
          label = random.nextInt(3);
        }
        out.append(line).append("s").append(Integer.toString(label)).append('\n');
      }
    }
  }
}
