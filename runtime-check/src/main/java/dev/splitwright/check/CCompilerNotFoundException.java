package dev.splitwright.check;

import java.util.Objects;

/**
 * The C compiler command names no executable file: it is not on {@code PATH}, or the given path
 * does not exist or cannot be executed. Command-line tools report this as a usage error.
 */
public final class CCompilerNotFoundException extends Exception {

  private static final long serialVersionUID = 1L;

  private final String command;

  CCompilerNotFoundException(String command, String where) {
    super("C compiler \"" + command + "\" not found: " + where);
    this.command = Objects.requireNonNull(command, "command");
  }

  /** The command as given, e.g. {@code arm-none-eabi-gcc}. */
  public String command() {
    return command;
  }
}
