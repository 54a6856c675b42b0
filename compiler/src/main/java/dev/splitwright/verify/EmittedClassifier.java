package dev.splitwright.verify;

import dev.splitwright.emit.EmitOptions;
import dev.splitwright.emit.InputKind;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Method;
import java.util.Arrays;

/**
 * Calls a loaded classifier's {@code classify} whatever its signature, from a float probe. For
 * {@code int} and {@code double} inputs it also says what float input the model must be asked
 * about, so the comparison stays exact: the model sees what the device's value converts to.
 */
final class EmittedClassifier {
  private final Method classify;
  private final InputKind kind;
  private final boolean named;

  private EmittedClassifier(Method classify, InputKind kind, boolean named) {
    this.classify = classify;
    this.kind = kind;
    this.named = named;
  }

  static EmittedClassifier of(Class<?> type, EmitOptions options, int featureCount)
      throws NoSuchMethodException {
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
    return new EmittedClassifier(type.getMethod("classify", parameters), options.inputKind(),
        options.namedArgs());
  }

  /** The input the float model must see for {@code probe}: the probe after conversion. */
  float[] modelInput(float[] probe) {
    if (kind != InputKind.INT) {
      return probe;
    }
    float[] x = new float[probe.length];
    for (int f = 0; f < x.length; f++) {
      x[f] = (float) toInt(probe[f]);
    }
    return x;
  }

  int classify(float[] probe) {
    Object[] args = named ? spread(probe) : new Object[] {array(probe)};
    try {
      return (Integer) classify.invoke(null, args);
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
          n[f] = toInt(probe[f]);
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
        case INT -> toInt(probe[f]);
      };
    }
    return args;
  }

  /** Java's float-to-int conversion (JLS §5.1.3): NaN to 0, saturating at the int range. */
  private static int toInt(float v) {
    return (int) v;
  }
}
