package dev.splitwright.cli;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import picocli.CommandLine;
import picocli.CommandLine.Help;
import picocli.CommandLine.Model.OptionSpec;

/**
 * Renders a command's option list under headings, from one table of option name to heading. The
 * options stay plain fields of their command, so adding one means one line here, not moving it
 * into a group class; {@code HelpGroupsTest} fails while an option of {@code compile} has no
 * heading.
 */
final class HelpGroups {
  /** Where an option without a heading is listed, so that the help never drops one. */
  static final String OTHER = "Other options";

  /**
   * The headings of {@code compile}'s options, in the order shown. A new option of {@code
   * compile} gets its line here.
   */
  static final List<Group> COMPILE = List.of(
      new Group("Data", "--data", "--target", "--test-data", "--missing", "--categorical",
          "--numeric", "--split", "--seed"),
      new Group("Training", "--max-depth", "--max-leaves", "--min-leaf", "--impurity",
          "--class-weight", "--forest", "--boosted", "--split-features", "--model",
          "--save-model"),
      new Group("Byte budget", "--budget", "--budget-unit", "--kinds", "--metric", "--folds",
          "--refit-all", "--measure-all", "--dex-size", "--min-api"),
      new Group("Emitted code", "--emit", "--package", "--class", "--layout", "--input",
          "--int-inputs", "--named-args", "--probabilities", "--bare", "--max-method-bytes"),
      new Group("C toolchain (--emit c)", "--host-cc", "--cc", "--cflags", "--core",
          "--prove-on"),
      new Group("Output and run", "--out", "--quiet", "--debug", "--help", "--version"));

  /** A heading and the longest names of the options under it, in the order shown. */
  record Group(String heading, List<String> names) {
    Group(String heading, String... names) {
      this(heading, List.of(names));
    }

    Group {
      Objects.requireNonNull(heading, "heading");
      names = List.copyOf(names);
    }
  }

  private final List<Group> groups;

  private HelpGroups(List<Group> groups) {
    this.groups = groups;
  }

  /** Replaces the option list of {@code cli}'s help with {@code groups}' headings. */
  static void install(CommandLine cli, List<Group> groups) {
    HelpGroups renderer = new HelpGroups(Objects.requireNonNull(groups, "groups"));
    cli.getHelpSectionMap().put(CommandLine.Model.UsageMessageSpec.SECTION_KEY_OPTION_LIST,
        renderer::render);
  }

  /** The heading each option of {@code cli} is listed under, by its longest name. */
  static Map<String, String> headingOf(CommandLine cli, List<Group> groups) {
    Map<String, String> byName = new LinkedHashMap<>();
    groups.forEach(g -> g.names().forEach(n -> byName.put(n, g.heading())));
    Map<String, String> result = new LinkedHashMap<>();
    for (OptionSpec option : cli.getCommandSpec().options()) {
      result.put(option.longestName(), byName.getOrDefault(option.longestName(), OTHER));
    }
    return result;
  }

  private String render(Help help) {
    Map<String, List<OptionSpec>> listed = new LinkedHashMap<>();
    groups.forEach(g -> listed.put(g.heading(), new ArrayList<>()));
    Map<String, String> headings = headingOf(help.commandSpec().commandLine(), groups);
    for (OptionSpec option : help.commandSpec().options()) {
      if (!option.hidden()) {
        listed.computeIfAbsent(headings.get(option.longestName()), h -> new ArrayList<>())
            .add(option);
      }
    }
    StringBuilder text = new StringBuilder();
    listed.forEach((heading, options) -> {
      if (options.isEmpty()) {
        return;
      }
      text.append(String.format("%n%s:%n", heading));
      Help.Layout layout = help.createDefaultLayout();
      for (OptionSpec option : options) {
        layout.addOption(option, help.createDefaultParamLabelRenderer());
      }
      text.append(layout);
    });
    return text.toString();
  }
}
