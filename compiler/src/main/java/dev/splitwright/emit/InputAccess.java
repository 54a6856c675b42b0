package dev.splitwright.emit;

import com.palantir.javapoet.ArrayTypeName;
import com.palantir.javapoet.MethodSpec;
import com.palantir.javapoet.NameAllocator;
import com.palantir.javapoet.ParameterSpec;
import com.palantir.javapoet.TypeName;
import dev.splitwright.data.Schema;
import java.util.ArrayList;
import java.util.List;

/**
 * How emitted code reads feature {@code f}: {@code x[f]} from one array parameter, or a named
 * parameter per feature. Shared by every layout so their signatures agree.
 */
final class InputAccess {
  private final InputKind kind;
  private final List<String> parameterNames;

  private InputAccess(InputKind kind, List<String> parameterNames) {
    this.kind = kind;
    this.parameterNames = parameterNames;
  }

  /**
   * Names a parameter must not take: the other parameters and locals of emitted methods, and
   * restricted identifiers (JLS §3.9) that are legal names but confusing ones.
   */
  private static final List<String> RESERVED = List.of("x", "out", "leaf", "node", "left",
      "i", "j", "c", "v", "at", "var", "yield", "record", "sealed", "permits");
  private static final String RESERVED_TAG = "reserved:";

  static InputAccess of(Schema schema, EmitOptions options) {
    if (!options.namedArgs()) {
      return new InputAccess(options.inputKind(), List.of());
    }
    if (schema.featureCount() > EmitOptions.MAX_NAMED_ARGS) {
      throw new EmitLimitException("named-args", "named arguments need at most "
          + EmitOptions.MAX_NAMED_ARGS + " features, but there are " + schema.featureCount(),
          "pass the features as an array (leave out --named-args)");
    }
    NameAllocator names = new NameAllocator();
    for (String reserved : RESERVED) {
      names.newName(reserved, RESERVED_TAG + reserved);
    }
    List<String> params = new ArrayList<>();
    for (int f = 0; f < schema.featureCount(); f++) {
      params.add(Identifiers.parameter(names, schema.feature(f).name(), f));
    }
    return new InputAccess(options.inputKind(), List.copyOf(params));
  }

  boolean named() {
    return !parameterNames.isEmpty();
  }

  InputKind kind() {
    return kind;
  }

  TypeName elementType() {
    return switch (kind) {
      case FLOAT -> TypeName.FLOAT;
      case DOUBLE -> TypeName.DOUBLE;
      case INT -> TypeName.INT;
    };
  }

  /** The expression that reads feature {@code f}. */
  String read(int feature) {
    return named() ? parameterNames.get(feature) : "x[" + feature + "]";
  }

  /** Adds the input parameters to a method. */
  void addParameters(MethodSpec.Builder method) {
    if (named()) {
      for (String name : parameterNames) {
        method.addParameter(ParameterSpec.builder(elementType(), name).build());
      }
    } else {
      method.addParameter(ArrayTypeName.of(elementType()), "x");
    }
  }

  /** An array of the inputs: {@code x}, or {@code new float[] {a, b}} for named parameters. */
  String asArray() {
    if (!named()) {
      return "x";
    }
    return "new " + elementType() + "[] {" + String.join(", ", parameterNames) + "}";
  }

  /** The argument list that passes the inputs on to a helper method. */
  String arguments() {
    return named() ? String.join(", ", parameterNames) : "x";
  }

  List<String> parameterNames() {
    return parameterNames;
  }

  /** Upper bound of the bytecode bytes of a call that passes the inputs on and returns the int. */
  int callBytes() {
    int loads = named() ? parameterNames.size() * (kind == InputKind.DOUBLE ? 4 : 2) : 1;
    return loads + 3 + 1;
  }
}
