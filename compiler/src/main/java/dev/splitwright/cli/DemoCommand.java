package dev.splitwright.cli;

import dev.splitwright.demo.DemoData;
import dev.splitwright.job.OutputFiles;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/** {@code splitwright demo}: writes a seeded demo data set of our own scenarios. */
@Command(
    name = "demo",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = "Writes a seeded, invented demo data set as CSV: 'pump-vibration' (field pump "
        + "vibration monitor) or 'gesture-band' (wrist-worn gesture band).")
final class DemoCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--scenario", required = true, paramLabel = "pump-vibration|gesture-band",
      description = "Which invented device the rows come from (required).")
  String scenario;

  @Option(names = "--rows", defaultValue = "3000", paramLabel = "N",
      description = "How many data rows to write, besides the header (default: "
          + "${DEFAULT-VALUE}).")
  int rows;

  @Option(names = "--seed", defaultValue = "7", paramLabel = "N",
      description = "Seed of the generator; the same seed and rows give the same file "
          + "(default: ${DEFAULT-VALUE}).")
  long seed;

  @Option(names = "--out", required = true, paramLabel = "FILE",
      description = "CSV file to write, replaced whole if it exists (required).")
  Path out;

  @Option(names = "--debug", description = "Print stack traces of errors (default: off).")
  boolean debug;

  @Override
  public Integer call() throws Exception {
    if (!DemoData.scenarios().contains(scenario)) {
      throw new ParameterException(spec.commandLine(), "option '--scenario' must be one of "
          + String.join(", ", DemoData.scenarios()) + ", but it is '" + scenario + "'");
    }
    if (rows < 1) {
      throw new ParameterException(spec.commandLine(),
          "option '--rows' must be at least 1, but it is " + rows);
    }
    // Written like every other output: all at once, the umask's permissions or the old file's.
    OutputFiles files = new OutputFiles();
    files.add(out, temp -> DemoData.write(scenario, temp, rows, seed));
    files.commit();
    spec.commandLine().getOut().println("wrote " + out);
    return ExitCodes.OK;
  }
}
