package com.example.pump;

/**
 * How firmware-style code calls the generated {@link PumpStateClassifier}: one reading of the six
 * features in the order the class comment lists, NaN for a sensor that dropped out.
 */
public final class PumpMonitorExample {
  private PumpMonitorExample() {}

  /** Classifies a few readings taken from the demo log and prints the labels. */
  public static void main(String[] args) {
    float[][] readings = {
      // rms mm/s, peak accel g, crest factor, kurtosis, bearing temp C, motor current A
      {1.28f, 0.379f, 2.84f, 2.89f, 49.3f, 19.69f},
      {5.50f, 0.655f, 6.13f, 6.10f, 61.3f, 17.16f},
      {1.23f, 3.353f, 5.10f, 5.23f, 48.9f, 13.00f},
      {5.34f, 0.313f, 2.59f, 2.77f, Float.NaN, 21.52f},
    };
    for (float[] reading : readings) {
      int state = PumpStateClassifier.classify(reading);
      String action =
          state == PumpStateClassifier.CLASS_NORMAL ? "keep running" : "flag for service";
      System.out.println(PumpStateClassifier.label(state) + ": " + action);
    }
  }
}
