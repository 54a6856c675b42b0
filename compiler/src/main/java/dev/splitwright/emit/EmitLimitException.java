package dev.splitwright.emit;

import java.util.Objects;

/**
 * The tree and the chosen options do not fit a limit of Java or the class file format, e.g. more
 * constants than a class file can hold for the {@code branches} layout. Names the option to change
 * and how, so the command line can say so in one line.
 */
public final class EmitLimitException extends IllegalArgumentException {
  private static final long serialVersionUID = 1L;

  private final String option;
  private final String problem;
  private final String remedy;

  public EmitLimitException(String option, String problem, String remedy) {
    super(problem + ": " + remedy);
    this.option = Objects.requireNonNull(option, "option");
    this.problem = Objects.requireNonNull(problem, "problem");
    this.remedy = Objects.requireNonNull(remedy, "remedy");
  }

  /** The command-line option that led here, without dashes, e.g. {@code layout}. */
  public String option() {
    return option;
  }

  public String problem() {
    return problem;
  }

  public String remedy() {
    return remedy;
  }
}
