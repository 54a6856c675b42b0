package dev.splitwright.bench;

import dev.splitwright.check.CompilationException;
import dev.splitwright.check.CompiledClasses;
import dev.splitwright.data.Dataset;
import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.io.OutputStream;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.function.IntFunction;
import java.util.function.Supplier;
import weka.classifiers.Classifier;
import weka.core.Instances;
import weka.core.Version;

/**
 * Keeps what is slow to make on disk between benchmark JVMs: trained Weka classifiers (J48 needs
 * a minute on the 200,000-row set), generated input readings (the pump scenario formats every value
 * as decimal text, seconds for 65,536 rows) and compiled classifiers (javac needs seconds for the
 * deep tree). Every JMH fork is a fresh JVM, so without this each fork would redo them.
 *
 * <p>Entries are named by a SHA-256 of everything they depend on: for a model the learner, its
 * options, the Weka version and every value and label of the training rows; for readings the name,
 * count, seed and the first rows the generator gives now; for class files the JVM version, javac
 * options and the source text. A changed generator, option or source therefore
 * never loads a stale entry. Java serialization is fine here: the store only ever reads files it
 * wrote itself.
 */
final class BenchStore {
  /** The system property naming the store's directory. */
  static final String DIRECTORY_PROPERTY = "splitwright.bench.store";

  private static final int FORMAT = 1;

  /** Rows generated afresh to fingerprint a generator's current output. */
  private static final int FINGERPRINT_ROWS = 64;

  private final Path directory;

  BenchStore(Path directory) {
    this.directory = directory;
  }

  /** The store in {@code -Dsplitwright.bench.store}, else under the temporary directory. */
  static BenchStore fromSystemProperty() {
    String configured = System.getProperty(DIRECTORY_PROPERTY);
    return new BenchStore(configured != null
        ? Path.of(configured)
        : Path.of(System.getProperty("java.io.tmpdir"), "splitwright-bench-store"));
  }

  /**
   * Loads the classifier trained on {@code rows}, training and saving it if absent; {@code
   * instances} converts the rows to Weka's form, only when training is needed.
   */
  Classifier trainedOn(WekaLearner learner, int depth, Dataset rows,
      Supplier<Instances> instances) throws Exception {
    Path file = fileFor(learner, depth, rows);
    if (Files.isRegularFile(file)) {
      try (InputStream in = Files.newInputStream(file);
          ObjectInputStream objects = new ObjectInputStream(in)) {
        return (Classifier) objects.readObject();
      }
    }
    Classifier trained = learner.train(instances.get(), depth);
    save(file, trained);
    return trained;
  }

  /** Saves a classifier trained elsewhere (the training benchmark) unless one is stored. */
  void offer(WekaLearner learner, int depth, Dataset rows, Classifier trained) throws IOException {
    Path file = fileFor(learner, depth, rows);
    if (!Files.isRegularFile(file)) {
      save(file, trained);
    }
  }

  /**
   * Loads {@code count} readings made by {@code generate} (called with a row count) from {@code
   * seed}, generating and saving them if absent.
   */
  LabelledRows readings(String name, int count, long seed, IntFunction<LabelledRows> generate)
      throws IOException {
    MessageDigest sha = sha256();
    sha.update((FORMAT + "|" + name + "|" + count + "|" + seed).getBytes(StandardCharsets.UTF_8));
    update(sha, generate.apply(Math.min(count, FINGERPRINT_ROWS)));
    Path file = directory.resolve(name + "-" + hex(sha) + ".rows");
    if (Files.isRegularFile(file)) {
      try (DataInputStream in = new DataInputStream(
          new BufferedInputStream(Files.newInputStream(file)))) {
        return readRows(in);
      }
    }
    LabelledRows rows = generate.apply(count);
    Files.createDirectories(directory);
    Path temp = Files.createTempFile(directory, "partial-", ".tmp");
    try (DataOutputStream out = new DataOutputStream(
        new BufferedOutputStream(Files.newOutputStream(temp)))) {
      writeRows(out, rows);
    }
    Files.move(temp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    return rows;
  }

  /** What produces class files on a miss. */
  interface Compilation {
    CompiledClasses run() throws CompilationException;
  }

  /**
   * Loads the class files javac made from {@code source} with {@code options} on this JDK,
   * compiling and saving them if absent: javac needs seconds for a tree of thousands of leaves.
   */
  CompiledClasses compiled(String name, String source, List<String> options,
      Compilation compile) throws IOException, CompilationException {
    MessageDigest sha = sha256();
    sha.update((FORMAT + "|" + System.getProperty("java.vm.version") + "|" + options + "|" + name
        + "|" + source).getBytes(StandardCharsets.UTF_8));
    Path file = directory.resolve(name + "-" + hex(sha) + ".classes");
    if (Files.isRegularFile(file)) {
      try (DataInputStream in = new DataInputStream(
          new BufferedInputStream(Files.newInputStream(file)))) {
        Map<String, byte[]> classes = new TreeMap<>();
        for (int n = in.readInt(); n > 0; n--) {
          String className = in.readUTF();
          classes.put(className, in.readNBytes(in.readInt()));
        }
        return CompiledClasses.of(classes);
      }
    }
    CompiledClasses classes = compile.run();
    Files.createDirectories(directory);
    Path temp = Files.createTempFile(directory, "partial-", ".tmp");
    try (DataOutputStream out = new DataOutputStream(
        new BufferedOutputStream(Files.newOutputStream(temp)))) {
      out.writeInt(classes.names().size());
      for (String className : classes.names()) {
        byte[] bytes = classes.bytes(className);
        out.writeUTF(className);
        out.writeInt(bytes.length);
        out.write(bytes);
      }
    }
    Files.move(temp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    return classes;
  }

  private static void writeRows(DataOutputStream out, LabelledRows rows) throws IOException {
    out.writeInt(rows.size());
    out.writeInt(rows.size() == 0 ? 0 : rows.rows()[0].length);
    for (int i = 0; i < rows.size(); i++) {
      for (float v : rows.rows()[i]) {
        out.writeInt(Float.floatToRawIntBits(v));
      }
      out.writeInt(rows.labels()[i]);
    }
  }

  private static LabelledRows readRows(DataInputStream in) throws IOException {
    int count = in.readInt();
    int features = in.readInt();
    float[][] rows = new float[count][features];
    int[] labels = new int[count];
    for (int i = 0; i < count; i++) {
      for (int f = 0; f < features; f++) {
        rows[i][f] = Float.intBitsToFloat(in.readInt());
      }
      labels[i] = in.readInt();
    }
    return new LabelledRows(rows, labels);
  }

  private static void update(MessageDigest sha, LabelledRows rows) {
    for (int i = 0; i < rows.size(); i++) {
      ByteBuffer row = ByteBuffer.allocate(4 * rows.rows()[i].length + 4);
      for (float v : rows.rows()[i]) {
        row.putInt(Float.floatToRawIntBits(v));
      }
      sha.update(row.putInt(rows.labels()[i]).array());
    }
  }

  Path fileFor(WekaLearner learner, int depth, Dataset rows) {
    return directory.resolve(learner.displayName() + "-" + key(learner, depth, rows) + ".ser");
  }

  private void save(Path file, Classifier trained) throws IOException {
    Files.createDirectories(directory);
    Path temp = Files.createTempFile(directory, "partial-", ".tmp");
    try (OutputStream out = Files.newOutputStream(temp);
        ObjectOutputStream objects = new ObjectOutputStream(out)) {
      objects.writeObject(trained);
    }
    // Two forks may race to store the same entry; either copy is the same model.
    Files.move(temp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
  }

  private static MessageDigest sha256() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every JDK has SHA-256", e);
    }
  }

  private static String hex(MessageDigest sha) {
    return HexFormat.of().formatHex(sha.digest(), 0, 12);
  }

  private static String key(WekaLearner learner, int depth, Dataset rows) {
    MessageDigest sha = sha256();
    String header = FORMAT + "|" + Version.VERSION + "|" + learner.name() + "|"
        + String.join(" ", learner.options(depth)) + "|" + rows.schema();
    sha.update(header.getBytes(StandardCharsets.UTF_8));
    ByteBuffer row = ByteBuffer.allocate(4 * rows.featureCount() + 4);
    for (int r = 0; r < rows.rows(); r++) {
      row.clear();
      for (int f = 0; f < rows.featureCount(); f++) {
        row.putInt(Float.floatToRawIntBits(rows.value(r, f)));
      }
      row.putInt(rows.label(r));
      sha.update(row.array());
    }
    return hex(sha);
  }
}
