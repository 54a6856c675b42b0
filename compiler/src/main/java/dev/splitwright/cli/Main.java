package dev.splitwright.cli;

import java.io.PrintWriter;
import picocli.CommandLine;

/**
 * The {@code splitwright} command. Exit codes: 0 success, 1 verification failed, 2 bad input or
 * options, 3 internal error, 4 a {@code check} score fell below its floor. No stack trace is
 * printed unless {@code --debug} is given.
 */
public final class Main {
  private Main() {}

  public static void main(String[] args) {
    ShortRunJit.allow();
    System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
  }

  /** Runs the command line with the given streams and returns the exit code. */
  public static int run(String[] args, PrintWriter out, PrintWriter err) {
    CommandLine cli = new CommandLine(new SplitwrightCommand());
    cli.setOut(out);
    cli.setErr(err);
    cli.setParameterExceptionHandler(new ErrorHandlers.Usage());
    cli.setExecutionExceptionHandler(new ErrorHandlers.Execution());
    cli.setExecutionStrategy(new CommandLine.RunLast());
    HelpGroups.install(cli.getSubcommands().get("compile"), HelpGroups.COMPILE);
    try {
      return cli.execute(args);
    } catch (OutOfMemoryError e) {
      // Past the memory limit: the user can fix it with a larger heap or a smaller file.
      err.println(ErrorHandlers.outOfMemory());
      ErrorHandlers.traceIfDebug(e, args, err);
      return ExitCodes.BAD_INPUT;
    } catch (StackOverflowError e) {
      err.println(ErrorHandlers.PREFIX + "internal: stack overflow (rerun with --debug for details"
          + " and please report it)");
      ErrorHandlers.traceIfDebug(e, args, err);
      return ExitCodes.INTERNAL;
    } finally {
      out.flush();
      err.flush();
    }
  }
}
