package dev.splitwright.bench;

import dev.splitwright.data.Dataset;
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
import java.util.function.Supplier;
import weka.classifiers.Classifier;
import weka.core.Instances;
import weka.core.Version;

/**
 * Keeps trained Weka classifiers on disk between benchmark JVMs. J48 needs minutes on the 200,000-row
 * set, and every JMH fork is a fresh JVM, so without this each prediction fork would retrain it.
 * Entries are named by a SHA-256 of the learner, its options, the Weka version and every value and
 * label of the training rows, so a changed generator or option can never load a stale model.
 * Java serialization is fine here: the store only ever reads files it wrote itself.
 */
final class ModelStore {
  /** The system property naming the store's directory. */
  static final String DIRECTORY_PROPERTY = "splitwright.bench.models";

  private static final int FORMAT = 1;

  private final Path directory;

  ModelStore(Path directory) {
    this.directory = directory;
  }

  /** The store in {@code -Dsplitwright.bench.models}, else under the temporary directory. */
  static ModelStore fromSystemProperty() {
    String configured = System.getProperty(DIRECTORY_PROPERTY);
    return new ModelStore(configured != null
        ? Path.of(configured)
        : Path.of(System.getProperty("java.io.tmpdir"), "splitwright-bench-models"));
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

  private static String key(WekaLearner learner, int depth, Dataset rows) {
    MessageDigest sha;
    try {
      sha = MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every JDK has SHA-256", e);
    }
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
    return HexFormat.of().formatHex(sha.digest(), 0, 12);
  }
}
