package dev.splitwright.samples;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * The samples must build with nothing but the JDK: every dependency this module resolves is for its
 * tests only, so the main source set (the generated classifiers and examples) compiles against the
 * JDK alone. Checked on the dependency set Maven resolved (written by this module's
 * {@code dependency:list} execution), so dependencies inherited from the parent pom or pulled in
 * transitively count too, not only the ones this module's pom spells out.
 */
class NoDependenciesTest {
  /** {@code group:artifact:type[:classifier]:version:scope}, then optional module details. */
  private static final Pattern ENTRY = Pattern.compile("^\\s+(\\S+:\\S+):([a-z]+)(\\s.*)?$");

  /** One resolved dependency: its coordinates without the scope, and its effective scope. */
  record Entry(String coordinates, String scope) {
    String groupAndArtifact() {
      String[] parts = coordinates.split(":");
      return parts[0] + ":" + parts[1];
    }
  }

  @Test
  void everyResolvedDependencyIsTestScoped() throws IOException {
    List<Entry> resolved = resolved();
    assertThat(resolved).as("the golden tests need the compiler in test scope")
        .filteredOn(e -> e.groupAndArtifact().equals("dev.splitwright:compiler"))
        .extracting(Entry::scope).containsExactly("test");
    assertThat(resolved).allSatisfy(e -> assertThat(e.scope())
        .as("scope of %s", e.coordinates()).isEqualTo("test"));
  }

  @Test
  void readsCoordinatesAndScopeOfListLines() {
    assertThat(parse("   info.picocli:picocli:jar:4.7.7:compile -- module info.picocli"))
        .isEqualTo(new Entry("info.picocli:picocli:jar:4.7.7", "compile"));
    assertThat(parse("   a.b:c:jar:natives:1.1:runtime"))
        .isEqualTo(new Entry("a.b:c:jar:natives:1.1", "runtime"));
    assertThat(parse("   a.b:c:jar:natives:1.1:runtime").groupAndArtifact()).isEqualTo("a.b:c");
  }

  private static List<Entry> resolved() throws IOException {
    String file = System.getProperty("splitwright.resolvedDependencies");
    assertThat(file).as("system property splitwright.resolvedDependencies (set by this module's "
        + "pom; run the test through Maven)").isNotBlank();
    List<Entry> entries = Files.readAllLines(Path.of(file), StandardCharsets.UTF_8).stream()
        .filter(l -> ENTRY.matcher(l).matches()).map(NoDependenciesTest::parse).toList();
    assertThat(entries).as("dependencies listed in %s", file).isNotEmpty();
    return entries;
  }

  private static Entry parse(String line) {
    Matcher m = ENTRY.matcher(line);
    assertThat(m.matches()).as("dependency:list line '%s'", line).isTrue();
    return new Entry(m.group(1), m.group(2));
  }
}
