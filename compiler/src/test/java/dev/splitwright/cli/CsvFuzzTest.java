package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.CsvLoader;
import dev.splitwright.data.Dataset;
import dev.splitwright.data.InputException;
import dev.splitwright.data.LoadOptions;
import dev.splitwright.data.LoadedData;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.HeaderInfo;
import dev.splitwright.emit.JavaEmitter;
import dev.splitwright.emit.Layout;
import dev.splitwright.eval.Evaluator;
import dev.splitwright.eval.SplitParts;
import dev.splitwright.eval.StratifiedSplit;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.train.CartTrainer;
import dev.splitwright.train.ClassWeights;
import dev.splitwright.train.Impurity;
import dev.splitwright.train.TrainingOptions;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Seeded fuzzing of everything a CSV file reaches. Valid files (our pump demo trimmed to 200 rows,
 * a categorical variant of it, and the UCI voting records) are mutated by byte flips, truncation,
 * inserted quotes, delimiters, line breaks and random bytes, duplicated or removed header cells,
 * odd numbers and 1 MB fields. Every case must load and train, or fail with an {@link
 * InputException} of one line; one case in 25 runs the whole command line and must
 * exit 0 or 2 with one clean stderr line. Nothing may throw anything else, hang past {@value
 * #TIMEOUT_SECONDS} s or run out of memory. A failing case is saved under {@code
 * target/fuzz-failures/} with its seed and mutations, to be replayed and kept as a regression test.
 */
class CsvFuzzTest {
  /**
   * Fixed so that a failure replays exactly. To explore further, run with {@code -Dfuzz.seed=N}
   * and {@code -Dfuzz.cases=N} (and {@code -Dfuzz.cliEvery=N}); CI always uses the defaults.
   */
  private static final long SEED = Long.getLong("fuzz.seed", 6_2024L);

  private static final int CASES = Integer.getInteger("fuzz.cases", 5000);
  private static final int CLI_EVERY = Integer.getInteger("fuzz.cliEvery", 25);
  private static final int TIMEOUT_SECONDS = 30;
  private static final int HUGE_FIELD = 1 << 20;
  private static final int HUGE_EVERY = 40;

  private static final Path FAILURES = Path.of("target/fuzz-failures");

  @TempDir Path dir;

  /** A valid file to mutate and its class-label column. */
  record Sample(String name, byte[] bytes, String target) {
    /** The column names of the unmutated file, unquoted. */
    List<String> header() {
      String first = new String(bytes, StandardCharsets.UTF_8).lines().findFirst().orElse("");
      return List.of(first.replace("\"", "").split(","));
    }
  }

  /** One mutated input: what was done to which sample, and with which options. */
  record Input(int index, Sample sample, List<String> mutations, byte[] bytes, LoadOptions options,
      TrainingOptions training, double[] split, Layout layout, List<String> cliOptions) {
    @Override
    public String toString() {
      return "case " + index + " (" + sample.name() + ": " + String.join(", ", mutations) + "; "
          + String.join(" ", cliOptions) + ")";
    }
  }

  @Test
  void everyMutatedFileLoadsOrFailsWithOneCleanLine() throws Exception {
    List<Sample> samples = samples();
    SplittableRandom random = new SplittableRandom(SEED);
    Path file = dir.resolve("fuzz.csv");
    List<String> failures = new ArrayList<>();
    int[] outcomes = new int[2];
    long cliNanos = 0;
    long start = System.nanoTime();
    ExecutorService worker = newWorker();
    try {
      for (int i = 0; i < CASES && failures.size() < 50; i++) {
        Input input = mutate(i, samples.get(random.nextInt(samples.size())), random);
        Files.write(file, input.bytes());
        boolean viaCli = i % CLI_EVERY == 0;
        long caseStart = System.nanoTime();
        Future<String> outcome =
            worker.submit(() -> viaCli ? runCli(file, input) : runLibrary(file, input));
        String problem;
        try {
          problem = outcome.get(TIMEOUT_SECONDS, TimeUnit.SECONDS);
        } catch (TimeoutException e) {
          outcome.cancel(true);
          worker.shutdownNow();
          worker = newWorker(); // the stuck thread is a daemon and is left behind
          problem = "no result within " + TIMEOUT_SECONDS + " s";
        } catch (ExecutionException e) {
          problem = "threw " + stackTrace(e.getCause());
        }
        cliNanos += viaCli ? System.nanoTime() - caseStart : 0;
        if (problem.startsWith("ok") || problem.startsWith("rejected")) {
          outcomes[problem.startsWith("ok") ? 0 : 1]++;
        } else {
          failures.add(input + ": " + problem);
          save(input);
        }
      }
    } finally {
      worker.shutdownNow();
    }
    double seconds = (System.nanoTime() - start) / 1e9;
    System.out.printf(Locale.ROOT, "fuzz: %d cases (%d through the command line, %.1f s) in"
        + " %.1f s: %d accepted, %d rejected with one line, %d failures%n", CASES,
        (CASES + CLI_EVERY - 1) / CLI_EVERY, cliNanos / 1e9, seconds, outcomes[0], outcomes[1],
        failures.size());
    assertThat(failures).as("failing cases, saved under " + FAILURES.toAbsolutePath()).isEmpty();
    // The mutations must not be so harsh that nothing loads, nor so mild that nothing fails.
    assertThat(outcomes[0]).isGreaterThan(CASES / 20);
    assertThat(outcomes[1]).isGreaterThan(CASES / 4);
  }

  /** Load, split, train and emit, as the job does, without javac: "ok", "rejected" or a problem. */
  static String runLibrary(Path file, Input input) {
    LoadedData loaded;
    try {
      loaded = CsvLoader.load(file, input.options());
    } catch (InputException e) {
      return checkMessage(e.getMessage(), file);
    }
    Dataset data = loaded.dataset();
    if (data.schema().classCount() < 2) {
      return "rejected (one class)"; // the job stops here with its own one-line error
    }
    double[] f = input.split();
    SplitParts parts = StratifiedSplit.split(data, f[0], f[1], f[2], 1);
    DecisionTree tree = CartTrainer.train(parts.train(), input.training());
    Evaluator.score(tree, parts.test());
    String source = JavaEmitter.emit(tree,
        EmitOptions.builder("fuzz", "Fuzz").layout(input.layout()).build(), HeaderInfo.none())
        .source();
    return source.contains("public final class Fuzz") ? "ok" : "emitted no class";
  }

  private static String checkMessage(String message, Path file) {
    if (message.contains("\n") || message.contains("\r")) {
      return "message spans lines: " + message;
    }
    if (!message.startsWith(file.toString()) && !message.startsWith("option --")) {
      return "message names neither the file nor an option: " + message;
    }
    return "rejected";
  }

  /** The whole command line, javac included: exit 0, or exit 2 with one clean line. */
  String runCli(Path file, Input input) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", file.toString(), "--class",
        "Fuzz", "--package", "fuzz", "--out", dir.resolve("out").toString(), "--quiet"));
    args.addAll(input.cliOptions());
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = Main.run(args.toArray(new String[0]), new PrintWriter(out), new PrintWriter(err));
    String text = err.toString().strip();
    if (code == 0) {
      return text.isEmpty() ? "ok" : "exit 0 with stderr: " + text;
    }
    if (code != 2) {
      return "exit " + code + ": " + text;
    }
    if (text.contains("\n") || text.contains("\tat ") || text.contains("Exception")) {
      return "exit 2 but not one clean line: " + text;
    }
    return "rejected";
  }

  static Input mutate(int index, Sample sample, SplittableRandom random) {
    Mutator m = new Mutator(sample.bytes(), random);
    int count = 1 + random.nextInt(3);
    for (int k = 0; k < count; k++) {
      m.apply(random.nextInt(Mutator.KINDS));
    }
    if (random.nextInt(HUGE_EVERY) == 0) {
      // Rarer than the rest: a megabyte per case would dominate the run time.
      m.hugeField(random.nextInt(m.bytes().length + 1));
    }
    List<String> cli = new ArrayList<>();
    LoadOptions.Builder options = LoadOptions.builder();
    if (random.nextInt(10) > 0) {
      options.target(sample.target());
      cli.addAll(List.of("--target", sample.target()));
    }
    if (random.nextInt(8) == 0) {
      options.missingTokens(List.of("NA", "?"));
      cli.addAll(List.of("--missing", "NA,?"));
    }
    // Declared column kinds: a column may have lost its name or its numbers to the mutations.
    List<String> header = sample.header();
    if (random.nextInt(8) == 0) {
      String column = header.get(random.nextInt(header.size()));
      options.categoricalColumns(List.of(column));
      cli.addAll(List.of("--categorical", column));
    } else if (random.nextInt(8) == 0) {
      String column = header.get(random.nextInt(header.size()));
      options.numericColumns(List.of(column));
      cli.addAll(List.of("--numeric", column));
    }
    // Small trees of varied shape keep the cases fast yet reach every growth rule.
    int depth = 1 + random.nextInt(4);
    int minLeaf = 1 + random.nextInt(random.nextBoolean() ? 3 : 300);
    Impurity impurity = random.nextBoolean() ? Impurity.GINI : Impurity.ENTROPY;
    TrainingOptions.Builder training =
        TrainingOptions.builder().maxDepth(depth).minLeaf(minLeaf).impurity(impurity);
    cli.addAll(List.of("--max-depth", Integer.toString(depth), "--min-leaf",
        Integer.toString(minLeaf), "--impurity", impurity.name().toLowerCase(Locale.ROOT)));
    if (random.nextInt(4) == 0) {
      int leaves = 2 + random.nextInt(6);
      training.maxLeaves(leaves);
      cli.addAll(List.of("--max-leaves", Integer.toString(leaves)));
    }
    if (random.nextInt(4) == 0) {
      training.weights(ClassWeights.inverseFrequency());
      cli.addAll(List.of("--class-weight", "inverse-frequency"));
    }
    Layout layout = random.nextBoolean() ? Layout.BRANCHES : Layout.TABLE;
    // The command line also picks between the layouts, and tries other input types and extras.
    cli.addAll(List.of("--layout", random.nextInt(3) == 0 ? "smallest" : layout.optionName(),
        "--input", List.of("float", "double", "int").get(random.nextInt(3))));
    if (random.nextInt(4) == 0) {
      cli.add("--probabilities");
    }
    double[][] splits = {{0.6, 0.2, 0.2}, {1, 0, 0}, {0.1, 0.45, 0.45}, {0.5, 0.5, 0}};
    double[] split = splits[random.nextInt(splits.length)];
    cli.addAll(List.of("--split", split[0] + "," + split[1] + "," + split[2]));
    return new Input(index, sample, m.done, m.bytes(), options.build(), training.build(), split,
        layout, cli);
  }

  /** Applies one mutation at a time to a growing byte buffer, logging what it did. */
  static final class Mutator {
    static final int KINDS = 13;
    private static final String[] ODD_CELLS = {"NaN", "-Infinity", "inf", "1e39", "-1e39", "-0",
        "0x1p3", "2.5f", "1e-50", "", " ", "NA", "?", "3.4028236e38", "1.4e-45", "\"\"",
        "9".repeat(400), "1,5", "\u00e9", "\t"};

    private byte[] bytes;
    private final SplittableRandom random;
    final List<String> done = new ArrayList<>();

    Mutator(byte[] bytes, SplittableRandom random) {
      this.bytes = bytes.clone();
      this.random = random;
    }

    byte[] bytes() {
      return bytes;
    }

    void apply(int kind) {
      int at = bytes.length == 0 ? 0 : random.nextInt(bytes.length + 1);
      switch (kind) {
        case 0 -> {
          if (bytes.length > 0) {
            int p = Math.min(at, bytes.length - 1);
            int bit = random.nextInt(8);
            bytes[p] ^= (byte) (1 << bit);
            done.add("flip bit " + bit + " at " + p);
          }
        }
        case 1 -> {
          bytes = Arrays.copyOf(bytes, at);
          done.add("truncate at " + at);
        }
        case 2 -> insert(at, "\"", "quote");
        case 3 -> insert(at, ",", "comma");
        case 4 -> {
          String[] breaks = {"\n", "\r", "\r\n", "\n\n"};
          insert(at, breaks[random.nextInt(breaks.length)], "line break");
        }
        case 5 -> {
          byte[] junk = new byte[1 + random.nextInt(64)];
          random.nextBytes(junk);
          insert(at, junk, "random bytes");
        }
        case 6 -> {
          int end = Math.min(bytes.length, at + 1 + random.nextInt(100));
          splice(at, end, new byte[0]);
          done.add("delete " + at + ".." + end);
        }
        case 7 -> headerCell(true);
        case 8 -> headerCell(false);
        case 9 -> replaceCell(ODD_CELLS[random.nextInt(ODD_CELLS.length)]);
        case 10 -> {
          String[] oddities = {"\uFEFF", "\u0000", "\"\"", ",,,", "\"a\nb\""};
          insert(at, oddities[random.nextInt(oddities.length)], "oddity");
        }
        case 11 -> duplicateLine();
        case 12 -> replaceCell("label" + random.nextInt(100_000));
        default -> throw new IllegalArgumentException("kind " + kind);
      }
    }

    private void insert(int at, String text, String what) {
      insert(at, text.getBytes(StandardCharsets.UTF_8), what);
    }

    private void insert(int at, byte[] insert, String what) {
      splice(at, at, insert);
      done.add("insert " + what + " at " + at);
    }

    private void splice(int from, int to, byte[] insert) {
      ByteArrayOutputStream out = new ByteArrayOutputStream(bytes.length + insert.length);
      out.write(bytes, 0, from);
      out.writeBytes(insert);
      out.write(bytes, to, bytes.length - to);
      bytes = out.toByteArray();
    }

    /** Duplicates (or removes) one cell of the first line. */
    private void headerCell(boolean duplicate) {
      int end = indexOf((byte) '\n', 0);
      List<int[]> cells = cells(0, end < 0 ? bytes.length : end);
      int[] cell = cells.get(random.nextInt(cells.size()));
      if (duplicate) {
        byte[] copy =
            Arrays.copyOfRange(bytes, cell[0], cell[1] + (cell[1] < bytes.length ? 1 : 0));
        splice(cell[0], cell[0], copy.length > 0 && copy[copy.length - 1] == ',' ? copy
            : concat(copy, new byte[] {','}));
        done.add("duplicate header cell at " + cell[0]);
      } else {
        splice(cell[0], Math.min(bytes.length, cell[1] + 1), new byte[0]);
        done.add("remove header cell at " + cell[0]);
      }
    }

    /** Replaces a random cell with about 1 MB of digits, letters or a quoted mix. */
    void hugeField(int near) {
      int[] cell = cellAt(near);
      char[] alphabet = switch (random.nextInt(3)) {
        case 0 -> "0123456789".toCharArray();
        case 1 -> "abcdefghij".toCharArray();
        default -> "a1,\n\" .".toCharArray();
      };
      StringBuilder field = new StringBuilder(HUGE_FIELD + 2);
      for (int i = 0; i < HUGE_FIELD; i++) {
        field.append(alphabet[random.nextInt(alphabet.length)]);
      }
      String text = alphabet.length == 7 ? "\"" + field.toString().replace("\"", "\"\"") + "\""
          : field.toString();
      splice(cell[0], cell[1], text.getBytes(StandardCharsets.UTF_8));
      done.add("1 MB field at " + cell[0]);
    }

    private void replaceCell(String text) {
      int[] cell = cellAt(bytes.length == 0 ? 0 : random.nextInt(bytes.length));
      splice(cell[0], cell[1], text.getBytes(StandardCharsets.UTF_8));
      done.add("cell at " + cell[0] + " := " + (text.length() > 20 ? text.length() + " chars"
          : "'" + text + "'"));
    }

    private void duplicateLine() {
      int start = bytes.length == 0 ? 0 : random.nextInt(bytes.length);
      while (start > 0 && bytes[start - 1] != '\n') {
        start--;
      }
      int end = indexOf((byte) '\n', start);
      end = end < 0 ? bytes.length : end + 1;
      splice(end, end, Arrays.copyOfRange(bytes, start, end));
      done.add("duplicate line at " + start);
    }

    /** The comma-separated cell around {@code at}, as [start, end) ignoring quotes. */
    private int[] cellAt(int at) {
      int start = Math.min(at, bytes.length);
      while (start > 0 && bytes[start - 1] != ',' && bytes[start - 1] != '\n') {
        start--;
      }
      int end = start;
      while (end < bytes.length && bytes[end] != ',' && bytes[end] != '\n'
          && bytes[end] != '\r') {
        end++;
      }
      return new int[] {start, end};
    }

    private List<int[]> cells(int from, int to) {
      List<int[]> cells = new ArrayList<>();
      int start = from;
      for (int i = from; i <= to; i++) {
        if (i == to || bytes[i] == ',') {
          cells.add(new int[] {start, i});
          start = i + 1;
        }
      }
      return cells;
    }

    private int indexOf(byte b, int from) {
      for (int i = from; i < bytes.length; i++) {
        if (bytes[i] == b) {
          return i;
        }
      }
      return -1;
    }

    private static byte[] concat(byte[] a, byte[] b) {
      byte[] out = Arrays.copyOf(a, a.length + b.length);
      System.arraycopy(b, 0, out, a.length, b.length);
      return out;
    }
  }

  /**
   * The valid files: our pump demo's first 200 rows; the same rows with two columns turned into
   * categories (temperature bands and a pump site), so categorical splits are fuzzed too; and the
   * UCI Congressional Voting Records (categorical y/n with empty cells, target in the first
   * column).
   */
  static List<Sample> samples() throws IOException {
    List<String> pump = Files.readAllLines(CompileCommandTest.PUMP, StandardCharsets.UTF_8)
        .subList(0, 201);
    StringBuilder categorical = new StringBuilder();
    for (int r = 0; r < pump.size(); r++) {
      String[] cells = pump.get(r).split(",", -1);
      if (r == 0) {
        cells[4] = "bearing_band";
        categorical.append("site,");
      } else {
        double temp = Double.parseDouble(cells[4]);
        cells[4] = temp < 45 ? "cool" : temp < 60 ? "warm" : "hot";
        categorical.append("site-").append((char) ('a' + r % 5)).append(',');
      }
      categorical.append(String.join(",", cells)).append('\n');
    }
    return List.of(
        new Sample("pump", (String.join("\n", pump) + "\n").getBytes(StandardCharsets.UTF_8),
            "state"),
        new Sample("pump-categorical", categorical.toString().getBytes(StandardCharsets.UTF_8),
            "state"),
        new Sample("house-votes",
            Files.readAllBytes(Path.of("src/test/resources/datasets/house-votes-84.csv")),
            "Class"));
  }

  private static ExecutorService newWorker() {
    return Executors.newSingleThreadExecutor(r -> {
      Thread t = new Thread(r, "fuzz-case");
      t.setDaemon(true);
      return t;
    });
  }

  private static void save(Input input) throws IOException {
    Files.createDirectories(FAILURES);
    Files.write(FAILURES.resolve("case-" + input.index() + ".csv"), input.bytes());
    Files.writeString(FAILURES.resolve("case-" + input.index() + ".txt"), input + "\n");
  }

  private static String stackTrace(Throwable t) {
    StringWriter s = new StringWriter();
    t.printStackTrace(new PrintWriter(s));
    String text = s.toString();
    return text.length() > 2000 ? text.substring(0, 2000) : text;
  }
}
