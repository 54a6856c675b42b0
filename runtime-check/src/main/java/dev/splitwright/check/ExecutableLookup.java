package dev.splitwright.check;

import java.io.File;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;

/** Finds an external tool the way a POSIX shell does: a path as given, else a name on PATH. */
final class ExecutableLookup {

  private ExecutableLookup() {}

  /** The executable file of {@code command}, absolute, if there is one. */
  static Optional<Path> find(String command) {
    if (command.contains(File.separator)) {
      Path path = Path.of(command);
      return isExecutableFile(path) ? Optional.of(path.toAbsolutePath()) : Optional.empty();
    }
    String searchPath = Optional.ofNullable(System.getenv("PATH")).orElse("");
    for (String entry : searchPath.split(File.pathSeparator, -1)) {
      // An empty PATH entry means the current directory (POSIX).
      Path candidate = Path.of(entry.isEmpty() ? "." : entry).resolve(command);
      if (isExecutableFile(candidate)) {
        return Optional.of(candidate.toAbsolutePath());
      }
    }
    return Optional.empty();
  }

  /** Why {@link #find} found nothing, for messages. */
  static String whereNotFound(String command) {
    return command.contains(File.separator)
        ? "no executable file at that path"
        : "no executable of that name on PATH";
  }

  private static boolean isExecutableFile(Path path) {
    return Files.isRegularFile(path) && Files.isExecutable(path);
  }
}
