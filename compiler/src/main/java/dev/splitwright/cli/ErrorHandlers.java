package dev.splitwright.cli;

import dev.splitwright.backend.UnfinishedProofException;
import dev.splitwright.data.InputException;
import dev.splitwright.job.OutputException;
import java.io.PrintWriter;
import picocli.CommandLine;

/** Turns every failure into one line on stderr and an exit code; traces only with --debug. */
final class ErrorHandlers {
  /** How every error line starts, whether picocli or the run found it. */
  static final String PREFIX = "error: ";

  private ErrorHandlers() {}

  static boolean debug(String[] args) {
    for (String arg : args) {
      if (arg.equals("--debug")) {
        return true;
      }
    }
    return false;
  }

  /**
   * Bad options: picocli's message, one line, and where to find help, with the same {@code error:}
   * prefix as every other error, so that one pattern finds them all in a build log.
   */
  static final class Usage implements CommandLine.IParameterExceptionHandler {
    @Override
    public int handleParseException(CommandLine.ParameterException e, String[] args) {
      PrintWriter err = e.getCommandLine().getErr();
      String name = e.getCommandLine().getCommandSpec().qualifiedName();
      err.println(PREFIX + oneLine(e.getMessage()) + " (see '" + name + " --help')");
      if (debug(args)) {
        e.printStackTrace(err);
      }
      return ExitCodes.BAD_INPUT;
    }
  }

  /**
   * Failures while running: input errors exit 2, a proof that could not finish exits 1 like a
   * failed one, anything else is ours and exits 3.
   */
  static final class Execution implements CommandLine.IExecutionExceptionHandler {
    @Override
    public int handleExecutionException(Exception e, CommandLine cli,
        CommandLine.ParseResult parseResult) {
      PrintWriter err = cli.getErr();
      boolean debug = debug(parseResult.originalArgs().toArray(new String[0]));
      int code;
      if (e instanceof InputException) {
        err.println(PREFIX + oneLine(e.getMessage()));
        code = ExitCodes.BAD_INPUT;
      } else if (e instanceof OutputException) {
        err.println(PREFIX + oneLine(e.getMessage()));
        code = ExitCodes.BAD_INPUT;
      } else if (e instanceof UnfinishedProofException) {
        // Not shown to agree with the model, like a mismatch; the message names core and cause.
        err.println(PREFIX + "verification failed, nothing written: " + oneLine(e.getMessage()));
        code = ExitCodes.VERIFICATION_FAILED;
      } else if (e instanceof java.io.IOException) {
        err.println(PREFIX + "cannot write output: " + oneLine(String.valueOf(e.getMessage())));
        code = ExitCodes.BAD_INPUT;
      } else {
        err.println(PREFIX + "internal: " + oneLine(String.valueOf(e)) + " (rerun with --debug "
            + "for details and please report it)");
        code = ExitCodes.INTERNAL;
      }
      if (debug) {
        e.printStackTrace(err);
      }
      return code;
    }
  }

  static String outOfMemory() {
    long maxMb = Runtime.getRuntime().maxMemory() / (1024 * 1024);
    // 30 bytes a cell: 4 to hold it, the rest for the split copies, training and verification
    // (measured in this project: 1000000 rows x 7 columns need a heap of 192 MB).
    return PREFIX + "out of memory (Java heap limit " + maxMb + " MB); a compile needs about 30"
        + " bytes per CSV cell: run java with a larger -Xmx (e.g. java -Xmx4g -jar"
        + " splitwright.jar ...), or use fewer rows or columns";
  }

  static void traceIfDebug(Throwable e, String[] args, PrintWriter err) {
    if (debug(args)) {
      e.printStackTrace(err);
    }
  }

  static String oneLine(String message) {
    String text = message == null ? "" : message.strip();
    int newline = text.indexOf('\n');
    return newline < 0 ? text : text.substring(0, newline);
  }
}
