package dev.splitwright.select;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/** What a byte budget counts. */
public enum BudgetUnit {
  /**
   * Bytes of the class files javac writes for the source with {@code --release 17} and its default
   * debug information (source file name and line numbers, {@code -g:source,lines}).
   */
  CLASS("class", "class file size"),
  /** Sum of every method's {@code code_length} (JVM Specification §4.7.3). */
  BYTECODE("bytecode", "bytecode size"),
  /** UTF-8 bytes of the {@code .java} file. */
  SOURCE("source", "source size"),
  /**
   * Bytes of the DEX file Android's D8 writes for the class alone in release mode at a minimum
   * API level ({@link DexMeter}): what an app ships before R8 shrinking.
   */
  DEX("dex", "DEX size"),
  /**
   * Bytes of the allocated sections that end in flash ({@code .text*}, {@code .rodata*}, {@code
   * .data*}) of the object file a C compiler writes, read from its ELF section headers.
   */
  FLASH("flash", "flash size");

  private final String optionName;
  private final String description;

  BudgetUnit(String optionName, String description) {
    this.optionName = optionName;
    this.description = description;
  }

  /** The spelling used on the command line and in reports. */
  public String optionName() {
    return optionName;
  }

  /** A phrase for axis labels and messages, e.g. {@code class file size}. */
  public String description() {
    return description;
  }

  /** Finds a unit by its option spelling, case-insensitively. */
  public static Optional<BudgetUnit> parse(String text) {
    String wanted = text.strip().toLowerCase(Locale.ROOT);
    return Arrays.stream(values()).filter(u -> u.optionName.equals(wanted)).findFirst();
  }
}
