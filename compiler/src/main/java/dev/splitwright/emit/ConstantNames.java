package dev.splitwright.emit;

import dev.splitwright.data.Feature;
import dev.splitwright.data.Schema;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * The names of an emitted class's int constants, made once per schema so that the scaffold that
 * declares them and the tree code that returns them agree: {@code CLASS_<LABEL>} per class,
 * {@code FEATURE_<NAME>} per input index, {@code <FEATURE>_<CATEGORY>} per category code.
 */
final class ConstantNames {
  /**
   * Longest constant name, suffix included: a leaf's {@code return CLASS_...;} at the deepest
   * nesting {@link MethodPlan} allows still fits {@link SourceLines#MAX_COLUMNS}.
   */
  static final int MAX_LENGTH = 44;

  private static final List<String> RESERVED =
      List.of("FEATURE_COUNT", "CLASS_COUNT", "LABELS", "FEATURES", "SETS");

  private final Set<String> used = new HashSet<>(RESERVED);
  private final List<String> classes = new ArrayList<>();
  private final List<String> features = new ArrayList<>();
  /** Per feature, its category constants, or an empty list (numeric or too many categories). */
  private final List<List<String>> categories = new ArrayList<>();

  private ConstantNames() {}

  static ConstantNames of(Schema schema) {
    ConstantNames names = new ConstantNames();
    for (int c = 0; c < schema.classCount(); c++) {
      names.classes.add(names.allocate("CLASS_", schema.classes().get(c)));
    }
    for (int f = 0; f < schema.featureCount(); f++) {
      names.features.add(names.allocate("FEATURE_", schema.feature(f).name()));
    }
    for (int f = 0; f < schema.featureCount(); f++) {
      Feature feature = schema.feature(f);
      List<String> codes = new ArrayList<>();
      if (feature.isCategorical()
          && feature.categories().size() <= ClassScaffold.MAX_NAMED_CATEGORIES) {
        // The feature part is cut first so that the category part keeps some room.
        String prefix = upper(Identifiers.ascii(feature.name(), "FEATURE" + f));
        prefix = prefix.substring(0, Math.min(prefix.length(), MAX_LENGTH / 2)) + "_";
        for (String category : feature.categories()) {
          codes.add(names.allocate(prefix, category));
        }
      }
      names.categories.add(List.copyOf(codes));
    }
    return names;
  }

  String classConstant(int classIndex) {
    return classes.get(classIndex);
  }

  String featureConstant(int feature) {
    return features.get(feature);
  }

  /** The constant of each code of {@code feature}; empty if it has none. */
  List<String> categoryConstants(int feature) {
    return categories.get(feature);
  }

  /**
   * {@code prefix} and the ASCII form of {@code text}, cut to {@link #MAX_LENGTH}; a repeat gets
   * {@code _2}, {@code _3} and so on, so that many similar names stay short.
   */
  private String allocate(String prefix, String text) {
    String base = prefix + upper(Identifiers.ascii(text, ""));
    if (Character.isDigit(base.charAt(0))) {
      base = "_" + base;
    }
    if (base.length() > MAX_LENGTH) {
      base = cut(base, MAX_LENGTH);
      // A cut right after an underscore would leave a dangling one.
      while (base.endsWith("_") && base.length() > 1) {
        base = base.substring(0, base.length() - 1);
      }
    }
    String name = base;
    for (int n = 2; !used.add(name); n++) {
      String suffix = "_" + n;
      name = cut(base, MAX_LENGTH - suffix.length()) + suffix;
    }
    return name;
  }

  private static String cut(String s, int max) {
    return s.length() <= max ? s : s.substring(0, max);
  }

  private static String upper(String s) {
    return s.toUpperCase(Locale.ROOT);
  }
}
