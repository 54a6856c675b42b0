package dev.splitwright.verify;

import dev.splitwright.data.Schema;
import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.InputKind;
import dev.splitwright.emit.JavaEmitter;
import java.lang.reflect.Array;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Method;
import java.util.Arrays;
import java.util.List;

/**
 * Calls a loaded classifier's {@code classify} whatever its signature, from a float probe. For
 * {@code int} and {@code double} inputs it also says what float input the model must be asked
 * about, so the comparison stays exact: the model sees what the device's value converts to. For
 * {@code int} inputs a missing (NaN) category is passed as code -1, the way a device says
 * "missing" to an int classifier; other NaNs convert as Java does, to 0.
 */
final class EmittedClassifier {
  private final Method classify;
  private final Method probabilities;
  /** {@link JavaEmitter#BATCH_METHOD}, or null when the class has none. */
  private final Method batch;
  private final InputKind kind;
  private final boolean named;
  private final int classCount;
  /** Features whose NaN becomes -1 rather than 0 as int; null when none. */
  private final boolean[] categorical;

  private EmittedClassifier(Method classify, Method probabilities, Method batch, InputKind kind,
      boolean named, int classCount, boolean[] categorical) {
    this.classify = classify;
    this.probabilities = probabilities;
    this.batch = batch;
    this.kind = kind;
    this.named = named;
    this.classCount = classCount;
    this.categorical = categorical;
  }

  /** Like {@link #of(Class, EmitOptions, int, int)}, passing missing categories as -1 to ints. */
  static EmittedClassifier of(Class<?> type, EmitOptions options, Schema schema)
      throws NoSuchMethodException {
    EmittedClassifier plain = of(type, options, schema.featureCount(), schema.classCount());
    boolean[] categorical = new boolean[schema.featureCount()];
    for (int f = 0; f < categorical.length; f++) {
      categorical[f] = schema.feature(f).isCategorical();
    }
    return new EmittedClassifier(plain.classify, plain.probabilities, plain.batch, plain.kind,
        plain.named, plain.classCount, categorical);
  }

  static EmittedClassifier of(Class<?> type, EmitOptions options, int featureCount,
      int classCount) throws NoSuchMethodException {
    Class<?> element = switch (options.inputKind()) {
      case FLOAT -> float.class;
      case DOUBLE -> double.class;
      case INT -> int.class;
    };
    Class<?>[] parameters;
    if (options.namedArgs()) {
      parameters = new Class<?>[featureCount];
      Arrays.fill(parameters, element);
    } else {
      parameters = new Class<?>[] {element.arrayType()};
    }
    Method probabilities = null;
    if (options.probabilities()) {
      Class<?>[] withOut = Arrays.copyOf(parameters, parameters.length + 1);
      withOut[parameters.length] = float[].class;
      probabilities = type.getMethod("classProbabilities", withOut);
    }
    Method batch = null;
    if (!options.namedArgs() && Arrays.stream(type.getMethods())
        .anyMatch(m -> m.getName().equals(JavaEmitter.BATCH_METHOD))) {
      batch = type.getMethod(JavaEmitter.BATCH_METHOD, element.arrayType().arrayType(),
          int[].class);
    }
    return new EmittedClassifier(type.getMethod("classify", parameters), probabilities, batch,
        options.inputKind(), options.namedArgs(), classCount, null);
  }

  /** Tells whether the class has the many-row entry {@link JavaEmitter#BATCH_METHOD}. */
  boolean hasBatch() {
    return batch != null;
  }

  /** {@link JavaEmitter#BATCH_METHOD} over float probes, each converted as for classify. */
  int[] classifyAll(List<float[]> probes) {
    return classifyAllArrays(probes.stream().map(this::array).toList());
  }

  /**
   * {@link JavaEmitter#BATCH_METHOD} over inputs already of the class's element type ({@code
   * int[]} or {@code double[]}), each copied.
   */
  int[] classifyAllArrays(List<?> rows) {
    Object array = Array.newInstance(
        batch.getParameterTypes()[0].getComponentType(), rows.size());
    for (int r = 0; r < rows.size(); r++) {
      Object row = rows.get(r);
      int length = Array.getLength(row);
      Object copy = Array.newInstance(row.getClass().getComponentType(), length);
      System.arraycopy(row, 0, copy, 0, length);
      Array.set(array, r, copy);
    }
    int[] out = new int[rows.size()];
    // Not a class index: an entry the method leaves untouched shows as a mismatch.
    Arrays.fill(out, -1);
    call(batch, new Object[] {array, out});
    return out;
  }

  /** The input the float model must see for {@code probe}: the probe after conversion. */
  float[] modelInput(float[] probe) {
    if (kind != InputKind.INT) {
      return probe;
    }
    float[] x = new float[probe.length];
    for (int f = 0; f < x.length; f++) {
      x[f] = (float) toInt(probe[f], f);
    }
    return x;
  }

  /** What the float model must see for an int input: each value converted to float. */
  static float[] modelInput(int[] x) {
    float[] v = new float[x.length];
    for (int f = 0; f < v.length; f++) {
      v[f] = x[f];
    }
    return v;
  }

  int classify(float[] probe) {
    return (Integer) call(classify, named ? spread(probe) : new Object[] {array(probe)});
  }

  /** Calls an int classifier with exactly these ints. */
  int classifyInts(int[] x) {
    requireKind(InputKind.INT);
    return classifyArray(x.clone(), x.length);
  }

  /** Classifies a double input; only for a classifier that takes doubles. */
  int classifyDouble(double[] x) {
    requireKind(InputKind.DOUBLE);
    return classifyArray(x.clone(), x.length);
  }

  private void requireKind(InputKind wanted) {
    if (kind != wanted) {
      throw new IllegalStateException("the classifier takes " + kind.optionName() + " inputs");
    }
  }

  /** Passes a primitive array as it is, or spread into one argument per feature. */
  private int classifyArray(Object values, int length) {
    Object[] args;
    if (named) {
      args = new Object[length];
      for (int f = 0; f < length; f++) {
        args[f] = Array.get(values, f);
      }
    } else {
      args = new Object[] {values};
    }
    return (Integer) call(classify, args);
  }

  /** The class frequencies {@code classProbabilities} writes for {@code probe}. */
  float[] probabilities(float[] probe) {
    Object[] inputs = named ? spread(probe) : new Object[] {array(probe)};
    Object[] args = Arrays.copyOf(inputs, inputs.length + 1);
    float[] out = new float[classCount];
    // A value the method must overwrite, so "left untouched" is caught.
    Arrays.fill(out, Float.NaN);
    args[inputs.length] = out;
    call(probabilities, args);
    return out;
  }

  private static Object call(Method method, Object[] args) {
    try {
      return method.invoke(null, args);
    } catch (InvocationTargetException e) {
      Throwable cause = e.getCause();
      throw cause instanceof RuntimeException r ? r : new IllegalStateException(cause);
    } catch (IllegalAccessException e) {
      throw new IllegalStateException(e);
    }
  }

  private Object array(float[] probe) {
    return switch (kind) {
      case FLOAT -> probe.clone();
      case DOUBLE -> {
        double[] d = new double[probe.length];
        for (int f = 0; f < d.length; f++) {
          d[f] = probe[f];
        }
        yield d;
      }
      case INT -> {
        int[] n = new int[probe.length];
        for (int f = 0; f < n.length; f++) {
          n[f] = toInt(probe[f], f);
        }
        yield n;
      }
    };
  }

  private Object[] spread(float[] probe) {
    Object[] args = new Object[probe.length];
    for (int f = 0; f < args.length; f++) {
      args[f] = switch (kind) {
        case FLOAT -> probe[f];
        case DOUBLE -> (double) probe[f];
        case INT -> toInt(probe[f], f);
      };
    }
    return args;
  }

  /**
   * Java's float-to-int conversion (JLS §5.1.3): NaN to 0, saturating at the int range; but a
   * missing category to -1, which int classifiers read as missing.
   */
  private int toInt(float v, int feature) {
    if (Float.isNaN(v) && categorical != null && categorical[feature]) {
      return -1;
    }
    return (int) v;
  }
}
