package com.example.gesture;

import java.util.Locale;

/**
 * How Android-style code calls the generated {@link GestureClassifier}: the 24 window features
 * (mean, variance, peak-to-peak and zero crossings per accelerometer and gyroscope axis), then
 * the class frequencies of the leaf reached, to act only on a confident gesture.
 */
public final class GestureBandExample {
  private static final float CONFIDENT = 0.8f;

  private GestureBandExample() {}

  /** Classifies a few windows taken from the demo log and prints label and confidence. */
  public static void main(String[] args) {
    float[][] windows = {
      {0.240f, 0.00018f, 0.067f, 18, -0.179f, 0.00030f, 0.083f, 25, 0.955f, 0.00021f, 0.062f, 23,
          3.0f, 2.3f, 6.8f, 27, 0.8f, 2.5f, 6.7f, 29, -1.3f, 2.3f, 7.1f, 20},
      {0.024f, 0.02750f, 0.512f, 27, -0.174f, 1.20293f, 3.103f, 13, 0.982f, 0.00015f, 0.052f, 26,
          -2.1f, 770.4f, 79.1f, 13, -0.2f, 2.5f, 6.8f, 26, -1.0f, 18447.8f, 386.5f, 14},
      {0.439f, 0.09308f, 0.817f, 1, -0.099f, 0.00139f, 0.134f, 5, 0.795f, 0.07130f, 0.711f, 1,
          -5.5f, 66.1f, 26.5f, 2, -55.3f, 6168.6f, 212.7f, 2, 0.0f, 2.8f, 7.2f, 28},
    };
    float[] probabilities = new float[GestureClassifier.CLASS_COUNT];
    for (float[] window : windows) {
      int gesture = GestureClassifier.classify(window);
      GestureClassifier.classProbabilities(window, probabilities);
      String verdict = probabilities[gesture] >= CONFIDENT ? "act" : "ignore";
      System.out.println(String.format(Locale.ROOT, "%s (%.2f): %s",
          GestureClassifier.label(gesture), probabilities[gesture], verdict));
    }
  }
}
