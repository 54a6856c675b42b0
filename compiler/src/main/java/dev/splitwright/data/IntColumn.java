package dev.splitwright.data;

import java.util.Arrays;

/** A growable primitive int array. */
final class IntColumn {
  private int[] values = new int[1024];
  private int size;

  void add(int value) {
    if (size == values.length) {
      values = Arrays.copyOf(values, FloatColumn.grownCapacity(values.length));
    }
    values[size++] = value;
  }

  int[] toArray() {
    return size == values.length ? values : Arrays.copyOf(values, size);
  }
}
