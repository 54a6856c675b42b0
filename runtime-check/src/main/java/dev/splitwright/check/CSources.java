package dev.splitwright.check;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.regex.Pattern;

/**
 * C sources and headers by file name, sorted by name so that command lines and outputs do not
 * depend on the caller's map order. Linker scripts ({@code .ld}) may come along; like headers they
 * are written next to the sources but not compiled.
 */
final class CSources {

  // Plain names only: no directories, nothing that could escape the temporary directory or be
  // taken for a compiler option.
  private static final Pattern NAME = Pattern.compile("[A-Za-z0-9_][A-Za-z0-9_.+-]*\\.(c|h|ld)");

  private final SortedMap<String, String> files;

  CSources(Map<String, String> files) {
    Objects.requireNonNull(files, "sources");
    this.files = new TreeMap<>();
    files.forEach(
        (name, text) -> {
          Objects.requireNonNull(name, "source file name");
          Objects.requireNonNull(text, "text of " + name);
          if (!NAME.matcher(name).matches()) {
            throw new IllegalArgumentException(
                "source file name \"" + name + "\" must be a plain name ending in .c, .h or .ld");
          }
          this.files.put(name, text);
        });
    if (translationUnits().isEmpty()) {
      throw new IllegalArgumentException(
          "sources must include at least one .c file, but they are " + files.keySet());
    }
  }

  /** The {@code .c} files, in name order. */
  List<String> translationUnits() {
    return files.keySet().stream().filter(n -> n.endsWith(".c")).toList();
  }

  static String objectName(String translationUnit) {
    return translationUnit.substring(0, translationUnit.length() - 2) + ".o";
  }

  void writeTo(Path directory) {
    files.forEach(
        (name, text) -> {
          try {
            Files.writeString(directory.resolve(name), text, StandardCharsets.UTF_8);
          } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + name, e);
          }
        });
  }
}
