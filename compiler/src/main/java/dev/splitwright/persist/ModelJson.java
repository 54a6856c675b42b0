package dev.splitwright.persist;

import com.fasterxml.jackson.annotation.JsonInclude;
import dev.splitwright.data.DataFile;
import java.util.List;
import java.util.Map;

/** The JSON shape of a model file, as Jackson binds it. */
@JsonInclude(JsonInclude.Include.NON_NULL)
record ModelJson(
    String format,
    int version,
    DataFile trainedOn,
    String target,
    List<String> classes,
    List<FeatureJson> features,
    Map<String, Object> training,
    List<NodeJson> nodes) {

  /**
   * The JSON shape of a version 3 file, an ensemble: {@code kind} is "forest" or "boosted", and
   * the trees follow in combination order.
   */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  record EnsembleJson(
      String format,
      int version,
      String kind,
      DataFile trainedOn,
      String target,
      List<String> classes,
      List<FeatureJson> features,
      Map<String, Object> training,
      List<TreeJson> trees) {}

  /** One tree of an ensemble: its vote weight (boosted only) and its nodes as in version 2. */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  record TreeJson(String weight, List<NodeJson> nodes) {}

  /** A feature: {@code kind} is "numeric" or "categorical". */
  @JsonInclude(JsonInclude.Include.NON_EMPTY)
  record FeatureJson(String name, String kind, List<String> categories) {
    FeatureJson {
      categories = categories == null ? List.of() : List.copyOf(categories);
    }
  }

  /**
   * A leaf has {@code predict}; a split has feature, threshold or leftCodes, missing and children.
   */
  @JsonInclude(JsonInclude.Include.NON_NULL)
  record NodeJson(
      Integer feature,
      String threshold,
      List<Integer> leftCodes,
      String missing,
      Integer left,
      Integer right,
      Integer predict,
      List<Integer> counts) {}
}
