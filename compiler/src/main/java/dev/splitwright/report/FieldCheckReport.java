package dev.splitwright.report;

import com.fasterxml.jackson.annotation.JsonPropertyOrder;
import java.util.List;
import java.util.Objects;

/**
 * What a check of a saved model on a field log found ({@code --report FILE}). Field order is fixed
 * and no path, time or host appears, so equal inputs give byte-identical files.
 *
 * @param modelTrainedOn the data file the model was trained on, as its model file records it
 * @param rowsWithUnseenCategory rows with a category the model never saw (scored as missing)
 * @param rowsWithMissingValue rows with an empty cell or a missing-value token
 * @param floors each requested floor and whether the scores reached it, in option order
 * @param passed true when every floor was reached (true when none was given)
 */
@JsonPropertyOrder({"tool", "model", "modelSha256", "modelTrainedOn", "data", "dataSha256",
    "target", "classes", "rowsWithUnseenCategory", "rowsWithMissingValue", "scores", "floors",
    "passed"})
public record FieldCheckReport(
    String tool,
    String model,
    String modelSha256,
    CompileReport.DataRef modelTrainedOn,
    String data,
    String dataSha256,
    String target,
    List<String> classes,
    long rowsWithUnseenCategory,
    long rowsWithMissingValue,
    CompileReport.PartScores scores,
    List<FloorResult> floors,
    boolean passed) {

  public FieldCheckReport {
    Objects.requireNonNull(tool, "tool");
    Objects.requireNonNull(model, "model");
    Objects.requireNonNull(modelSha256, "modelSha256");
    Objects.requireNonNull(modelTrainedOn, "modelTrainedOn");
    Objects.requireNonNull(data, "data");
    Objects.requireNonNull(dataSha256, "dataSha256");
    Objects.requireNonNull(target, "target");
    classes = List.copyOf(classes);
    Objects.requireNonNull(scores, "scores");
    floors = List.copyOf(floors);
  }

  /** One floor: the metric's option name, the floor, the value reached, and whether it held. */
  @JsonPropertyOrder({"metric", "floor", "value", "met"})
  public record FloorResult(String metric, double floor, double value, boolean met) {
    public FloorResult {
      Objects.requireNonNull(metric, "metric");
    }
  }
}
