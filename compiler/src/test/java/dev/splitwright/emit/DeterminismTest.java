package dev.splitwright.emit;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.data.DataFile;
import dev.splitwright.model.DecisionTree;
import dev.splitwright.persist.ModelFile;
import dev.splitwright.persist.SavedModel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The same model gives byte-identical source whatever the locale, the JVM or object identities. */
class DeterminismTest {
  @TempDir Path temp;

  @Test
  void sourceIsTheSameUnderTurkishAndGermanDefaultLocales() {
    List<DecisionTree> trees = DeterminismCases.trees();
    Locale saved = Locale.getDefault();
    Map<String, String> turkish;
    Map<String, String> german;
    try {
      // Turkish lower-cases 'I' to a dotless i; German writes 1.5 as "1,5".
      Locale.setDefault(Locale.forLanguageTag("tr-TR"));
      turkish = DeterminismCases.emitAll(trees);
      Locale.setDefault(Locale.GERMANY);
      german = DeterminismCases.emitAll(trees);
    } finally {
      Locale.setDefault(saved);
    }
    assertThat(german).isEqualTo(turkish);
    assertThat(DeterminismCases.emitAll(trees)).isEqualTo(turkish);
  }

  @Test
  void modelReadBackFromItsFileGivesTheSameSource() throws Exception {
    List<DecisionTree> trees = DeterminismCases.trees();
    List<DecisionTree> readBack = new ArrayList<>();
    for (int t = 0; t < trees.size(); t++) {
      // New node objects: anything keyed by object identity would now come out in another order.
      Path file = temp.resolve("tree" + t + ".json");
      ModelFile.write(file, new SavedModel(trees.get(t), new DataFile("t.csv", "0".repeat(64)),
          Map.of()));
      readBack.add(ModelFile.read(file));
    }
    assertThat(DeterminismCases.emitAll(readBack)).isEqualTo(DeterminismCases.emitAll(trees));
  }

  @Test
  void aFreshJvmWithOtherHashCodesAndLocaleWritesTheSameFiles() throws Exception {
    Path dir = Files.createDirectory(temp.resolve("child"));
    List<String> command = List.of(
        Path.of(System.getProperty("java.home"), "bin", "java").toString(),
        // hashCode=2 gives every object the identity hash 1 (HotSpot, from memory): any
        // iteration over identity-hashed collections reaching the output would change.
        "-XX:+UnlockExperimentalVMOptions", "-XX:hashCode=2",
        "-Duser.language=tr", "-Duser.country=TR", "-Dfile.encoding=ISO-8859-1",
        "-cp", System.getProperty("java.class.path"),
        DeterminismCases.class.getName(), dir.toString());
    Path log = temp.resolve("child.log");
    Process child = new ProcessBuilder(command).redirectErrorStream(true)
        .redirectOutput(log.toFile()).start();
    assertThat(child.waitFor(120, TimeUnit.SECONDS)).isTrue();
    assertThat(child.exitValue()).as(Files.readString(log)).isZero();

    Map<String, String> here = DeterminismCases.emitAll(DeterminismCases.trees());
    assertThat(here).hasSize(24);
    for (Map.Entry<String, String> e : here.entrySet()) {
      String there = Files.readString(dir.resolve(e.getKey() + ".java"), StandardCharsets.UTF_8);
      assertThat(there).as(e.getKey()).isEqualTo(e.getValue());
    }
  }
}
