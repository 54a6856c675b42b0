package dev.splitwright.data;

import java.util.List;
import java.util.Objects;

/**
 * One input column: its header name, kind and, for a categorical column, the category strings in
 * code order (code {@code i} stands for {@code categories.get(i)}).
 */
public record Feature(String name, FeatureKind kind, List<String> categories) {

  public Feature {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(kind, "kind");
    categories = List.copyOf(Objects.requireNonNull(categories, "categories"));
    if (kind == FeatureKind.NUMERIC && !categories.isEmpty()) {
      throw new IllegalArgumentException("numeric feature '" + name + "' cannot have categories");
    }
  }

  /** Creates a numeric feature. */
  public static Feature numeric(String name) {
    return new Feature(name, FeatureKind.NUMERIC, List.of());
  }

  /** Creates a categorical feature whose codes index {@code categories}. */
  public static Feature categorical(String name, List<String> categories) {
    return new Feature(name, FeatureKind.CATEGORICAL, categories);
  }

  public boolean isCategorical() {
    return kind == FeatureKind.CATEGORICAL;
  }

  /**
   * Tells whether {@code value} counts as missing for this feature: NaN for any feature, and for a
   * categorical one also anything that is not a whole code in {@code [0, categories.size())} (an
   * unseen category is treated as missing, in the model and in emitted code alike).
   */
  public boolean isMissing(float value) {
    if (Float.isNaN(value)) {
      return true;
    }
    if (kind == FeatureKind.NUMERIC) {
      return false;
    }
    return !(value >= 0f && value < categories.size() && value == (float) (int) value);
  }
}
