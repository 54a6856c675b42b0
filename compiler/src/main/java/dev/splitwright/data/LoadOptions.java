package dev.splitwright.data;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeSet;

/**
 * How {@link CsvLoader} reads a file.
 *
 * <p>Errors in these settings are reported as option errors under the names in the {@code
 * OPTION_...} constants, so the command line should use the same names.
 *
 * @param target the class-label column; empty means the last column
 * @param missingTokens cell texts (after trimming) that mean "missing", besides the empty cell,
 *     which is always missing; sorted, distinct
 * @param categoricalColumns columns read as categories even if every cell is a number; sorted
 * @param numericColumns columns that must be numeric, so a text cell is an error; sorted
 */
public record LoadOptions(
    Optional<String> target,
    List<String> missingTokens,
    List<String> categoricalColumns,
    List<String> numericColumns) {

  /** Option name of {@link #target}. */
  public static final String OPTION_TARGET = "target";

  /** Option name of {@link #missingTokens}. */
  public static final String OPTION_MISSING = "missing";

  /** Option name of {@link #categoricalColumns}. */
  public static final String OPTION_CATEGORICAL = "categorical";

  /** Option name of {@link #numericColumns}. */
  public static final String OPTION_NUMERIC = "numeric";

  private static final LoadOptions DEFAULTS = builder().build();

  public LoadOptions {
    Objects.requireNonNull(target, "target");
    target = target.map(String::trim);
    missingTokens = sortedTrimmed(missingTokens, "missingTokens");
    categoricalColumns = sortedTrimmed(categoricalColumns, "categoricalColumns");
    numericColumns = sortedTrimmed(numericColumns, "numericColumns");
  }

  private static List<String> sortedTrimmed(Collection<String> values, String name) {
    Objects.requireNonNull(values, name);
    TreeSet<String> sorted = new TreeSet<>();
    for (String v : values) {
      sorted.add(Objects.requireNonNull(v, name + " element").trim());
    }
    return List.copyOf(sorted);
  }

  /** Target = last column, only empty cells missing, all column kinds inferred. */
  public static LoadOptions defaults() {
    return DEFAULTS;
  }

  public static Builder builder() {
    return new Builder();
  }

  public Builder toBuilder() {
    return new Builder()
        .missingTokens(missingTokens)
        .categoricalColumns(categoricalColumns)
        .numericColumns(numericColumns)
        .target(target.orElse(null));
  }

  /** Tells whether the trimmed cell text {@code trimmed} means "missing". */
  boolean isMissing(String trimmed) {
    return trimmed.isEmpty() || (!missingTokens.isEmpty() && missingTokens.contains(trimmed));
  }

  /** Collects settings; every setter replaces the previous value. */
  public static final class Builder {
    private String target;
    private List<String> missingTokens = List.of();
    private List<String> categoricalColumns = List.of();
    private List<String> numericColumns = List.of();

    private Builder() {}

    /** Sets the class-label column; {@code null} means the last column. */
    public Builder target(String target) {
      this.target = target;
      return this;
    }

    public Builder missingTokens(Collection<String> tokens) {
      this.missingTokens = new ArrayList<>(Objects.requireNonNull(tokens, "tokens"));
      return this;
    }

    public Builder categoricalColumns(Collection<String> columns) {
      this.categoricalColumns = new ArrayList<>(Objects.requireNonNull(columns, "columns"));
      return this;
    }

    public Builder numericColumns(Collection<String> columns) {
      this.numericColumns = new ArrayList<>(Objects.requireNonNull(columns, "columns"));
      return this;
    }

    public LoadOptions build() {
      return new LoadOptions(
          Optional.ofNullable(target), missingTokens, categoricalColumns, numericColumns);
    }
  }
}
