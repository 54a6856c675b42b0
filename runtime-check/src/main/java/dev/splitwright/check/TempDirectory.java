package dev.splitwright.check;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/** A fresh directory under the system temporary directory, deleted with its contents on close. */
final class TempDirectory implements AutoCloseable {

  private final Path path;

  private TempDirectory(Path path) {
    this.path = path;
  }

  static TempDirectory create(String prefix) {
    try {
      return new TempDirectory(Files.createTempDirectory(prefix));
    } catch (IOException e) {
      throw new UncheckedIOException("cannot create a temporary directory", e);
    }
  }

  Path path() {
    return path;
  }

  @Override
  public void close() {
    if (!Files.exists(path)) {
      return;
    }
    List<Path> deepestFirst;
    try (Stream<Path> walk = Files.walk(path)) {
      deepestFirst = walk.sorted(Comparator.reverseOrder()).toList();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot list temporary directory " + path, e);
    }
    for (Path p : deepestFirst) {
      try {
        Files.deleteIfExists(p);
      } catch (IOException e) {
        throw new UncheckedIOException("cannot delete " + p, e);
      }
    }
  }
}
