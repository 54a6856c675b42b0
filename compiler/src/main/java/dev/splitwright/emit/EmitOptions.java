package dev.splitwright.emit;

import java.util.Objects;
import javax.lang.model.SourceVersion;

/**
 * Where and how to emit: package and class name, layout, input type, extras and the per-method
 * bytecode cap. Build with {@link #builder(String, String)}.
 */
public record EmitOptions(
    String packageName,
    String className,
    Layout layout,
    InputKind inputKind,
    boolean namedArgs,
    boolean probabilities,
    int maxMethodBytes,
    boolean bare) {

  /** HotSpot's HugeMethodLimit: larger methods are never JIT-compiled (see HotSpotJitTest). */
  public static final int DEFAULT_MAX_METHOD_BYTES = 8000;

  /** The JVM's hard limit is 65,535 bytes of code per method (JVM Specification §4.7.3). */
  public static final int JVM_MAX_METHOD_BYTES = 65535;

  /** The most features that {@code --named-args} accepts. */
  public static final int MAX_NAMED_ARGS = 32;

  public EmitOptions {
    Objects.requireNonNull(packageName, "packageName");
    Objects.requireNonNull(className, "className");
    Objects.requireNonNull(layout, "layout");
    Objects.requireNonNull(inputKind, "inputKind");
    if (!packageName.isEmpty() && !SourceVersion.isName(packageName)) {
      throw new IllegalArgumentException("not a valid Java package name: '" + packageName + "'");
    }
    if (!SourceVersion.isIdentifier(className) || SourceVersion.isKeyword(className)) {
      throw new IllegalArgumentException("not a valid Java class name: '" + className + "'");
    }
    if (maxMethodBytes < 256 || maxMethodBytes > JVM_MAX_METHOD_BYTES) {
      throw new IllegalArgumentException("maxMethodBytes must be between 256 and "
          + JVM_MAX_METHOD_BYTES + ", but it is " + maxMethodBytes);
    }
  }

  /** Starts options for {@code packageName.className} with the defaults. */
  public static Builder builder(String packageName, String className) {
    return new Builder(packageName, className);
  }

  public Builder toBuilder() {
    return new Builder(packageName, className)
        .layout(layout)
        .inputKind(inputKind)
        .namedArgs(namedArgs)
        .probabilities(probabilities)
        .maxMethodBytes(maxMethodBytes)
        .bare(bare);
  }

  /** The binary name of the emitted class. */
  public String qualifiedName() {
    return packageName.isEmpty() ? className : packageName + "." + className;
  }

  /** Collects emit options; {@link #build} validates them. */
  public static final class Builder {
    private final String packageName;
    private final String className;
    private Layout layout = Layout.BRANCHES;
    private InputKind inputKind = InputKind.FLOAT;
    private boolean namedArgs;
    private boolean probabilities;
    private int maxMethodBytes = DEFAULT_MAX_METHOD_BYTES;
    private boolean bare;

    private Builder(String packageName, String className) {
      this.packageName = packageName;
      this.className = className;
    }

    public Builder layout(Layout value) {
      this.layout = Objects.requireNonNull(value, "layout");
      return this;
    }

    public Builder inputKind(InputKind value) {
      this.inputKind = Objects.requireNonNull(value, "inputKind");
      return this;
    }

    public Builder namedArgs(boolean value) {
      this.namedArgs = value;
      return this;
    }

    public Builder probabilities(boolean value) {
      this.probabilities = value;
      return this;
    }

    /**
     * Emits {@code classify} (and {@code classProbabilities}) only: no label and feature-name
     * tables, accessors or constants, for the tightest budgets. The class comment still lists
     * features and classes.
     */
    public Builder bare(boolean value) {
      this.bare = value;
      return this;
    }

    public Builder maxMethodBytes(int value) {
      this.maxMethodBytes = value;
      return this;
    }

    public EmitOptions build() {
      return new EmitOptions(
          packageName, className, layout, inputKind, namedArgs, probabilities, maxMethodBytes,
          bare);
    }
  }
}
