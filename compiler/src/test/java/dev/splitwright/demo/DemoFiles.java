package dev.splitwright.demo;

import java.nio.file.Path;

/**
 * The committed demo CSVs, read from the one place the build declares: the parent pom's
 * {@code splitwright.demoData} property, passed to every test JVM by Surefire. No module reads
 * another module's files for them.
 */
public final class DemoFiles {
  /** The system property Surefire sets to the demo data directory. */
  public static final String PROPERTY = "splitwright.demoData";

  private DemoFiles() {}

  /** The directory holding the demo CSVs. */
  public static Path dir() {
    String dir = System.getProperty(PROPERTY);
    if (dir == null || dir.isBlank()) {
      throw new IllegalStateException("system property " + PROPERTY + " is not set; run the tests "
          + "through Maven, whose parent pom sets it");
    }
    return Path.of(dir).normalize();
  }

  /** The committed CSV of {@code scenario}, e.g. {@code pump-vibration}. */
  public static Path of(String scenario) {
    return dir().resolve(scenario + ".csv");
  }

  /** The pump-vibration demo (3,000 rows, target {@code state}). */
  public static Path pump() {
    return of("pump-vibration");
  }
}
