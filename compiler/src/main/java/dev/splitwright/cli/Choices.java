package dev.splitwright.cli;

import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.Layout;
import dev.splitwright.eval.Metric;
import dev.splitwright.select.BudgetUnit;
import dev.splitwright.train.Impurity;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import picocli.CommandLine.IModelTransformer;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;

/**
 * The valid values of the options that name one of a fixed set, taken from the enums, so that help
 * labels and error messages cannot drift from what the parser accepts.
 */
final class Choices {
  private Choices() {}

  static final List<String> LAYOUTS = names(Layout.values(), Layout::optionName);
  static final List<String> INPUTS = names(InputKind.values(), InputKind::optionName);
  static final List<String> IMPURITIES = names(Impurity.values(), Choices::impurityName);
  static final List<String> UNITS = names(BudgetUnit.values(), BudgetUnit::optionName);
  static final List<String> METRICS = names(Metric.values(), Metric::optionName);

  /** The option spelling of an impurity, e.g. {@code gini}. */
  static String impurityName(Impurity impurity) {
    return impurity.name().toLowerCase(Locale.ROOT);
  }

  /** The impurity spelled {@code text}, case-insensitively. */
  static Optional<Impurity> impurity(String text) {
    String wanted = text.toLowerCase(Locale.ROOT);
    for (Impurity impurity : Impurity.values()) {
      if (impurityName(impurity).equals(wanted)) {
        return Optional.of(impurity);
      }
    }
    return Optional.empty();
  }

  /** {@code a, b or c}, for "must be ..." messages. */
  static String oneOf(List<String> names) {
    if (names.size() == 1) {
      return names.get(0);
    }
    return String.join(", ", names.subList(0, names.size() - 1)) + " or "
        + names.get(names.size() - 1);
  }

  /** {@code a|b|c}, for help labels. */
  static String label(List<String> names) {
    return String.join("|", names);
  }

  private static <E> List<String> names(E[] values, Function<E, String> name) {
    List<String> names = new ArrayList<>(values.length);
    for (E value : values) {
      names.add(name.apply(value));
    }
    return List.copyOf(names);
  }

  /**
   * Gives the choice options their labels, e.g. {@code --layout=branches|table|smallest}.
   * Annotations hold only constants, so the labels are set on the built model; every option is
   * added back in its place so the help keeps its order.
   */
  static final class Labels implements IModelTransformer {
    private static final Map<String, List<String>> BY_OPTION = new LinkedHashMap<>();

    static {
      BY_OPTION.put("--layout", LAYOUTS);
      BY_OPTION.put("--input", INPUTS);
      BY_OPTION.put("--impurity", IMPURITIES);
      BY_OPTION.put("--budget-unit", UNITS);
      BY_OPTION.put("--metric", METRICS);
    }

    @Override
    public CommandSpec transform(CommandSpec spec) {
      List<OptionSpec> options = new ArrayList<>(spec.options());
      for (OptionSpec option : options) {
        spec.remove(option);
      }
      for (OptionSpec option : options) {
        List<String> names = BY_OPTION.get(option.longestName());
        spec.addOption(names == null ? option
            : option.toBuilder().paramLabel(label(names)).build());
      }
      return spec;
    }
  }
}
