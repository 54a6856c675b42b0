package dev.splitwright.job;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Collects output files and writes them only when all are ready: each goes to a temporary file in
 * its own directory first, then every one is moved into place. If anything fails before the moves,
 * the temporary files are deleted and existing outputs are untouched.
 */
public final class OutputFiles {
  private final Map<Path, String> pending = new LinkedHashMap<>();

  /** Queues {@code text} for {@code target}; a later call for the same path replaces it. */
  public void add(Path target, String text) {
    pending.put(target.toAbsolutePath().normalize(), text);
  }

  /** The queued paths, in the order they were added. */
  public List<Path> paths() {
    return List.copyOf(pending.keySet());
  }

  /**
   * Writes every queued file. Directories are created as needed.
   *
   * @throws IOException if a file cannot be written; temporary files are removed first
   */
  public void commit() throws IOException {
    List<Path[]> staged = new ArrayList<>();
    try {
      for (Map.Entry<Path, String> e : pending.entrySet()) {
        Path target = e.getKey();
        if (Files.isDirectory(target)) {
          throw new IOException(target + " is a directory");
        }
        Path dir = target.getParent();
        Files.createDirectories(dir);
        Path temp = Files.createTempFile(dir, "." + target.getFileName(), ".tmp");
        staged.add(new Path[] {temp, target});
        Files.writeString(temp, e.getValue(), StandardCharsets.UTF_8);
      }
    } catch (IOException | RuntimeException e) {
      for (Path[] pair : staged) {
        Files.deleteIfExists(pair[0]);
      }
      throw e;
    }
    for (Path[] pair : staged) {
      move(pair[0], pair[1]);
    }
  }

  private static void move(Path temp, Path target) throws IOException {
    try {
      Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    } catch (AtomicMoveNotSupportedException e) {
      Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING);
    }
  }
}
