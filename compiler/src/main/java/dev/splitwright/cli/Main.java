package dev.splitwright.cli;

/** Placeholder. */
public final class Main {
  private Main() {}

  /** Entry point. */
  public static void main(String[] args) {}
}
