package dev.splitwright.check;

import java.time.Duration;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/** The object files one compiler run produced, one per translation unit. */
public final class ObjectFiles {

  private final SortedMap<String, byte[]> bySource;
  private final String diagnostics;
  private final Duration elapsed;

  ObjectFiles(Map<String, byte[]> bySource, String diagnostics, Duration elapsed) {
    this.bySource = Collections.unmodifiableSortedMap(new TreeMap<>(bySource));
    this.diagnostics = Objects.requireNonNull(diagnostics, "diagnostics");
    this.elapsed = Objects.requireNonNull(elapsed, "elapsed");
  }

  /** The translation units compiled, e.g. {@code [a.c, b.c]}, in name order. */
  public List<String> sourceNames() {
    return List.copyOf(bySource.keySet());
  }

  /**
   * A copy of the object file compiled from {@code sourceName}.
   *
   * @throws IllegalArgumentException if no translation unit has that name
   */
  public byte[] bytes(String sourceName) {
    return get(sourceName).clone();
  }

  /**
   * The object file compiled from {@code sourceName}, parsed.
   *
   * @throws IllegalArgumentException if no translation unit has that name, or the compiler wrote
   *     something that is not ELF (e.g. a Mach-O or COFF object)
   */
  public ElfFile elf(String sourceName) {
    return ElfFile.parse(get(sourceName));
  }

  /** What the compiler wrote to standard error although it succeeded, e.g. warnings. */
  public String diagnostics() {
    return diagnostics;
  }

  /** Wall-clock time of the whole compiler run. */
  public Duration elapsed() {
    return elapsed;
  }

  private byte[] get(String sourceName) {
    Objects.requireNonNull(sourceName, "sourceName");
    byte[] bytes = bySource.get(sourceName);
    if (bytes == null) {
      throw new IllegalArgumentException(
          "no object file for \"" + sourceName + "\"; compiled were " + bySource.keySet());
    }
    return bytes;
  }
}
