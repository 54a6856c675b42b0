package dev.splitwright.cli;

import static org.assertj.core.api.Assertions.assertThat;

import dev.splitwright.demo.DemoData;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import picocli.CommandLine.Model.OptionSpec;

/** {@code compile --help} lists every option under a heading; {@code demo --help} its defaults. */
class HelpGroupsTest {
  private static CommandLine compile() {
    return new CommandLine(new SplitwrightCommand()).getSubcommands().get("compile");
  }

  @Test
  void everyCompileOptionHasAHeading() {
    Map<String, String> headings = HelpGroups.headingOf(compile(), HelpGroups.COMPILE);
    List<String> missing = new ArrayList<>();
    headings.forEach((option, heading) -> {
      if (heading.equals(HelpGroups.OTHER)) {
        missing.add(option);
      }
    });
    assertThat(missing).as("options of compile without a help heading: add each to "
        + "HelpGroups.COMPILE in compiler/src/main/java/dev/splitwright/cli/HelpGroups.java")
        .isEmpty();
  }

  @Test
  void everyGroupedNameIsAnOptionOfCompileListedOnce() {
    List<String> options = compile().getCommandSpec().options().stream()
        .map(OptionSpec::longestName).toList();
    List<String> grouped = HelpGroups.COMPILE.stream()
        .flatMap(g -> g.names().stream()).toList();
    assertThat(grouped).doesNotHaveDuplicates();
    assertThat(options).containsAll(grouped);
  }

  @Test
  void compileHelpShowsTheSynopsisAndTheOptionsUnderTheirHeadingsInOrder() {
    CliRun run = CliRun.of("compile", "--help");

    assertThat(run.exitCode()).isZero();
    List<String> lines = run.out().lines().toList();
    assertThat(lines.get(0))
        .isEqualTo("Usage: splitwright compile --data FILE --class NAME --out DIR [options]");
    List<String> headings = HelpGroups.COMPILE.stream().map(g -> g.heading() + ":").toList();
    assertThat(headings).containsExactly("Data:", "Training:", "Byte budget:", "Emitted code:",
        "C toolchain (--emit c):", "Output and run:");
    assertThat(lines.stream().filter(headings::contains).toList()).isEqualTo(headings);
    // Each option's own line follows its heading and comes before the next one.
    for (HelpGroups.Group group : HelpGroups.COMPILE) {
      int from = lines.indexOf(group.heading() + ":");
      int to = lines.subList(from + 1, lines.size()).stream().filter(headings::contains)
          .findFirst().map(h -> lines.indexOf(h)).orElse(lines.size());
      for (String name : group.names()) {
        List<String> section = lines.subList(from + 1, to);
        assertThat(section).as("%s under %s", name, group.heading())
            .anyMatch(l -> l.matches(" +(-\\w, )?" + name + "([= ].*)?"));
      }
    }
  }

  @Test
  void anOptionWithoutAHeadingIsStillListed() {
    CommandLine cli = compile();
    HelpGroups.install(cli, List.of(new HelpGroups.Group("Data", "--data")));

    String help = cli.getUsageMessage();

    assertThat(help).contains("Data:", HelpGroups.OTHER + ":", "--budget-unit", "--quiet");
    assertThat(help.indexOf("--data=FILE")).isLessThan(help.indexOf(HelpGroups.OTHER));
  }

  @Test
  void demoHelpDescribesEveryOptionWithItsDefault() {
    CliRun run = CliRun.of("demo", "--help");

    assertThat(run.exitCode()).isZero();
    String help = run.out().replaceAll("\\s+", " ");
    CommandLine demo = new CommandLine(new SplitwrightCommand()).getSubcommands().get("demo");
    for (OptionSpec option : demo.getCommandSpec().options()) {
      assertThat(option.description()).as(option.longestName()).isNotEmpty();
      if (option.defaultValue() != null) {
        assertThat(help).contains("(default: " + option.defaultValue() + ")");
      }
    }
    assertThat(help).contains("(default: 3000)", "(default: 7)");
  }

  @Test
  void argumentFilesExpandWithCommentsAndQuotes(@TempDir Path dir) throws IOException {
    // picocli expands @FILE by default: one argument a line or space-separated, # comments,
    // quotes for spaces (picocli documentation, "AtFiles").
    Path out = dir.resolve("demo rows.csv");
    Path args = dir.resolve("demo.args");
    Files.writeString(args, "# a seeded sample for the tests\ndemo\n--scenario pump-vibration\n"
        + "--rows 25\n--out \"" + out.toString().replace("\\", "/") + "\"\n");

    // The command name comes from the file too; options after the file add to it.
    CliRun run = CliRun.of("@" + args, "--seed", "3");

    assertThat(run.exitCode()).as(run.err()).isZero();
    assertThat(Files.readAllLines(out)).hasSize(26);
    Path expected = dir.resolve("expected.csv");
    DemoData.write("pump-vibration", expected, 25, 3);
    assertThat(Files.readString(out)).isEqualTo(Files.readString(expected));
  }
}
