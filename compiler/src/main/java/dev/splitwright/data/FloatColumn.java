package dev.splitwright.data;

import java.util.Arrays;

/** A growable primitive float array: four bytes a cell, no boxing. */
final class FloatColumn {
  private float[] values = new float[1024];
  private int size;

  void add(float value) {
    if (size == values.length) {
      values = Arrays.copyOf(values, grownCapacity(values.length));
    }
    values[size++] = value;
  }

  static int grownCapacity(int capacity) {
    long grown = capacity + (capacity >> 1) + 16L;
    return (int) Math.min(grown, Integer.MAX_VALUE - 8);
  }

  /** The values added, in an array of exactly that length. */
  float[] toArray() {
    return size == values.length ? values : Arrays.copyOf(values, size);
  }
}
