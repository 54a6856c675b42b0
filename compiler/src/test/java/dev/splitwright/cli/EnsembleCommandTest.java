package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * {@code compile --forest N} and {@code --boosted N} on the shared open data sets (provenance in
 * src/test/resources/datasets/README.md): UCI "Breast Cancer Wisconsin (Diagnostic)" (numeric),
 * UCI "Pima Indians Diabetes" with impossible zeros as missing cells, and UCI "Congressional
 * Voting Records" (categorical with missing votes), emitted as Java and as C: verification finds
 * no mismatch and takes both sides of every split of every tree.
 */
class EnsembleCommandTest {
  @TempDir Path temp;

  private static Path dataset(String file) {
    try {
      return Path.of(EnsembleCommandTest.class.getResource("/datasets/" + file).toURI());
    } catch (java.net.URISyntaxException e) {
      throw new IllegalStateException(e);
    }
  }

  static Stream<Arguments> runs() {
    List<Arguments> out = new ArrayList<>();
    String[][] sets = {
      {"breast-cancer-wisconsin-diagnostic.csv", "diagnosis"},
      {"pima-indians-diabetes-2.csv", "diabetes"},
      {"house-votes-84.csv", "Class"}};
    for (String[] set : sets) {
      for (String kind : List.of("--forest", "--boosted")) {
        for (String language : List.of("java", "c")) {
          out.add(Arguments.of(set[0], set[1], kind, language));
        }
      }
    }
    return out.stream();
  }

  private static boolean gcc() {
    try {
      Process p = new ProcessBuilder("gcc", "--version").redirectErrorStream(true).start();
      p.getInputStream().readAllBytes();
      return p.waitFor() == 0;
    } catch (IOException e) {
      return false;
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      return false;
    }
  }

  private List<String> args(String file, String target, Path out, String... extra) {
    List<String> args = new ArrayList<>(List.of("compile", "--data", dataset(file).toString(),
        "--target", target, "--class", "Vote", "--out", out.toString(), "--max-depth", "4",
        "--probabilities"));
    args.addAll(List.of(extra));
    return args;
  }

  @ParameterizedTest(name = "{0} {2} {3}")
  @MethodSource("runs")
  void ensemblesOfOpenDataAgreeWithTheirModelEverywhere(String file, String target, String kind,
      String language) {
    if (language.equals("c")) {
      assumeTrue(gcc(), "gcc is needed to check emitted C");
    }
    Path out = temp.resolve("out");
    List<String> args = args(file, target, out, kind, "12", "--emit", language);
    CliRun run = CliRun.of(args.toArray(new String[0]));

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(run.out()).contains(kind.substring(2) + ": ");
    // Every split of every tree taken both ways: the verification line says 100.0 %.
    assertThat(run.out()).containsPattern("verified: \\d+ inputs, 0 mismatches, branch coverage "
        + "100\\.0% \\((\\d+) of \\1 splits both ways\\)");
  }

  @Test
  void aSavedEnsembleReEmitsByteForByte() throws IOException {
    Path first = temp.resolve("first");
    Path model = temp.resolve("votes.model.json");
    CliRun trained = CliRun.of(args("house-votes-84.csv", "Class", first, "--forest", "8",
        "--save-model", model.toString()).toArray(new String[0]));
    assertThat(trained.exitCode()).as(trained.err()).isZero();
    assertThat(Files.readString(model)).contains("\"forest\"");

    Path second = temp.resolve("second");
    CliRun again = CliRun.of("compile", "--data", dataset("house-votes-84.csv").toString(),
        "--target", "Class", "--class", "Vote", "--out", second.toString(), "--probabilities",
        "--model", model.toString(), "--save-model", temp.resolve("again.json").toString());
    assertThat(again.exitCode()).as(again.err()).isZero();
    // The model file is read and written back unchanged (its trainedOn names the first data).
    assertThat(Files.readString(temp.resolve("again.json"))).isEqualTo(Files.readString(model));
    // The code depends on the model and the options, and the header on the run's options text,
    // which differs (--model instead of the training options): compare the code below it.
    String a = Files.readString(first.resolve("Vote.java"));
    String b = Files.readString(second.resolve("Vote.java"));
    assertThat(code(b)).isEqualTo(code(a));
  }

  @Test
  void reEmittingASavedEnsembleWithTheSameOptionsIsByteIdentical() throws IOException {
    Path model = temp.resolve("m.json");
    CliRun trained = CliRun.of(args("pima-indians-diabetes-2.csv", "diabetes", temp.resolve("t"),
        "--boosted", "6", "--save-model", model.toString()).toArray(new String[0]));
    assertThat(trained.exitCode()).as(trained.err()).isZero();
    Path a = temp.resolve("a");
    Path b = temp.resolve("b");
    for (Path out : List.of(a, b)) {
      CliRun run = CliRun.of("compile", "--data", dataset("pima-indians-diabetes-2.csv")
          .toString(), "--target", "diabetes", "--class", "Vote", "--out", out.toString(),
          "--model", model.toString(), "--layout", "table");
      assertThat(run.exitCode()).as(run.err()).isZero();
    }
    assertThat(Files.readAllBytes(b.resolve("Vote.java")))
        .isEqualTo(Files.readAllBytes(a.resolve("Vote.java")));
    assertThat(Files.readString(a.resolve("Vote.java"))).contains("Boosted ensemble (SAMME) of");
  }

  /** The source from the class declaration on: what the model and the emit options decide. */
  private static String code(String source) {
    return source.substring(source.indexOf("public final class"));
  }

  @Test
  void anEnsembleWithABudgetIsRefusedInOneLine() {
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(args("house-votes-84.csv", "Class", out, "--forest", "4",
        "--budget", "4KiB").toArray(new String[0]));
    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()).hasSize(1);
    assertThat(run.err()).contains("--forest").contains("--budget");
    assertThat(out).doesNotExist();
  }

  @Test
  void bothKindsAtOnceAreRefusedInOneLine() {
    Path out = temp.resolve("out");
    CliRun run = CliRun.of(args("house-votes-84.csv", "Class", out, "--forest", "4",
        "--boosted", "4").toArray(new String[0]));
    assertThat(run.exitCode()).isEqualTo(2);
    assertThat(run.errLines()).hasSize(1);
    assertThat(run.err()).contains("--boosted").contains("--forest");
    assertThat(out).doesNotExist();
  }
}
