package dev.splitwright.samples;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * The samples must build with nothing but the JDK: every dependency this module declares is for
 * its tests only, so the main source set (the generated classifiers and examples) compiles against
 * the JDK alone.
 */
class NoDependenciesTest {
  private static final Pattern DEPENDENCY =
      Pattern.compile("<dependency>(.*?)</dependency>", Pattern.DOTALL);

  @Test
  void everyDeclaredDependencyIsTestScoped() throws IOException {
    String pom = Files.readString(Path.of("pom.xml"), StandardCharsets.UTF_8);
    Matcher m = DEPENDENCY.matcher(pom);
    int found = 0;
    while (m.find()) {
      found++;
      assertThat(m.group(1)).as("dependency %s", m.group(1).strip())
          .contains("<scope>test</scope>");
    }
    assertThat(found).as("the golden tests need the compiler in test scope").isPositive();
  }
}
