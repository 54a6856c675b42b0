package dev.splitwright.cli;

/** The process exit codes. */
final class ExitCodes {
  static final int OK = 0;
  static final int VERIFICATION_FAILED = 1;
  static final int BAD_INPUT = 2;
  static final int INTERNAL = 3;
  /** {@code check}: a score fell below its {@code --floor}, so a CI job can fail on it. */
  static final int BELOW_FLOOR = 4;

  private ExitCodes() {}
}
