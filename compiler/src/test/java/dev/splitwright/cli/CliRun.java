package dev.splitwright.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** Runs the real command-line entry point and keeps what it printed. */
record CliRun(int exitCode, String out, String err) {

  static CliRun of(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = Main.run(args, new PrintWriter(out, true), new PrintWriter(err, true));
    return new CliRun(code, out.toString(), err.toString());
  }

  /** The stderr lines, without the trailing empty one. */
  String[] errLines() {
    return err.strip().isEmpty() ? new String[0] : err.strip().split("\n");
  }
}
