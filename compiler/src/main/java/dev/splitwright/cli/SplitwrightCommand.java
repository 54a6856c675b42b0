package dev.splitwright.cli;

import picocli.CommandLine.Command;

/** The top-level command; the work is in its subcommands. */
@Command(
    name = "splitwright",
    mixinStandardHelpOptions = true,
    version = "Splitwright 0.1.0",
    description = "Trains a size-capped decision tree on a labelled CSV and emits it as one "
        + "dependency-free, verified Java source file.",
    subcommands = {CompileCommand.class, DemoCommand.class, CheckCommand.class},
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {"0:success", "1:the emitted code disagreed with the model, or its proof on an "
        + "emulated core did not finish (nothing written)",
        "2:bad input file or option", "3:internal error (please report it)",
        "4:check: a score fell below its --floor"})
final class SplitwrightCommand implements Runnable {
  @picocli.CommandLine.Spec
  picocli.CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw new picocli.CommandLine.ParameterException(spec.commandLine(),
        "a command is required: compile, demo or check");
  }
}
